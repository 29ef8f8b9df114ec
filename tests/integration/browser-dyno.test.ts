import fs from 'node:fs';
import path from 'node:path';
import type { Browser, Page } from 'playwright-core';
import { Op } from 'sequelize';
import { AuditEntry, DynoRun } from '@/lib/db/models';
import { expectNoSeriousA11yViolations } from '../support/a11y';
import { launchBrowser } from '../support/browser';
import { DEMO_EMAILS, DEMO_PASSWORD } from '../support/auth';
import { connectTestDatabase, disconnectTestDatabase } from '../support/database';
import { readRuntime } from '../support/runtime';
import { removeDynoRuns } from '../support/dyno-runs';
import { DEMO } from '../support/demo';

// The technician records the before and the after pull on the demo job Q-2026-0102 (quote 2, build 2)
// through the page, typing like a person, in the shop's default units (°F, inHg). Runs made here are deleted afterwards.
const { appUrl } = readRuntime();
const SHOTS = path.resolve(__dirname, '../../var/test/screenshots');
const JOB = { quoteId: DEMO.quotes.okaforDepositPaid, buildId: DEMO.builds.okaforStreetTruck };

// rpm, torque lb·ft. Power by the definition of horsepower, hp = lb·ft × rpm / 5252 (worked by hand):
// before peaks at 5000 rpm: 350 × 5000 / 5252 = 333.2 hp (5500 rpm gives 333.0); torque peak 380 lb·ft at 4000.
const BEFORE_PULL = '3000,352\n3500,371\n4000,380\n4500,372\n5000,350\n5500,318';
// after peaks at 6000 rpm: 348 × 6000 / 5252 = 397.6 hp; torque peak 394 lb·ft at 4500.
const AFTER_PULL = 'rpm,torque\n3000,340\n3500,362\n4000,384\n4500,394\n5000,391\n5500,375\n6000,348';

/** Clicks the box, selects what is there and types over it, as a person would. */
async function typeInto(page: Page, label: string | RegExp, text: string) {
  await page.getByLabel(label, { exact: typeof label === 'string' }).click();
  await page.keyboard.press('ControlOrMeta+a');
  await page.keyboard.press('Backspace');
  if (text) await page.keyboard.type(text);
}

/** Picks a radio choice from the keyboard (Space on the focused choice), as staff do at the bench. */
async function choose(page: Page, label: string) {
  await page.getByLabel(label, { exact: true }).focus();
  await page.keyboard.press('Space');
  await expect(page.getByLabel(label, { exact: true }).isChecked()).resolves.toBe(true);
}

async function signInAsTechnician(page: Page) {
  await page.goto(`${appUrl}/sign-in?next=/jobs`);
  await page.getByLabel('E-mail').click();
  await page.keyboard.type(DEMO_EMAILS.tech);
  await page.getByLabel('Password').click();
  await page.keyboard.type(DEMO_PASSWORD);
  await page.keyboard.press('Enter');
  await page.getByRole('heading', { name: 'Jobs', exact: true }).waitFor();
}

