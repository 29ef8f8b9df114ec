import crypto from 'node:crypto';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { QueryTypes } from 'sequelize';
import { AuditEntry, Lead, LeadNote, ShopSettings } from '@/lib/db/models';
import { expectNoSeriousA11yViolations } from '../support/a11y';
import { launchBrowser, watchedPage } from '../support/browser';
import { signIn } from '../support/auth';
import { connectTestDatabase, disconnectTestDatabase } from '../support/database';
import { clearRateLimits } from '../support/rate-limits';
import { postTestLead } from '../support/leads';
import { readRuntime } from '../support/runtime';

// Leads that go cold are flagged: a new lead nobody has called or noted for the shop's number of days
// shows "Waiting N days" on the leads list and a count on the staff home page. The counter writes a note
// on one (the flag goes), the manager lowers the limit to one day (a younger lead is flagged). Dates are
// set relative to now; everything made here is removed and the setting put back afterwards.
const { appUrl } = readRuntime();
const tag = crypto.randomBytes(3).toString('hex');
const DAY_MS = 86_400_000;

/** Counted in SQL here, independently of the app's query: new, arrived before the cutoff, no note since. */
async function staleInDatabase(days: number): Promise<number> {
  const cutoff = new Date(Date.now() - days * DAY_MS);
  const [row] = await connectTestDatabase().query<{ n: number }>(
    `SELECT COUNT(*) AS n FROM leads l WHERE l.status = 'new' AND l.created_at < ?
       AND NOT EXISTS (SELECT 1 FROM lead_notes n WHERE n.lead_id = l.id AND n.created_at >= ?)`,
    { replacements: [cutoff, cutoff], type: QueryTypes.SELECT },
  );
  return Number(row.n);
}

describe('stale leads are flagged', () => {
  let browser: Browser;
  let counter: Page;
  let manager: Page;
  let settingsBefore = 2;
  const ids = { old: 0, young: 0 };
  const pageErrors: string[] = [];
  const card = (page: Page, name: string) =>
    page.getByRole('article').filter({ has: page.getByRole('heading', { name: new RegExp(name) }) });

  const postLead = (name: string) => postTestLead(name, `stale-${tag}`);
  async function staffPage(context: BrowserContext): Promise<Page> {
    const page = await watchedPage(context, pageErrors);
    return page;
  }

  beforeAll(async () => {
    const sequelize = connectTestDatabase();
    await clearRateLimits('lead-');
    settingsBefore = (await ShopSettings.findOne({ order: [['id', 'ASC']] }))!.leadStaleDays;
    await ShopSettings.update({ leadStaleDays: 2 }, { where: {} });
    ids.old = await postLead(`Oldfield ${tag}`);
    ids.young = await postLead(`Youngman ${tag}`);
    // Arrived 5 days and 30 hours ago (relative to now, whatever day the suite runs).
    await sequelize.query('UPDATE leads SET created_at = ? WHERE id = ?', {
      replacements: [new Date(Date.now() - 5 * DAY_MS - 3_600_000), ids.old],
    });
    await sequelize.query('UPDATE leads SET created_at = ? WHERE id = ?', {
      replacements: [new Date(Date.now() - 30 * 3_600_000), ids.young],
    });
    browser = await launchBrowser();
    for (const role of ['counter', 'manager'] as const) {
      const [name, value] = (await signIn(role)).split('=');
      const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
      await context.addCookies([{ name, value, url: appUrl }]);
      if (role === 'counter') counter = await staffPage(context);
      else manager = await staffPage(context);
    }
  }, 60_000);
  afterAll(async () => {
    await browser?.close();
    const leadIds = [ids.old, ids.young].filter(Boolean);
    await LeadNote.destroy({ where: { leadId: leadIds } });
    await AuditEntry.destroy({ where: { entityType: 'lead', entityId: leadIds.map(String) } });
    await Lead.destroy({ where: { id: leadIds } });
    await ShopSettings.update({ leadStaleDays: settingsBefore }, { where: {} });
    await clearRateLimits('lead-');
    await disconnectTestDatabase();
  });
  afterEach(() => expect(pageErrors).toEqual([]));

  it('shows the count on the staff home page and “Waiting 5 days” on the untouched lead only', async () => {
    await counter.goto(`${appUrl}/dashboard`);
    const expected = await staleInDatabase(2);
    expect(expected).toBeGreaterThanOrEqual(1);
    const notice = counter.getByText(/waited 2 days or more without contact/);
    await expect(notice.textContent()).resolves.toContain(`${expected} new lead`);
    await counter.getByRole('link', { name: 'Follow them up on Leads' }).click();
    await counter.waitForURL(/\/leads\?status=new$/);
    await counter
      .getByRole('status')
      .getByText(new RegExp(`^${expected} new leads? ha(s|ve) waited 2 days or more without contact$`))
      .waitFor();
    await expect(card(counter, `Oldfield ${tag}`).textContent()).resolves.toContain('Waiting 5 days without contact');
    await expect(card(counter, `Youngman ${tag}`).textContent()).resolves.not.toContain('Waiting');
    await expectNoSeriousA11yViolations(counter);
  }, 60_000);

  it('a note of the call takes the flag away', async () => {
    const old = card(counter, `Oldfield ${tag}`);
    await old.getByLabel(`New note on lead ${ids.old}`).click();
    await counter.keyboard.type('Called, booked in for Thursday to look at the truck.');
    await counter.keyboard.press('ControlOrMeta+Enter');
    await old.getByRole('status').filter({ hasText: 'Note added.' }).waitFor();
    await counter.reload();
    await old.getByText('Called, booked in for Thursday').waitFor();
    await expect(old.textContent()).resolves.not.toContain('Waiting');
    await expectNoSeriousA11yViolations(counter);
  }, 60_000);

  it('the manager sets one day, and the lead from yesterday is flagged', async () => {
    await manager.goto(`${appUrl}/catalogue/settings`);
    const box = manager.getByLabel(/Flag a new lead nobody has contacted after/);
    await box.click();
    await manager.keyboard.press('ControlOrMeta+a');
    await manager.keyboard.type('1');
    await manager.getByRole('button', { name: 'Save settings' }).click();
    await manager.getByText('Settings saved').waitFor();
    expect((await ShopSettings.findOne({ order: [['id', 'ASC']] }))!.leadStaleDays).toBe(1);
    await expectNoSeriousA11yViolations(manager);

    await counter.reload();
    await expect(card(counter, `Youngman ${tag}`).textContent()).resolves.toContain('Waiting 1 day without contact');
    await expect(card(counter, `Oldfield ${tag}`).textContent()).resolves.not.toContain('Waiting');
    const expected = await staleInDatabase(1);
    await counter
      .getByRole('status')
      .getByText(new RegExp(`^${expected} new leads? ha(s|ve) waited 1 day or more without contact$`))
      .waitFor();
    // Out of range is refused with the field named, and nothing changes.
    await box.click();
    await manager.keyboard.press('ControlOrMeta+a');
    await manager.keyboard.type('0');
    await manager.getByRole('button', { name: 'Save settings' }).click();
    await manager.getByText('days before a lead is flagged must be at least 1 days').waitFor();
    await expectNoSeriousA11yViolations(manager);
    expect((await ShopSettings.findOne({ order: [['id', 'ASC']] }))!.leadStaleDays).toBe(1);
  }, 60_000);
});
