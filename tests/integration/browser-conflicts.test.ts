import crypto from 'node:crypto';
import type { Browser, Page } from 'playwright-core';
import request from 'supertest';
import { AuditEntry, Lead, User } from '@/lib/db/models';
import type { QuoteRecord } from '@/lib/quotes/types';
import { expectNoSeriousA11yViolations } from '../support/a11y';
import { signedInAgent } from '../support/auth';
import { launchBrowser, staffContext, watchedPage } from '../support/browser';
import { connectTestDatabase, disconnectTestDatabase } from '../support/database';
import { dayFromToday, makeDraftQuote } from '../support/quote-fixtures';
import { clearRateLimits } from '../support/rate-limits';
import { readRuntime } from '../support/runtime';

// Someone else's save lands between reading and saving (useVersionedSave, 409): the staff list, a lead's
// status and a quote's lines each show the newer record, overwrite nothing, and let the person take theirs
// or keep their own change, which is then saved on top of theirs.
const { appUrl } = readRuntime();
const tag = crypto.randomBytes(3).toString('hex');

describe('a newer save by someone else, in the browser', () => {
  let browser: Browser;
  let page: Page;
  let user: User;
  let leadId = 0;
  const pageErrors: string[] = [];

  beforeAll(async () => {
    connectTestDatabase();
    user = await User.create({
      email: `conflict-${tag}@lobewise.test`,
      name: `Conflict Fixture ${tag}`,
      role: 'counter',
      passwordHash: null,
    });
    await clearRateLimits('lead-');
    const sent = await request(appUrl)
      .post('/api/leads')
      .send({
        engine: '5.3',
        use: 'towing',
        idle: 'smooth',
        emissions: 'yes',
        transmission: 'automatic',
        driveline: 'stock',
        exhaust: 'stock',
        budget: '1500-3000',
        name: `Conflict Lead ${tag}`,
        email: `conflict-lead-${tag}@example.com`,
        consent: true,
      });
    if (sent.status !== 201) throw new Error(`lead fixture answered ${sent.status}: ${JSON.stringify(sent.body)}`);
    leadId = sent.body.id;
    browser = await launchBrowser();
    const context = await staffContext(browser, 'manager');
    page = await watchedPage(context, pageErrors);
  }, 60_000);

  afterAll(async () => {
    await browser?.close();
    await AuditEntry.destroy({ where: { entityType: 'user', entityId: String(user.id) } });
    await user.destroy();
    await AuditEntry.destroy({ where: { entityType: 'lead', entityId: String(leadId) } });
    await Lead.destroy({ where: { id: leadId } });
    await clearRateLimits('lead-');
    await disconnectTestDatabase();
  });
  afterEach(() => expect(pageErrors).toEqual([]));

  it('staff list: keeps my role change on top of their switch-off', async () => {
    await page.goto(`${appUrl}/staff`);
    const role = page.getByLabel(`Role of ${user.name}`);
    await role.waitFor();
    await user.update({ active: false }); // someone else, after this page read the list
    await role.selectOption('tech');
    await page.getByText(`Someone else changed ${user.name}'s account first. Nothing was overwritten.`).waitFor();
    await expectNoSeriousA11yViolations(page);
    await user.reload();
    expect([user.role, user.active]).toEqual(['counter', false]);
    await page.getByRole('button', { name: 'Still make them technician' }).click();
    await page.getByText(`${user.name} is now technician.`).waitFor();
    await user.reload();
    expect([user.role, user.active]).toEqual(['tech', false]);
  });

  it('lead status: takes their status instead of mine', async () => {
    await page.goto(`${appUrl}/leads`);
    const card = page
      .getByRole('article')
      .filter({ has: page.getByRole('heading', { name: new RegExp(`Conflict Lead ${tag}`) }) });
    await card.getByLabel('Status').selectOption('closed');
    await (await Lead.findByPk(leadId))!.update({ status: 'quoted' });
    await card.getByRole('button', { name: 'Save' }).click();
    await card.getByText('They set it to Quoted; yours is Closed.').waitFor();
    await expectNoSeriousA11yViolations(page);
    await card.getByRole('button', { name: 'Take their status' }).click();
    await expect(card.getByLabel('Status').inputValue()).resolves.toBe('quoted');
    await expect(card.getByRole('button', { name: 'Save' }).isDisabled()).resolves.toBe(true);
    expect((await Lead.findByPk(leadId))!.status).toBe('quoted');
  });

  it('quote lines: keeps my lines and saves them on the version with their change', async () => {
    const staff = await signedInAgent('manager');
    const quote = await makeDraftQuote(staff, `conflict lines ${tag}`);
    await page.goto(`${appUrl}/quotes/${quote.id}`);
    await page.getByRole('button', { name: 'Edit lines' }).click();
    await page.getByLabel('Line 1 description').fill(`Renamed here ${tag}`);
    const theirs = await staff
      .patch(`/api/quotes/${quote.id}`)
      .send({ version: quote.version, validUntil: dayFromToday(20) });
    expect(theirs.status).toBe(200);
    await page.getByRole('button', { name: 'Save lines' }).click();
    await page
      .getByText('Someone else saved this quote while you were editing its lines. Nothing was overwritten.')
      .waitFor();
    await expectNoSeriousA11yViolations(page);
    await page.getByRole('button', { name: 'Keep my lines (then save again)' }).click();
    await page.getByRole('button', { name: 'Save lines' }).click();
    await page.getByText('Lines saved; totals updated.').waitFor();
    const stored = (await staff.get(`/api/quotes/${quote.id}`)).body as QuoteRecord;
    expect(stored.lines[0].description).toBe(`Renamed here ${tag}`);
    expect(stored.validUntil?.slice(0, 10)).toBe(dayFromToday(20));
  });
});
