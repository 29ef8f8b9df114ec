import type { Browser, BrowserContext } from 'playwright-core';
import { signedInAgent } from '../support/auth';
import { expectNoSeriousA11yViolations } from '../support/a11y';
import { launchBrowser, staffContext } from '../support/browser';
import { waitForMailsTo } from '../support/mail';
import { makePaidJob } from '../support/job-fixtures';
import { makeSentQuote } from '../support/quote-fixtures';
import { readRuntime } from '../support/runtime';
import type { QuoteRecord } from '@/lib/quotes/types';

// Issue 12's browser walk: the customer prints the quote (only the quote on paper), accepts and pays,
// gets the receipt e-mail; a manager refunds through the confirmation step, choosing to cancel the job,
// and the customer's page changes; a balance payment is refunded the same way and the closed job owes it again.
const { appUrl } = readRuntime();

describe('a quote from payment to refund in the browser', () => {
  let browser: Browser;
  let staff: BrowserContext;

  beforeAll(async () => {
    browser = await launchBrowser();
    staff = await staffContext(browser, 'manager');
  });
  afterAll(async () => {
    await staff?.close();
    await browser?.close();
  });

  it('prints, pays, e-mails the receipt, and shows a confirmed refund on the customer page', async () => {
    const quote = await makeSentQuote(await signedInAgent('counter'), 'Browser money');
    const link = `${appUrl}/q/${quote.token}`;
    const customer = await browser.newPage({ viewport: { width: 390, height: 844 } });
    customer.setDefaultTimeout(10_000);
    await customer.goto(link);

    // On paper: the quote only — no site header (with its sign-in link), no footer, no pay button, no PDF link.
    const header = customer.locator('body > header');
    await expect(header.isVisible()).resolves.toBe(true);
    await customer.emulateMedia({ media: 'print' });
    await expect(header.isVisible()).resolves.toBe(false);
    await expect(customer.locator('body > footer').isVisible()).resolves.toBe(false);
    await expect(customer.getByRole('button', { name: 'Accept and pay the deposit' }).isVisible()).resolves.toBe(false);
    await expect(customer.getByRole('link', { name: 'Download as PDF' }).isVisible()).resolves.toBe(false);
    await expect(customer.getByRole('heading', { level: 1 }).isVisible()).resolves.toBe(true);
    await expect(customer.getByText('Local codes and licensed practice come first').isVisible()).resolves.toBe(true);
    await customer.emulateMedia({ media: 'screen' });
    await expectNoSeriousA11yViolations(customer);

    await Promise.all([
      customer.waitForURL(/\/pay\/cs_/),
      customer.getByRole('button', { name: 'Accept and pay the deposit' }).click(),
    ]);
    await Promise.all([
      customer.waitForURL((url) => url.href.startsWith(`${link}?paid=1`)),
      customer.getByRole('button', { name: /Pay/ }).first().click(),
    ]);
    const receipt = (await waitForMailsTo(quote.customerEmail, 2)).find((m) =>
      m.subject.startsWith('Deposit received'),
    );
    expect(receipt?.text).toContain(quote.number);

    const page = await staff.newPage();
    page.setDefaultTimeout(10_000);
    await page.goto(`${appUrl}/quotes/${quote.id}`);
    await page.getByLabel(/Refund amount/).fill((quote.depositCents / 100).toFixed(2));
    await page.getByRole('button', { name: 'Review refund…' }).click();
    const dialog = page.getByRole('alertdialog');
    await expect(dialog.textContent()).resolves.toMatch(/cannot be undone/);
    await dialog.getByLabel(/Cancel the job/).check();
    await dialog.getByRole('button', { name: 'Confirm refund' }).click();
    await page.getByText(/Refund of \$[\d,.]+ sent to the payment service/).waitFor();
    await expect(page.getByRole('heading', { name: 'State: Cancelled' }).isVisible()).resolves.toBe(true);
    await expectNoSeriousA11yViolations(page);

    await customer.goto(link);
    await expect(
      customer.getByRole('heading', { name: /Status: Deposit refunded — job cancelled/ }).isVisible(),
    ).resolves.toBe(true);
    await expectNoSeriousA11yViolations(customer);
    await page.close();
    await customer.close();
  });

  it('refunds a balance payment after a confirmation: the closed job owes it again, on the staff and customer pages', async () => {
    const counter = await signedInAgent('counter');
    const job = await makePaidJob(counter, 'Browser balance refund');
    const open = (await counter.get(`/api/quotes/${job.id}`)).body as QuoteRecord;
    const paid = await counter
      .post(`/api/quotes/${job.id}/payments`)
      .send({ version: open.version, amountCents: open.balanceDueCents, method: 'cash' });
    expect(paid.body.status).toBe('closed');

    const page = await staff.newPage();
    page.setDefaultTimeout(10_000);
    await page.goto(`${appUrl}/quotes/${job.id}`);
    await page.getByRole('heading', { name: 'State: Balance paid, closed' }).waitFor();
    const cash = (open.balanceDueCents / 100).toLocaleString('en-US', { style: 'currency', currency: 'USD' });
    await page.getByLabel('Payment to refund').selectOption({ label: `Balance — cash at the counter, ${cash} left` });
    await page.getByLabel(`Refund amount ($, at most ${cash})`).waitFor();
    await page.getByLabel(/Refund amount/).fill('25.00');
    await page.getByRole('button', { name: 'Review refund…' }).click();
    const dialog = page.getByRole('alertdialog');
    await expect(dialog.textContent()).resolves.toMatch(
      /Record \$25\.00 handed back at the counter from the balance payment\? This cannot be undone/,
    );
    await expect(dialog.textContent()).resolves.toContain('$25.00 is then left to pay');
    await expectNoSeriousA11yViolations(page);
    // Going back sends nothing.
    await dialog.getByRole('button', { name: 'Go back' }).click();
    await page.getByRole('button', { name: 'Review refund…' }).click();
    await page.getByRole('alertdialog').getByRole('button', { name: 'Confirm refund' }).click();
    await page.getByText('Refund of $25.00 recorded as handed back at the counter.').waitFor();
    await expect(page.getByRole('heading', { name: 'State: Deposit paid' }).isVisible()).resolves.toBe(true);
    await expect(page.getByText('(refunded $25.00)').isVisible()).resolves.toBe(true);
    await expectNoSeriousA11yViolations(page);

    const customer = await browser.newPage({ viewport: { width: 390, height: 844 } });
    customer.setDefaultTimeout(10_000);
    await customer.goto(`${appUrl}/q/${job.token}`);
    await customer.getByRole('heading', { name: 'Status: Balance payment refunded' }).waitFor();
    await expect(customer.getByText('$25.00 is left to pay on the job').isVisible()).resolves.toBe(true);
    await expectNoSeriousA11yViolations(customer);
    const notice = (await waitForMailsTo(job.customerEmail)).filter((m) => /refunded/.test(m.subject));
    expect(notice.map((m) => m.subject)).toEqual([`Your balance payment for quote ${job.number} has been refunded`]);
    await page.close();
    await customer.close();
  });
});
