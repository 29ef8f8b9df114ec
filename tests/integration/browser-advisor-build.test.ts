import type { Browser, BrowserContext, Page } from 'playwright-core';
import { expectNoSeriousA11yViolations } from '../support/a11y';
import { launchBrowser, staffContext } from '../support/browser';
import { readRuntime } from '../support/runtime';
import { DEMO } from '../support/demo';

// /advisor?build=… must never show another customer's build: a missing, mistyped or absent build
// number says so and waits for a pick; a real one is preselected and ranked.
const { appUrl } = readRuntime();

describe('which build the shortlist shows', () => {
  let browser: Browser;
  let context: BrowserContext;
  beforeAll(async () => {
    browser = await launchBrowser();
    context = await staffContext(browser, 'counter');
  });
  afterAll(async () => {
    await context?.close();
    await browser?.close();
  });

  async function open(query: string): Promise<Page> {
    const page = await context.newPage();
    page.setDefaultTimeout(10_000);
    await page.goto(`${appUrl}/advisor${query}`);
    await page.getByRole('heading', { name: 'Cam shortlist' }).waitFor();
    return page;
  }

  // Filtered by its word: Next's route announcer is an (empty) alert on every page too.
  const notFound = (page: Page) => page.getByRole('alert').filter({ hasText: 'Not found:' });
  const nothingRanked = async (page: Page) => {
    await expect(page.getByLabel('Build').inputValue()).resolves.toBe('');
    await page.getByText('Pick the customer’s build above').waitFor();
    await expect(page.locator('table').count()).resolves.toBe(0);
  };

  it('says a build number that does not exist was not found, and ranks nothing', async () => {
    const page = await open('?build=99999');
    await expect(notFound(page).textContent()).resolves.toContain('Build 99999 was not found');
    await nothingRanked(page);
    await expectNoSeriousA11yViolations(page);
    await page.close();
  });

  it('says text that is not a build number is not one', async () => {
    const page = await open('?build=abc');
    await expect(notFound(page).textContent()).resolves.toContain('“abc” is not a build number');
    await nothingRanked(page);
    await expectNoSeriousA11yViolations(page);
    await page.close();
  });

  it('asks for a build when none is given, then ranks the one picked', async () => {
    const page = await open('');
    await expect(notFound(page).count()).resolves.toBe(0);
    await nothingRanked(page);
    await page.getByLabel('Build').focus();
    await page.keyboard.press('ArrowDown');
    await page.locator('table tbody tr').first().waitFor();
    expect(await page.locator('table tbody tr').count()).toBeGreaterThanOrEqual(10);
    await expectNoSeriousA11yViolations(page);
    await page.close();
  });

  it('preselects and ranks a build that exists', async () => {
    const page = await open(`?build=${DEMO.builds.okaforStreetTruck}`);
    await expect(page.getByLabel('Build').inputValue()).resolves.toBe(String(DEMO.builds.okaforStreetTruck));
    await page.locator('table tbody tr').first().waitFor();
    await expect(notFound(page).count()).resolves.toBe(0);
    await expectNoSeriousA11yViolations(page);
    await page.close();
  });
});
