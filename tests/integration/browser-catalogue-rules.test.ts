import crypto from 'node:crypto';
import type { Browser, Page } from 'playwright-core';
import { AuditEntry, NeedRule, NeedRuleItem } from '@/lib/db/models';
import { NEED_RULE_KIND_TEXT, NEED_RULE_LIMITS } from '@/lib/schemas/need-rule';
import { expectNoSeriousA11yViolations } from '../support/a11y';
import { launchBrowser, staffContext, watchedPage } from '../support/browser';
import { connectTestDatabase, disconnectTestDatabase } from '../support/database';
import { DEMO } from '../support/demo';
import { readRuntime } from '../support/runtime';

// A manager adds a need rule through the rule form (the shared field set, yup checks built from
// NEED_RULE_LIMITS): the browser refuses a blank label, an item with neither part nor labour and a quantity
// past the limit in the schema's words, then the rule is saved as typed. It is saved switched off, so no
// other test's prices see it, and removed afterwards.
const { appUrl } = readRuntime();
const label = `Test rule ${crypto.randomBytes(3).toString('hex')}`;

describe('a need rule through the rule form', () => {
  let browser: Browser;
  let page: Page;
  const pageErrors: string[] = [];

  beforeAll(async () => {
    connectTestDatabase();
    browser = await launchBrowser();
    const context = await staffContext(browser, 'manager');
    page = await watchedPage(context, pageErrors);
  }, 60_000);

  afterAll(async () => {
    await browser?.close();
    const made = await NeedRule.findOne({ where: { label } });
    if (made) {
      await NeedRuleItem.destroy({ where: { ruleId: made.id } });
      await AuditEntry.destroy({ where: { entityType: 'need_rule', entityId: String(made.id) } });
      await made.destroy();
    }
    await disconnectTestDatabase();
  });

  it('refuses what the schema refuses before sending, then saves the rule as typed', async () => {
    const before = await NeedRule.count();
    await page.goto(`${appUrl}/catalogue/rules/new`);
    await page.getByLabel(NEED_RULE_KIND_TEXT.lifters.title).check();
    await page.getByLabel('For which vehicles').selectOption('van');
    await page.getByLabel('Active (the advisor and quotes use it)').uncheck();
    await page.getByRole('button', { name: 'Add rule' }).click();
    await page.getByText('Problem: label must not be empty').waitFor();
    await page.getByText('Problem: each item needs a part, a labour operation or both').waitFor();
    await expectNoSeriousA11yViolations(page);
    await expect(NeedRule.count()).resolves.toBe(before); // the browser kept it back

    await page.getByLabel('Label (what staff and customers read)').fill(label);
    await page.getByLabel('Labour', { exact: true }).selectOption(String(DEMO.labor.springInstall));
    const quantity = page.getByLabel('Quantity', { exact: true });
    await quantity.fill(String(NEED_RULE_LIMITS.quantity.max + 1));
    await quantity.blur();
    await page.getByText(`Problem: quantity must be at most ${NEED_RULE_LIMITS.quantity.max}`).waitFor();
    await quantity.fill('1.5');
    await Promise.all([
      page.waitForURL(/\/catalogue\/rules\?saved=1$/),
      page.getByRole('button', { name: 'Add rule' }).click(),
    ]);
    const saved = await NeedRule.findOne({ where: { label } });
    expect(saved && { kind: saved.kind, vehicleClass: saved.vehicleClass, active: saved.active }).toEqual({
      kind: 'lifters',
      vehicleClass: 'van',
      active: false,
    });
    const items = await NeedRuleItem.findAll({ where: { ruleId: saved!.id } });
    expect(items.map((i) => [i.partId, i.laborOperationId, Number(i.quantity)])).toEqual([
      [null, DEMO.labor.springInstall, 1.5],
    ]);
    expect(pageErrors).toEqual([]);
  });
});
