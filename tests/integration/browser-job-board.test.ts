import fs from 'node:fs';
import path from 'node:path';
import type { Browser, Page } from 'playwright-core';
import { AuditEntry, Job } from '@/lib/db/models';
import { expectNoSeriousA11yViolations } from '../support/a11y';
import { launchBrowser } from '../support/browser';
import { DEMO_EMAILS, DEMO_PASSWORD, signedInAgent } from '../support/auth';
import { connectTestDatabase, disconnectTestDatabase } from '../support/database';
import { makePaidJob, shopDay } from '../support/job-fixtures';
import { readRuntime } from '../support/runtime';

// A technician takes a freshly paid job from the board: books it for today, moves it into the shop and
// onto the dyno, is stopped at "ready" until the sign-off is typed in, then marks it ready and finds it
// on the board and in the week view. The test pays for its own job and removes the booking afterwards.
const { appUrl } = readRuntime();
const SHOTS = path.resolve(__dirname, '../../var/test/screenshots');

/** Clicks the box, selects what is there and types over it, as a person would. */
async function typeInto(page: Page, scope: ReturnType<Page['getByRole']>, label: string, text: string) {
  await scope.getByLabel(label, { exact: true }).click();
  await page.keyboard.press('ControlOrMeta+a');
  await page.keyboard.press('Backspace');
  await page.keyboard.type(text);
}

async function noSidewaysScroll(page: Page) {
  await expect(
    page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth),
  ).resolves.toBeLessThanOrEqual(0);
}

