import type { Browser, BrowserContext } from 'playwright-core';
import { expectNoSeriousA11yViolations } from '../support/a11y';
import { launchBrowser, staffContext, watchedPage } from '../support/browser';
import { readRuntime } from '../support/runtime';

// The staff home and the catalogue's home open the next page through one grid of link cards
// (components/ui/link-cards.tsx): a manager goes from the home to the catalogue to the prices, by the cards.
const { appUrl } = readRuntime();

describe('link cards on the staff home and the catalogue', () => {
  let browser: Browser;
  let context: BrowserContext;
  const errors: string[] = [];
  beforeAll(async () => {
    browser = await launchBrowser();
    context = await staffContext(browser, 'manager');
  });
  afterAll(async () => {
    await context?.close();
    await browser?.close();
  });
  afterEach(() => expect(errors).toEqual([]));

  it('a manager follows the cards from the home to the catalogue to the prices and deposit', async () => {
    const page = await watchedPage(context, errors);
    await page.goto(`${appUrl}/dashboard`);
    const catalogue = page.getByRole('main').getByRole('link', { name: /^Catalogue/ });
    await expect(catalogue.textContent()).resolves.toContain('Cams, parts, labour operations');
    await expectNoSeriousA11yViolations(page);
    await catalogue.click();
    await page.waitForURL(`${appUrl}/catalogue`);
    await page.getByRole('heading', { name: 'Catalogue', level: 1 }).waitFor();
    // Managers see the cards only they may open, each with its line of explanation.
    const prices = page.getByRole('main').getByRole('link', { name: /^Prices and deposit/ });
    await expect(prices.textContent()).resolves.toContain('Labour rate, tax rate and the deposit policy.');
    await expect(
      page
        .getByRole('main')
        .getByRole('link', { name: /^Import a spreadsheet/ })
        .count(),
    ).resolves.toBe(1);
    await expectNoSeriousA11yViolations(page);
    await prices.click();
    await page.waitForURL(`${appUrl}/catalogue/settings`);
  }, 60_000);

  it('counter staff see the catalogue cards without the manager-only ones', async () => {
    const counter = await staffContext(browser, 'counter');
    try {
      const page = await watchedPage(counter, errors);
      await page.goto(`${appUrl}/catalogue`);
      await page
        .getByRole('main')
        .getByRole('link', { name: /^Parts/ })
        .waitFor();
      await expect(
        page
          .getByRole('main')
          .getByRole('link', { name: /^Prices and deposit/ })
          .count(),
      ).resolves.toBe(0);
      await page
        .getByRole('main')
        .getByRole('link', { name: /^Parts/ })
        .click();
      await page.waitForURL(`${appUrl}/catalogue/parts`);
    } finally {
      await counter.close();
    }
  }, 60_000);
});
