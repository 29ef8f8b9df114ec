import fs from 'node:fs';
import path from 'node:path';
import type { Browser } from 'playwright-core';
import { launchBrowser } from '../support/browser';
import { signIn } from '../support/auth';
import { readRuntime } from '../support/runtime';

// From the shortlist to a draft quote in a real browser: "Make a quote" under a cam posts the build
// and the cam and opens the new draft, whose lines and totals are on the staff quote page.
const { appUrl } = readRuntime();
const SHOTS = path.resolve(__dirname, '../../var/test/screenshots');

describe('Make a quote from the shortlist', () => {
  let browser: Browser;
  beforeAll(async () => {
    browser = await launchBrowser();
    fs.mkdirSync(SHOTS, { recursive: true });
  });
  afterAll(() => browser?.close());

  it('opens a new draft for the build and the cam', async () => {
    const [name, value] = (await signIn('counter')).split('=');
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    await context.addCookies([{ name, value, url: appUrl }]);
    const page = await context.newPage();
    await page.goto(`${appUrl}/advisor`);
    await page.getByLabel('Build').selectOption({ index: 1 });
    const firstCam = page.locator('table tbody tr').first().getByRole('button');
    await firstCam.waitFor();
    const camText = (await firstCam.textContent()) ?? '';
    await firstCam.click();
    await Promise.all([page.waitForURL(/\/quotes\/\d+$/), page.getByRole('button', { name: 'Make a quote' }).click()]);
    await page.getByRole('heading', { name: /Quote Q-\d{4}-\d{4}/ }).waitFor();
    await expect(page.getByText('Draft', { exact: true }).first().isVisible()).resolves.toBe(true);
    await expect(page.getByRole('button', { name: 'Send to customer' }).isVisible()).resolves.toBe(true);
    // The cam line names the cam that was opened on the shortlist.
    const sku = camText.trim().split(/\s+/)[0];
    await expect(page.locator('table tbody tr').first().textContent()).resolves.toContain(sku);
    await page.screenshot({ path: path.join(SHOTS, 'quote-draft-desktop.png'), fullPage: true });
    await context.close();
  });
});