describe('the job board in the browser', () => {
  let browser: Browser;
  let page: Page;
  let job: { id: number; number: string };
  const pageErrors: string[] = [];
  const progress = () => page.getByRole('region', { name: /^Progress/ });
  const signOff = () => page.getByRole('form', { name: 'Sign-off before first start' });
  const boardRow = () => page.locator(`tr[data-job="${job.number}"]`);

  beforeAll(async () => {
    connectTestDatabase();
    job = await makePaidJob(await signedInAgent('counter'), 'Browser board');
    browser = await launchBrowser();
    fs.mkdirSync(SHOTS, { recursive: true });
    page = await (await browser.newContext({ viewport: { width: 1280, height: 900 } })).newPage();
    page.setDefaultTimeout(10_000);
    page.on('pageerror', (error) => pageErrors.push(error.message));
    await page.goto(`${appUrl}/sign-in?next=/jobs`);
    await page.getByLabel('E-mail').click();
    await page.keyboard.type(DEMO_EMAILS.tech);
    await page.getByLabel('Password').click();
    await page.keyboard.type(DEMO_PASSWORD);
    await page.keyboard.press('Enter');
    await page.getByRole('heading', { name: 'Jobs', exact: true }).waitFor();
  }, 90_000);
  afterAll(async () => {
    await browser?.close();
    const rows = await Job.findAll({ where: { quoteId: job.id } });
    await AuditEntry.destroy({ where: { entityType: 'job', entityId: rows.map((r) => String(r.id)) } });
    await Job.destroy({ where: { quoteId: job.id } });
    await disconnectTestDatabase();
  });
  afterEach(() => expect(pageErrors).toEqual([]));

  it('shows the paid job as not booked yet, its build sheet in words, and books it for today with a bay and a technician', async () => {
    await boardRow().waitFor();
    await expect(boardRow().textContent()).resolves.toContain('Not booked yet');
    await boardRow().getByRole('link', { name: job.number }).click();
    await progress().waitFor();
    await expect(progress().textContent()).resolves.toContain('Not booked yet');
    // The build sheet reads in words: the fixture's truck (truckProfile) is stored as aluminum, truck, active,
    // manifold, full-with-cats, automatic, vacuum and towing; the bench sees sentences, never those codes.
    const engine = page.getByRole('region', { name: 'Engine combination' });
    const values = await engine.locator('dd').allTextContents();
    expect(values).toEqual(
      expect.arrayContaining([
        expect.stringMatching(/^Aluminium heads, /),
        'Truck intake (long runners)',
        'Fitted and working',
        'Cast manifolds (stock) · Full exhaust with catalytic converters',
        'Automatic · 2,000 rpm stall',
        'Vacuum brake booster',
        'Towing and hauling',
      ]),
    );
    const codes = ['aluminum', 'truck', 'active', 'manifold', 'full-with-cats', 'automatic', 'vacuum', 'towing'];
    expect(
      values.filter((v) => codes.some((code) => new RegExp(`(^|[^A-Za-z-])${code}($|[^A-Za-z-])`).test(v))),
    ).toEqual([]);

    await progress().getByLabel('Booked for').fill(shopDay(0));
    await progress().getByLabel('Bay').focus();
    await page.keyboard.press('ArrowDown'); // Not set → Bay 1
    await page.keyboard.press('ArrowDown'); // → Bay 2
    await progress().getByLabel('Technician').selectOption({ label: 'Aurelio Banks' });
    await progress().getByRole('button', { name: 'Book the job' }).click();
    await progress().getByRole('status').filter({ hasText: 'Booking saved.' }).waitFor();
    await progress().getByText('Booked', { exact: true }).waitFor();
    const row = await Job.findOne({ where: { quoteId: job.id } });
    expect(row).toMatchObject({ state: 'booked', bookedFor: shopDay(0), bay: 2 });
    await expectNoSeriousA11yViolations(page);
  }, 60_000);

  it('moves it into the shop and onto the dyno, and will not mark it ready without a sign-off', async () => {
    await progress().getByRole('button', { name: 'Move to: In the shop' }).click();
    await progress().getByText('In the shop', { exact: true }).waitFor();
    await signOff().waitFor(); // the sign-off is taken from here on
    await progress().getByRole('button', { name: 'Move to: On the dyno' }).click();
    await progress().getByText('On the dyno', { exact: true }).waitFor();
    await progress().getByRole('button', { name: 'Move to: Ready to collect' }).click();
    await progress().getByRole('alert').filter({ hasText: 'has no sign-off' }).waitFor();
    expect((await Job.findOne({ where: { quoteId: job.id } }))!.state).toBe('on-dyno');
    await expectNoSeriousA11yViolations(page);
  }, 60_000);

  it('takes the sign-off typed like a person, warns about a tight clearance, and prints it on the sheet', async () => {
    await typeInto(page, signOff(), 'Piston-to-valve, intake (in)', '0.070');
    await typeInto(page, signOff(), 'Piston-to-valve, exhaust (in)', '0.115');
    await typeInto(page, signOff(), 'Spring installed height (in)', '1.800');
    await typeInto(page, signOff(), 'Spring seat pressure (lb)', '135');
    await typeInto(page, signOff(), 'Coil-bind margin (in)', 'x');
    await typeInto(page, signOff(), 'Pushrod length (in)', '7.400');
    await typeInto(page, signOff(), 'Lifter preload (in)', '0.060');
    await signOff().getByLabel('Delete done').focus();
    await page.keyboard.press('Space');
    await typeInto(page, signOff(), 'Tune file and version', 'browser-tune rev 2');
    await signOff().getByRole('button', { name: 'Record the sign-off' }).click();
    // A typo is refused beside its field, and nothing is saved.
    await signOff().getByText('coil-bind margin must be a number (in)').waitFor();
    await typeInto(page, signOff(), 'Coil-bind margin (in)', '0.085');
    await page.keyboard.press('ControlOrMeta+Enter');
    await signOff().getByRole('status').filter({ hasText: 'Sign-off recorded, with warnings' }).waitFor();
    await expect(signOff().textContent()).resolves.toContain('0.070 in is under the usual 0.080 in minimum');

    const sheet = page.getByRole('region', { name: 'Sign-off before first start' });
    await sheet.waitFor();
    await expect(sheet.textContent()).resolves.toContain('browser-tune rev 2');
    await expect(sheet.getByRole('row').filter({ hasText: 'Piston-to-valve, intake' }).textContent()).resolves.toMatch(
      /0\.070 in.*Check/,
    );
    await expect(sheet.getByRole('row').filter({ hasText: 'Coil-bind margin' }).textContent()).resolves.toMatch(
      /0\.085 in.*Within usual/,
    );
    // The sheet prints: the sign-off stays, the form goes.
    await page.emulateMedia({ media: 'print' });
    await expect(sheet.isVisible()).resolves.toBe(true);
    await expect(signOff().isVisible()).resolves.toBe(false);
    await page.emulateMedia({ media: 'screen' });
    await expectNoSeriousA11yViolations(page);
  }, 60_000);

  it('marks it ready and finds it on the board and in the week', async () => {
    await progress().getByRole('button', { name: 'Move to: Ready to collect' }).click();
    await progress().getByText('Ready to collect', { exact: true }).waitFor();
    await page.screenshot({ path: path.join(SHOTS, 'job-sheet-desktop.png'), fullPage: true });

    await page.getByRole('link', { name: 'Jobs', exact: true }).first().click();
    await boardRow().waitFor();
    const text = await boardRow().textContent();
    expect(text).toContain('Ready to collect');
    expect(text).toContain('Aurelio Banks');
    await expectNoSeriousA11yViolations(page);
    await page.screenshot({ path: path.join(SHOTS, 'jobs-board-desktop.png'), fullPage: true });

    await page.getByRole('link', { name: 'Week', exact: true }).click();
    const todayColumn = page.getByRole('listitem').filter({ hasText: '· Today' }).first();
    await todayColumn.getByRole('link', { name: job.number }).waitFor();

    await page.setViewportSize({ width: 390, height: 844 });
    await noSidewaysScroll(page);
    await expectNoSeriousA11yViolations(page);
    await page.screenshot({ path: path.join(SHOTS, 'jobs-week-phone.png'), fullPage: true });
    await page.goto(`${appUrl}/jobs`);
    await boardRow().waitFor();
    await noSidewaysScroll(page);
    await page.goto(`${appUrl}/jobs/${job.id}`);
    await progress().waitFor();
    await noSidewaysScroll(page);
    await expectNoSeriousA11yViolations(page);
    await page.screenshot({ path: path.join(SHOTS, 'job-sheet-phone.png'), fullPage: true });
  }, 60_000);
});
