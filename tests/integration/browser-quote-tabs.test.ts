import type { Browser, BrowserContext } from 'playwright-core';
import { expectNoSeriousA11yViolations } from '../support/a11y';
import { launchBrowser, staffContext } from '../support/browser';
import { readRuntime } from '../support/runtime';

// The quote list's filter tabs say each state in words, the same words as the state column.
const { appUrl } = readRuntime();

describe('quote filter tabs', () => {
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

  it('names every state in words and filters by the one clicked', async () => {
    const page = await context.newPage();
    page.setDefaultTimeout(10_000);
    await page.goto(`${appUrl}/quotes`);
    const tabs = page.getByRole('navigation', { name: 'Filter by status' }).getByRole('link');
    const words = (await tabs.allTextContents()).map((t) => t.trim());
    expect(words).toEqual(expect.arrayContaining(['All', 'Draft', 'Sent', 'Accepted, unpaid', 'Deposit paid']));
    for (const word of words) expect(word).not.toMatch(/^[a-z]+(-[a-z]+)*$/); // no raw codes such as "deposit-paid"

    await tabs.filter({ hasText: 'Deposit paid' }).click();
    await page.waitForURL(/\?status=deposit-paid$/);
    await expect(tabs.filter({ hasText: 'Deposit paid' }).getAttribute('aria-current')).resolves.toBe('page');
    const states = await page.locator('table tbody tr td:nth-child(2)').allTextContents();
    expect(states.length).toBeGreaterThan(0);
    await expectNoSeriousA11yViolations(page);
    await page.close();
  });
});
