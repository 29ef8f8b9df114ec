import type { Browser, BrowserContext } from 'playwright-core';
import { signedInAgent } from '../support/auth';
import { expectNoSeriousA11yViolations } from '../support/a11y';
import { launchBrowser, staffContext, watchedPage } from '../support/browser';
import { makeDraftQuote } from '../support/quote-fixtures';
import { readRuntime } from '../support/runtime';
import type { QuoteRecord } from '@/lib/quotes/types';

// A counter discount above the shop's limit (5 % in the demo settings) in the browser: the counter user types
// it and saves, the quote says it waits for a manager and cannot be sent; a manager approves it on the same
// page and sends it.
const { appUrl } = readRuntime();

describe('approving a counter discount in the browser', () => {
  let browser: Browser;
  let counter: BrowserContext;
  let manager: BrowserContext;

  beforeAll(async () => {
    browser = await launchBrowser();
    [counter, manager] = await Promise.all([staffContext(browser, 'counter'), staffContext(browser, 'manager')]);
  });
  afterAll(async () => {
    await counter?.close();
    await manager?.close();
    await browser?.close();
  });

  it('a counter user saves a big discount and sees the banner; a manager approves it and sends the quote', async () => {
    const agent = await signedInAgent('counter');
    const draft = (await agent.get(`/api/quotes/${(await makeDraftQuote(agent, 'Browser discount')).id}`))
      .body as QuoteRecord;
    // All of it off the dearest line: about 8 % of the job, which that line can carry.
    const dearest = draft.lines.reduce((best, l, i) => (l.totalCents > draft.lines[best].totalCents ? i : best), 0);
    const gross = draft.lines.reduce((s, l) => s + l.totalCents, 0);
    const discountCents = Math.ceil((gross * 800) / 10_000);
    expect(discountCents).toBeLessThanOrEqual(draft.lines[dearest].totalCents);

    const errors: string[] = [];
    const page = await watchedPage(counter, errors);
    await page.goto(`${appUrl}/quotes/${draft.id}`);
    await page.getByRole('button', { name: 'Edit lines' }).click();
    await page.getByLabel(`Line ${dearest + 1} discount in dollars`).fill((discountCents / 100).toFixed(2));
    await page.getByRole('button', { name: 'Save lines' }).click();
    await page.getByText('Lines saved; totals updated.').waitFor();
    const banner = page.getByRole('status').filter({ hasText: 'Waiting for a manager to approve the discount' });
    await banner.waitFor();
    await expect(banner.textContent()).resolves.toMatch(/cannot be sent to the customer/);
    await expect(page.getByRole('button', { name: 'Send to customer' }).isDisabled()).resolves.toBe(true);
    await expect(page.getByRole('button', { name: 'Approve the discount' }).count()).resolves.toBe(0);
    await expectNoSeriousA11yViolations(page);

    // The quote list says which quotes wait for a manager.
    const list = await watchedPage(manager, errors);
    await list.goto(`${appUrl}/quotes?q=${encodeURIComponent(draft.number)}`);
    const row = list.getByRole('row').filter({ has: list.getByRole('link', { name: draft.number, exact: true }) });
    await expect(row.textContent()).resolves.toContain('Discount waits for a manager');
    await expectNoSeriousA11yViolations(list);
    await list.close();

    const managerPage = await watchedPage(manager, errors);
    await managerPage.goto(`${appUrl}/quotes/${draft.id}`);
    await managerPage.getByText('Waiting for a manager to approve the discount').waitFor();
    await expect(managerPage.getByRole('button', { name: 'Send to customer' }).isDisabled()).resolves.toBe(true);
    await expectNoSeriousA11yViolations(managerPage);
    await managerPage.getByRole('button', { name: 'Approve the discount' }).click();
    await managerPage.getByText(/approved; the quote can be sent/).waitFor();
    await managerPage.getByText(/approved by .+ on /).waitFor();
    await expect(managerPage.getByText('Waiting for a manager to approve the discount').count()).resolves.toBe(0);
    const send = managerPage.getByRole('button', { name: 'Send to customer' });
    await expect(send.isEnabled()).resolves.toBe(true);
    await send.click();
    await managerPage.getByText(`Sent to ${draft.customer.email}`).waitFor();
    await expectNoSeriousA11yViolations(managerPage);

    // The counter user's page, loaded again, no longer blocks sending.
    await page.reload();
    await page.getByRole('button', { name: 'Send again (new link)' }).waitFor();
    await expect(page.getByText('Waiting for a manager to approve the discount').count()).resolves.toBe(0);
    expect(errors).toEqual([]);
    await page.close();
    await managerPage.close();
  });
});
