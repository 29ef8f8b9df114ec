import fs from 'node:fs';
import path from 'node:path';
import type { Browser, BrowserContext } from 'playwright-core';
import { expectNoSeriousA11yViolations } from '../support/a11y';
import { launchBrowser, staffContext } from '../support/browser';
import { readRuntime } from '../support/runtime';

// The manager's Numbers page in a real browser: the table and the state chart for the last 30 days,
// the empty state for a range without quotes, and the field named for a range that cannot be used.
const { appUrl } = readRuntime();
const SHOTS = path.resolve(__dirname, '../../var/test/screenshots');

describe('the Numbers page', () => {
  let browser: Browser;
  let context: BrowserContext;
  beforeAll(async () => {
    browser = await launchBrowser();
    fs.mkdirSync(SHOTS, { recursive: true });
    context = await staffContext(browser, 'manager');
  });
  afterAll(async () => {
    await context?.close();
    await browser?.close();
  });

  it('shows the figures with their units and a chart of quotes by state', async () => {
    const page = await context.newPage();
    await page.goto(`${appUrl}/reports`);
    await page.getByRole('rowheader', { name: 'Net deposits' }).waitFor();
    const row = (label: string) =>
      page.getByRole('row').filter({ has: page.getByRole('rowheader', { name: label, exact: true }) });
    await expect(row('All quotes').textContent()).resolves.toMatch(/\d+ quotes?.*\$[\d,]+\.\d{2}/);
    await expect(row('Sent → deposit paid').textContent()).resolves.toMatch(/[\d.]+ %/);
    await expect(page.locator('canvas').count()).resolves.toBe(1);
    await expect(
      page.getByRole('img', { name: /Bar chart of quotes by state\. Draft: \d+, Sent: \d+/ }).count(),
    ).resolves.toBe(1);
    await expect(page.getByRole('link', { name: 'Numbers' }).count()).resolves.toBeGreaterThan(0);
    await expectNoSeriousA11yViolations(page);
    await page.screenshot({ path: path.join(SHOTS, 'reports-desktop.png'), fullPage: true });
    await page.close();
  });

  it('says so when the range holds no quotes', async () => {
    const page = await context.newPage();
    await page.goto(`${appUrl}/reports?from=2001-01-01&to=2001-01-31`);
    await page.getByText('No quotes in this range yet').waitFor();
    await expectNoSeriousA11yViolations(page);
    await page.close();
  });

  it('names the field when the range cannot be used', async () => {
    const page = await context.newPage();
    await page.goto(`${appUrl}/reports?from=2026-12-05&to=2026-12-01`);
    await page.getByText('That date range cannot be used.').waitFor();
    await expect(page.getByRole('alert').filter({ hasText: 'That date range' }).textContent()).resolves.toContain(
      'from (2026-12-05) must be on or before to',
    );
    await expectNoSeriousA11yViolations(page);
    await page.screenshot({ path: path.join(SHOTS, 'reports-bad-range.png'), fullPage: true });
    await page.close();
  });
});
