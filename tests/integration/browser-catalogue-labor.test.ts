import crypto from 'node:crypto';
import type { Browser, Page } from 'playwright-core';
import { AuditEntry, LaborOperation } from '@/lib/db/models';
import { LABOR_LIMITS } from '@/lib/schemas/labor';
import { expectNoSeriousA11yViolations } from '../support/a11y';
import { launchBrowser, staffContext, watchedPage } from '../support/browser';
import { connectTestDatabase, disconnectTestDatabase } from '../support/database';
import { readRuntime } from '../support/runtime';

// The catalogue's record form (shared field set, yup checks built from LABOR_LIMITS, versioned save): a
// manager adds a labour operation, is stopped in the browser by an out-of-range figure, saves it, then edits
// it while someone else's save lands first and sees both versions instead of overwriting theirs.
const { appUrl } = readRuntime();
const code = `T-${crypto.randomBytes(3).toString('hex').toUpperCase()}`;

describe('a labour operation through the catalogue form', () => {
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
    const made = await LaborOperation.findOne({ where: { code } });
    if (made) {
      await AuditEntry.destroy({ where: { entityType: 'labor', entityId: String(made.id) } });
      await made.destroy();
    }
    await disconnectTestDatabase();
  });

  it('checks the hours against the schema’s limit before sending, saves, and shows a newer save beside mine', async () => {
    await page.goto(`${appUrl}/catalogue/labor/new`);
    await page.getByLabel('Code').fill(code);
    await page.getByLabel('Name').fill('Test operation for the form');
    const hours = page.getByLabel('Hours');
    await hours.fill(String(LABOR_LIMITS.hours.max + 1));
    await hours.blur();
    await page.getByText(`Problem: hours must be at most ${LABOR_LIMITS.hours.max} h`).waitFor();
    await expect(hours.getAttribute('aria-invalid')).resolves.toBe('true');
    await expectNoSeriousA11yViolations(page);
    await page.getByRole('button', { name: 'Add labour operation' }).click();
    await expect(LaborOperation.count({ where: { code } })).resolves.toBe(0); // the browser kept it back

    await hours.fill('1.25');
    await page.getByText(`Problem: hours must be at most ${LABOR_LIMITS.hours.max} h`).waitFor({ state: 'detached' });
    await Promise.all([
      page.waitForURL(/\/catalogue\/labor\?saved=1$/),
      page.getByRole('button', { name: 'Add labour operation' }).click(),
    ]);
    const saved = await LaborOperation.findOne({ where: { code } });
    expect(Number(saved?.hours)).toBeCloseTo(1.25);

    await page.goto(`${appUrl}/catalogue/labor/${saved!.id}/edit`);
    await page.getByLabel('Hours').fill('2');
    // Someone else saves first (the model bumps the version), then this form saves on the version it read.
    await saved!.update({ hours: 3 });
    await page.getByRole('button', { name: 'Save changes' }).click();
    await page
      .getByText('Someone else saved this record while you were editing it. Nothing has been overwritten.')
      .waitFor();
    await expectNoSeriousA11yViolations(page);
    expect(Number((await LaborOperation.findByPk(saved!.id))?.hours)).toBeCloseTo(3);
    await page.getByRole('button', { name: 'Keep my values (then save again)' }).click();
    await Promise.all([
      page.waitForURL(/\/catalogue\/labor\?saved=1$/),
      page.getByRole('button', { name: 'Save changes' }).click(),
    ]);
    expect(Number((await LaborOperation.findByPk(saved!.id))?.hours)).toBeCloseTo(2);
    expect(pageErrors).toEqual([]);
  });
});
