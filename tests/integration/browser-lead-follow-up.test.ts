import crypto from 'node:crypto';
import type { Browser, Page } from 'playwright-core';
import request from 'supertest';
import { AuditEntry, Build, Customer, Lead } from '@/lib/db/models';
import { expectNoSeriousA11yViolations } from '../support/a11y';
import { launchBrowser, staffContext, watchedPage } from '../support/browser';
import { connectTestDatabase, disconnectTestDatabase } from '../support/database';
import { clearRateLimits } from '../support/rate-limits';
import { readRuntime } from '../support/runtime';

// The counter follows a questionnaire lead up in the browser: types a note of the call (Ctrl+Enter), sees
// it in the log with who wrote it, starts an interview from the lead, saves it, and finds the lead marked
// contacted. The lead is sent through the public form; everything made here is removed afterwards.
const { appUrl } = readRuntime();

describe('following a lead up in the browser', () => {
  let browser: Browser;
  let page: Page;
  let leadId = 0;
  const email = `browser-follow-up-${crypto.randomBytes(4).toString('hex')}@example.com`;
  const pageErrors: string[] = [];

  beforeAll(async () => {
    connectTestDatabase();
    await clearRateLimits('lead-'); // other files post leads from this address too
    const sent = await request(appUrl).post('/api/leads').send({
      engine: '5.3',
      use: 'towing',
      idle: 'smooth',
      emissions: 'yes',
      transmission: 'automatic',
      driveline: 'stock',
      exhaust: 'stock',
      budget: '1500-3000',
      name: 'Fixture Browser Lead',
      email,
      consent: true,
    });
    if (sent.status !== 201) throw new Error(`lead fixture answered ${sent.status}: ${JSON.stringify(sent.body)}`);
    leadId = sent.body.id;
    browser = await launchBrowser();
    const context = await staffContext(browser, 'counter');
    page = await watchedPage(context, pageErrors);
  }, 60_000);
  afterAll(async () => {
    await browser?.close();
    const lead = await Lead.findByPk(leadId);
    const customerId = lead?.customerId ?? null;
    await AuditEntry.destroy({ where: { entityType: 'lead', entityId: String(leadId) } });
    await Lead.destroy({ where: { id: leadId } });
    if (customerId) {
      const builds = await Build.findAll({ where: { customerId } });
      await AuditEntry.destroy({ where: { entityType: 'build', entityId: builds.map((b) => String(b.id)) } });
      await Build.destroy({ where: { customerId } });
      await Customer.destroy({ where: { id: customerId } });
    }
    await disconnectTestDatabase();
  });
  afterEach(() => expect(pageErrors).toEqual([]));

  it('logs a note of the call, then starts an interview that marks the lead contacted', async () => {
    await page.goto(`${appUrl}/leads`);
    const card = page.getByRole('article').filter({ has: page.getByRole('heading', { name: /Fixture Browser Lead/ }) });
    await expect(card.textContent()).resolves.toContain('New, not contacted');
    await card.getByLabel(`New note on lead ${leadId}`).click();
    await page.keyboard.type('Rang at 10, left a message; will try after lunch.');
    await page.keyboard.press('ControlOrMeta+Enter');
    await card.getByRole('status').filter({ hasText: 'Note added.' }).waitFor();
    const log = card.getByRole('region', { name: `Notes on lead ${leadId}` });
    await log.getByText('Rang at 10, left a message; will try after lunch.').waitFor();
    await expect(log.textContent()).resolves.toMatch(/UTC/);
    await expectNoSeriousA11yViolations(page);

    await card.getByRole('link', { name: 'Start an interview' }).click();
    await page.waitForURL(/\/interviews\/new\?lead=\d+$/);
    await page.getByRole('heading', { name: 'New interview' }).waitFor();
    await expectNoSeriousA11yViolations(page);
    await page.keyboard.press('Control+Enter');
    await page.waitForURL(/\/advisor\?build=\d+$/);

    const lead = await Lead.findByPk(leadId);
    expect(lead!.status).toBe('contacted');
    const build = await Build.findByPk(Number(new URL(page.url()).searchParams.get('build')));
    expect(lead!.customerId).toBe(build!.customerId);
    await page.goto(`${appUrl}/leads`);
    await expect(card.textContent()).resolves.toContain('Contacted');
    await expectNoSeriousA11yViolations(page);
  }, 90_000);
});
