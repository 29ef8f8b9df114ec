import fs from 'node:fs';
import path from 'node:path';
import type { Browser } from 'playwright-core';
import { expectNoSeriousA11yViolations } from '../support/a11y';
import { launchBrowser, staffContext } from '../support/browser';
import { readRuntime } from '../support/runtime';
import { DEMO } from '../support/demo';

// From the shortlist to a draft quote in a real browser: "Make a quote" under a cam posts the build
// and the cam and opens the new draft, whose lines and totals are on the staff quote page. The job
// price the shortlist shows for the cam is the draft's subtotal (before tax), to the cent.
const { appUrl } = readRuntime();
const SHOTS = path.resolve(__dirname, '../../var/test/screenshots');

describe('Make a quote from the shortlist', () => {
  let browser: Browser;
  beforeAll(async () => {
    browser = await launchBrowser();
    fs.mkdirSync(SHOTS, { recursive: true });
  });
  afterAll(() => browser?.close());

  it('opens a new draft for the build and the cam, at the job price the shortlist showed', async () => {
    const context = await staffContext(browser, 'counter');
    const page = await context.newPage();
    // The demo 5.3 L pickup (seeded build 1), preselected as the interview's "see the shortlist" link does.
    await page.goto(`${appUrl}/advisor?build=${DEMO.builds.whitlockTowingTruck}`);
    const firstCam = page.locator('table tbody tr').first().getByRole('button');
    await firstCam.waitFor();
    const camText = (await firstCam.textContent()) ?? '';
    const jobPrice = (
      (await page.locator('table tbody tr').first().locator('[data-job-price]').textContent()) ?? ''
    ).trim();
    expect(jobPrice).toMatch(/^\$\d{1,3}(,\d{3})*\.\d{2}$/);
    await expect(page.getByRole('columnheader', { name: 'Job before tax' }).isVisible()).resolves.toBe(true);
    await firstCam.click();
    // The opened row says the same price, and the cost reason quotes it too.
    await expect(page.getByText(`Job before tax: ${jobPrice}`).isVisible()).resolves.toBe(true);
    await expect(page.getByText(`about ${jobPrice} before tax`).isVisible()).resolves.toBe(true);
    await Promise.all([page.waitForURL(/\/quotes\/\d+$/), page.getByRole('button', { name: 'Make a quote' }).click()]);
    await page.getByRole('heading', { name: /Quote Q-\d{4}-\d{4}/ }).waitFor();
    await expect(page.getByText('Draft', { exact: true }).first().isVisible()).resolves.toBe(true);
    await expect(page.getByRole('button', { name: 'Send to customer' }).isVisible()).resolves.toBe(true);
    // The cam line names the cam that was opened on the shortlist.
    const sku = camText.trim().split(/\s+/)[0];
    await expect(page.locator('table tbody tr').first().textContent()).resolves.toContain(sku);
    // Same number on the quote: its subtotal (before tax), with the truck cam swap among its lines.
    const subtotal = page.locator('dt', { hasText: /^Subtotal$/ }).locator('xpath=following-sibling::dd[1]');
    await expect(subtotal.textContent()).resolves.toBe(jobPrice);
    await expect(
      page.getByText('Cam swap, truck (front of engine, lifters inspected)').first().isVisible(),
    ).resolves.toBe(true);
    await expectNoSeriousA11yViolations(page);
    await page.screenshot({ path: path.join(SHOTS, 'quote-draft-desktop.png'), fullPage: true });
    await context.close();
  });
});
