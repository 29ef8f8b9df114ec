import type { Browser, BrowserContext } from 'playwright-core';
import { expectNoSeriousA11yViolations } from '../support/a11y';
import { signedInAgent } from '../support/auth';
import { launchBrowser, staffContext } from '../support/browser';
import { makeDraftQuote } from '../support/quote-fixtures';
import { readRuntime } from '../support/runtime';

// Costs and margins on the quote page (issue 12, item 9): hidden by default, shown by a toggle for someone
// who may see costs and remembered in that browser; someone without costs.read (a technician) gets no
// toggle and no costs in the page at all.
const { appUrl } = readRuntime();

describe('costs on the quote page', () => {
  let browser: Browser;
  let manager: BrowserContext;
  let tech: BrowserContext;

  beforeAll(async () => {
    browser = await launchBrowser();
    [manager, tech] = await Promise.all([staffContext(browser, 'manager'), staffContext(browser, 'tech')]);
  });
  afterAll(async () => {
    await manager?.close();
    await tech?.close();
    await browser?.close();
  });

  it('are hidden until the manager asks, then shown and remembered; a technician has no toggle', async () => {
    const quote = await makeDraftQuote(await signedInAgent('counter'), 'Browser costs');
    const page = await manager.newPage();
    page.setDefaultTimeout(10_000);
    await page.goto(`${appUrl}/quotes/${quote.id}`);
    const toggle = page.getByRole('button', { name: 'Show costs and margins' });
    await toggle.waitFor();
    await expect(page.getByRole('columnheader', { name: 'Unit cost' }).count()).resolves.toBe(0);
    await expect(page.getByText('Goods margin').count()).resolves.toBe(0);
    await expectNoSeriousA11yViolations(page);

    await toggle.click();
    await page.getByRole('columnheader', { name: 'Unit cost' }).waitFor();
    await expect(page.getByText('Goods margin').isVisible()).resolves.toBe(true);
    await expect(
      page.getByRole('button', { name: 'Hide costs and margins' }).getAttribute('aria-pressed'),
    ).resolves.toBe('true');
    await expectNoSeriousA11yViolations(page);
    // Remembered in this browser: the next visit shows them straight away.
    await page.reload();
    await page.getByRole('columnheader', { name: 'Unit cost' }).waitFor();
    await page.getByRole('button', { name: 'Hide costs and margins' }).click();
    await page.getByRole('button', { name: 'Show costs and margins' }).waitFor();
    await expect(page.getByRole('columnheader', { name: 'Unit cost' }).count()).resolves.toBe(0);

    const techPage = await tech.newPage();
    techPage.setDefaultTimeout(10_000);
    await techPage.goto(`${appUrl}/quotes/${quote.id}`);
    await techPage.getByRole('heading', { name: `Quote ${quote.number}` }).waitFor();
    await expect(techPage.getByRole('button', { name: /costs and margins/ }).count()).resolves.toBe(0);
    await expect(techPage.getByRole('columnheader', { name: 'Unit cost' }).count()).resolves.toBe(0);
    await expectNoSeriousA11yViolations(techPage);
    await page.close();
    await techPage.close();
  });
});