describe('dyno runs through the job page', () => {
  let browser: Browser;
  let page: Page;
  let firstNewId = 0;
  // Script errors in the page (the old form threw "e.trim is not a function" on every keystroke).
  const pageErrors: string[] = [];
  const form = () => page.getByRole('form', { name: 'Record a dyno run' });
  const runRows = () =>
    page
      .getByRole('table')
      .filter({ has: page.getByText('Recorded dyno runs') })
      .locator('tbody tr');
  /** The table reloads after a save; wait for the nth row, then check there are exactly n. */
  async function rowsShown(n: number) {
    await runRows()
      .nth(n - 1)
      .waitFor();
    await expect(runRows().count()).resolves.toBe(n);
  }

  beforeAll(async () => {
    connectTestDatabase();
    firstNewId = ((await DynoRun.max<number, DynoRun>('id')) ?? 0) + 1;
    browser = await launchBrowser();
    fs.mkdirSync(SHOTS, { recursive: true });
    page = await (await browser.newContext({ viewport: { width: 1280, height: 900 } })).newPage();
    page.setDefaultTimeout(10_000);
    page.on('pageerror', (error) => pageErrors.push(error.message));
    await signInAsTechnician(page);
  });
  afterAll(async () => {
    await browser?.close();
    const ids = (
      await DynoRun.findAll({ where: { buildId: JOB.buildId, id: { [Op.gte]: firstNewId } }, attributes: ['id'] })
    ).map((r) => r.id);
    await removeDynoRuns(ids);
    await AuditEntry.destroy({ where: { entityType: 'dyno-run', entityId: { [Op.in]: ids.map(String) } } });
    await disconnectTestDatabase();
  });
  afterEach(() => expect(pageErrors).toEqual([]));

  it('asks only for what the correction needs, and clears "required" as soon as a box is filled', async () => {
    await page.getByRole('link', { name: 'Q-2026-0102' }).click();
    await form().waitFor();
    await form().getByLabel('Peak figures only').check();
    await form().getByRole('button', { name: 'Record run' }).click();
    await form().getByText('air temperature is required for SAE J1349 (°F)').waitFor();
    await form().getByText('barometric pressure is required for SAE J1349 (inHg)').waitFor();

    await typeInto(page, 'Air temperature', '68');
    await page.keyboard.press('Tab');
    await form().getByText('air temperature is required', { exact: false }).waitFor({ state: 'detached' });
    await expect(form().getByText('barometric pressure is required', { exact: false }).count()).resolves.toBe(1);

    // DIN 70020 uses temperature and total pressure only; with no correction nothing about the air is needed.
    await form().getByLabel('Correction to standard air').selectOption('din-70020');
    await form().getByText('relative humidity is required', { exact: false }).waitFor({ state: 'detached' });
    await expect(form().getByText('barometric pressure is required for DIN 70020 (inHg)').count()).resolves.toBe(1);
    await form().getByLabel('Correction to standard air').selectOption('none');
    await form().getByText('barometric pressure is required', { exact: false }).waitFor({ state: 'detached' });
    await expectNoSeriousA11yViolations(page);
    await typeInto(page, 'Air temperature', '');
  }, 90_000);

  it('saves the before and the after pull typed in °F and inHg, stores SI, and draws the before/after chart', async () => {
    await form().getByLabel('Correction to standard air').selectOption('sae-j1349');
    // The demo shop keeps the default setting: air typed and shown in °F and inHg.
    await form().getByText('In °F and inHg, the shop’s setting').waitFor();
    await form().getByLabel('The pull: rpm, torque').check();

    await form().getByLabel('Pull', { exact: true }).selectOption('before');
    await typeInto(page, 'Air temperature', '77');
    await typeInto(page, 'Barometric pressure', '29.53');
    await typeInto(page, 'Relative humidity', '40');
    await typeInto(page, /^Pull points/, BEFORE_PULL);
    await typeInto(page, 'Notes', 'Baseline on the stock cam');
    await form().getByRole('button', { name: 'Record run' }).click();
    await form().getByRole('status').filter({ hasText: 'Run recorded.' }).waitFor();
    await rowsShown(1);

    await form().getByLabel('Pull', { exact: true }).selectOption('after');
    // The air carries over from the last run; this day is cooler and the glass higher.
    await expect(form().getByLabel('Air temperature').inputValue()).resolves.toBe('77');
    await typeInto(page, 'Air temperature', '59');
    await typeInto(page, 'Barometric pressure', '30.12');
    await typeInto(page, 'Relative humidity', '55');
    await typeInto(page, /^Pull points/, AFTER_PULL);
    await page.keyboard.press('ControlOrMeta+Enter');
    await form().getByRole('status').filter({ hasText: 'Run recorded.' }).waitFor();
    await rowsShown(2);

    const [before, after] = await runRows().allTextContents();
    expect(before).toMatch(/^Before/);
    expect(before).toContain('77 °F · 29.53 inHg · 40 %');
    expect(before).toContain('333.2 hp @ 5000 rpm');
    expect(before).toContain('380.0 lb·ft @ 4000 rpm');
    expect(before).toMatch(/SAE J1349 × \d\.\d{4}/);
    expect(after).toMatch(/^After/);
    expect(after).toContain('59 °F · 30.12 inHg · 55 %');
    expect(after).toContain('397.6 hp @ 6000 rpm');
    expect(after).toContain('394.0 lb·ft @ 4500 rpm');

    // Stored in SI whatever the screen shows: 77 °F = 25 °C; 29.53 inHg × 3.386389 kPa/inHg = 100.0 kPa.
    const stored = await DynoRun.findAll({
      where: { buildId: JOB.buildId, id: { [Op.gte]: firstNewId }, curve: { [Op.ne]: null } },
      order: [['id', 'ASC']],
    });
    expect(stored.map((r) => r.phase)).toEqual(['before', 'after']);
    expect(stored[0].airTempC).toBeCloseTo(25, 6);
    expect(stored[0].baroKpa).toBeCloseTo(100.0, 1);
    expect(stored[1].airTempC).toBeCloseTo(15, 6);
    expect(stored[1].baroKpa).toBeCloseTo(102.0, 1);
    expect(stored[1].humidityPct).toBe(55);

    const chart = page.getByRole('img', { name: /the before pull \(solid grey\) and 1 after pull/ });
    await chart.waitFor();
    // Chart.js has painted the canvas: some pixels are not transparent.
    const painted = await chart.locator('canvas').evaluate((canvas: HTMLCanvasElement) => {
      const { data } = canvas.getContext('2d')!.getImageData(0, 0, canvas.width, canvas.height);
      let n = 0;
      for (let i = 3; i < data.length; i += 4) if (data[i] > 0) n++;
      return n;
    });
    expect(painted).toBeGreaterThan(1000);
    await expectNoSeriousA11yViolations(page);
    await page.screenshot({ path: path.join(SHOTS, 'job-dyno-desktop.png'), fullPage: true });
  }, 90_000);

  it('records peak figures with no correction and no air readings', async () => {
    await form().getByLabel('Correction to standard air').selectOption('none');
    await choose(page, 'Peak figures only');
    await form().getByLabel('Peak power', { exact: true }).waitFor();
    for (const label of ['Air temperature', 'Barometric pressure', 'Relative humidity'])
      await typeInto(page, label, '');
    await typeInto(page, 'Peak power', '401.5');
    await typeInto(page, 'rpm at peak power', '6000');
    await typeInto(page, 'Peak torque', '396');
    await typeInto(page, 'rpm at peak torque', '4500');
    await form().getByRole('button', { name: 'Record run' }).click();
    await form().getByRole('status').filter({ hasText: 'Run recorded.' }).waitFor();
    await rowsShown(3);
    const last = (await runRows().allTextContents())[2];
    expect(last).toContain('401.5 hp @ 6000 rpm');
    expect(last).toContain('none × 1.0000');
    const stored = await DynoRun.findOne({
      where: { buildId: JOB.buildId, id: { [Op.gte]: firstNewId }, peakHp: 401.5 },
    });
    expect(stored).toMatchObject({ correctionStandard: 'none', airTempC: null, baroKpa: null, humidityPct: null });
    await expectNoSeriousA11yViolations(page);
  }, 90_000);

  it('loads a pull from a CSV file, names the line of a problem, and offers the template', async () => {
    await choose(page, 'The pull: rpm, torque');
    const file = form().getByLabel('Or load a CSV file');
    await file.setInputFiles({ name: 'sheet.pdf', mimeType: 'application/pdf', buffer: Buffer.from('%PDF-1.4') });
    await form().getByText('sheet.pdf is not a CSV file').waitFor();
    // 15,000 lines of 9 bytes: 135,000 bytes.
    await file.setInputFiles({
      name: 'big.csv',
      mimeType: 'text/csv',
      buffer: Buffer.from('3000,300\n'.repeat(15_000)),
    });
    await form().getByText('big.csv is 135 kB; a pull’s CSV is at most 100 kB').waitFor();

    // Line 1 is the header, line 3 is blank; rpm falls on line 5 and line 6 is not a number pair.
    const pull = 'rpm,torque\n3000,300\n\n3500,310\n3400,305\n4000;x\n';
    await file.setInputFiles({ name: 'pull.csv', mimeType: 'text/csv', buffer: Buffer.from(pull) });
    await form().getByText('line 6: expected two numbers').waitFor();
    // The same file as the server read it (POST /api/dyno-runs/pull-csv): the rows and columns at fault.
    await expect(page.locator('#dyno-curveFile-error').textContent()).resolves.toContain(
      'pull.csv: row 5, column rpm: rpm must rise from point to point (3400 after 3500); row 6, column rpm: expected a number (got "4000;x")',
    );
    await expect(
      form()
        .getByLabel(/^Pull points/)
        .inputValue(),
    ).resolves.toBe(pull);
    await typeInto(page, /^Pull points/, 'rpm,torque\n3000,300\n\n3500,310\n3400,305');
    await form().getByText('line 5: rpm must rise from point to point (3400 after 3500)').waitFor();

    const [download] = await Promise.all([
      page.waitForEvent('download'),
      form().getByRole('button', { name: 'Download the template (.csv)' }).click(),
    ]);
    expect(download.suggestedFilename()).toBe('dyno-pull-template.csv');
    const template = fs.readFileSync((await download.path())!, 'utf8');
    expect(template.split('\n')[0]).toBe('rpm,torque_lbft');
    // The template, pasted back, is a valid pull.
    await typeInto(page, /^Pull points/, template.trim());
    await page.locator('#dyno-curveCsv-error').waitFor({ state: 'detached' });
    // A good file passes the server's check and fills the box, leaving no problem under the file.
    const good = 'rpm,torque_lbft\n3000,300\n3500,310\n4000,318\n';
    await file.setInputFiles({ name: 'good.csv', mimeType: 'text/csv', buffer: Buffer.from(good) });
    await page.waitForFunction(
      (text) => (document.getElementById('dyno-curveCsv') as HTMLTextAreaElement | null)?.value === text,
      good,
    );
    await expect(page.locator('#dyno-curveFile-error').count()).resolves.toBe(0);
    await expectNoSeriousA11yViolations(page);
  }, 90_000);

  it('prints the job sheet without the app around it or the form', async () => {
    await page.emulateMedia({ media: 'print' });
    await expect(page.locator('body > header').isVisible()).resolves.toBe(false);
    await expect(form().isVisible()).resolves.toBe(false);
    await expect(page.getByRole('button', { name: 'Print the job sheet' }).isVisible()).resolves.toBe(false);
    await expect(page.getByRole('heading', { name: 'Build sheet' }).isVisible()).resolves.toBe(true);
    await expect(page.getByRole('img', { name: /before pull/ }).isVisible()).resolves.toBe(true);
    await page.pdf({ path: path.join(SHOTS, 'job-sheet.pdf') });
    await page.emulateMedia({ media: 'screen' });
    await expectNoSeriousA11yViolations(page);
  }, 90_000);
});
