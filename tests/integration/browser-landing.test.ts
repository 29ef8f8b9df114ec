import fs from 'node:fs';
import path from 'node:path';
import type { Browser } from 'playwright-core';
import { expectNoSeriousA11yViolations } from '../support/a11y';
import { launchBrowser } from '../support/browser';
import { readRuntime } from '../support/runtime';

const { appUrl } = readRuntime();
const SHOTS = path.resolve(__dirname, '../../var/test/screenshots');

describe('landing page in a real browser', () => {
  let browser: Browser;
  beforeAll(async () => {
    browser = await launchBrowser();
    fs.mkdirSync(SHOTS, { recursive: true });
  });
  afterAll(() => browser?.close());

  it('renders the heading, the sign-in link and the shop footer on a phone-sized screen', async () => {
    const page = await browser.newPage({ viewport: { width: 390, height: 844 } });
    const consoleErrors: string[] = [];
    page.on('console', (message) => {
      if (message.type() === 'error') consoleErrors.push(message.text());
    });
    await page.goto(appUrl, { waitUntil: 'load' });
    await expect(page.getByRole('heading', { level: 1 }).textContent()).resolves.toContain('Pick the right cam');
    await expect(page.getByRole('link', { name: 'Staff sign-in' }).first().isVisible()).resolves.toBe(true);
    await expect(page.locator('footer').textContent()).resolves.toContain('Tallgrass');
    // Nothing may overflow sideways on a phone.
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    expect(overflow).toBeLessThanOrEqual(0);
    await expectNoSeriousA11yViolations(page);
    await page.screenshot({ path: path.join(SHOTS, 'landing-phone.png'), fullPage: true });
    expect(consoleErrors).toEqual([]);
    await page.close();
  });

  it('lets a keyboard user reach the skip link first', async () => {
    const page = await browser.newPage({ viewport: { width: 1280, height: 800 } });
    await page.goto(appUrl);
    await page.keyboard.press('Tab');
    await expect(page.evaluate(() => document.activeElement?.textContent)).resolves.toBe('Skip to content');
    await expectNoSeriousA11yViolations(page);
    await page.screenshot({ path: path.join(SHOTS, 'landing-desktop.png') });
    await page.close();
  });
});
