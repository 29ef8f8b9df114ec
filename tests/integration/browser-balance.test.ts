import type { Browser, BrowserContext, Page } from 'playwright-core';
import { expectNoSeriousA11yViolations } from '../support/a11y';
import { signedInAgent } from '../support/auth';
import { launchBrowser, staffContext } from '../support/browser';
import { waitForMailsTo } from '../support/mail';
import { makePaidJob } from '../support/job-fixtures';
import { readRuntime } from '../support/runtime';

// The balance in the browser (issue 12, item 7): counter staff see the balance due on the quote page and
// either e-mail the pay-the-balance link — the customer pays it on the payments fake's page and their
// quote page then shows it paid, with the final invoice — or take the money at the counter.
const { appUrl } = readRuntime();
const dollars = (cents: number) => (cents / 100).toLocaleString('en-US', { style: 'currency', currency: 'USD' });

describe('the balance in the browser', () => {
  let browser: Browser;
  let staff: BrowserContext;
  let counter: Awaited<ReturnType<typeof signedInAgent>>;

  beforeAll(async () => {
    browser = await launchBrowser();
    staff = await staffContext(browser, 'counter');
    counter = await signedInAgent('counter');
  });
  afterAll(async () => {
    await staff?.close();
    await browser?.close();
  });

  async function openQuote(id: number): Promise<Page> {
    const page = await staff.newPage();
    page.setDefaultTimeout(10_000);
    await page.goto(`${appUrl}/quotes/${id}`);
    return page;
  }

  it('e-mails the link; the customer pays the balance online and sees it paid, with the invoice', async () => {
    const job = await makePaidJob(counter, 'Browser balance online');
    const due = job.totalCents - job.depositCents;
    const page = await openQuote(job.id);
    await expect(page.getByTestId('balance-due').textContent()).resolves.toBe(dollars(due));
    await page.getByRole('button', { name: 'E-mail the pay-the-balance link' }).click();
    await page.getByText(`E-mailed ${job.customerEmail} the balance of ${dollars(due)}`).waitFor();
    await page.getByText(/Pay-the-balance link last e-mailed/).waitFor();
    await expectNoSeriousA11yViolations(page);

    const mail = (await waitForMailsTo(job.customerEmail, 3)).find((m) => m.subject.includes('left to pay'))!;
    const link = /(http:\/\/\S+\/q\/[A-Za-z0-9_-]+)/.exec(mail.text)![1];
    const customer = await browser.newPage({ viewport: { width: 390, height: 844 } });
    customer.setDefaultTimeout(10_000);
    await customer.goto(link);
    await customer.getByRole('heading', { name: 'Status: Job done — balance to pay' }).waitFor();
    await expectNoSeriousA11yViolations(customer);
    await Promise.all([
      customer.waitForURL(/\/pay\/cs_/),
      customer.getByRole('button', { name: `Pay the balance of ${dollars(due)}` }).click(),
    ]);
    await Promise.all([
      customer.waitForURL((url) => url.href.startsWith(`${link}?paid=balance`)),
      customer.getByRole('button', { name: /Pay/ }).first().click(),
    ]);
    for (let i = 0; i < 20 && !(await customer.getByText('Paid in full — thank you.').count()); i++) {
      await customer.waitForTimeout(250);
      await customer.reload();
    }
    await customer.getByRole('heading', { name: 'Status: Paid in full — thank you' }).waitFor();
    await expect(customer.getByRole('button', { name: /Pay the balance/ }).count()).resolves.toBe(0);
    const invoiceHref = await customer.getByRole('link', { name: 'Final invoice (PDF)' }).getAttribute('href');
    const invoice = await customer.request.get(`${appUrl}${invoiceHref}`);
    expect([invoice.status(), invoice.headers()['content-type']]).toEqual([200, 'application/pdf']);
    expect((await invoice.body()).subarray(0, 5).toString()).toBe('%PDF-');
    await expect(customer.getByRole('link', { name: 'Receipt (PDF)' }).count()).resolves.toBe(2);
    await expectNoSeriousA11yViolations(customer);
    await customer.close();

    await page.reload();
    await page.getByText('Paid in full', { exact: false }).first().waitFor();
    await expect(page.getByTestId('balance-due').textContent()).resolves.toBe('$0.00');
    await expect(page.getByRole('link', { name: 'Final invoice (PDF)' }).isVisible()).resolves.toBe(true);
    await expect(page.getByRole('button', { name: 'E-mail the pay-the-balance link' }).count()).resolves.toBe(0);
    await page.close();
  });

  it('records cash taken at the counter in two parts, then shows the job paid in full to staff and customer', async () => {
    const job = await makePaidJob(counter, 'Browser balance counter');
    const due = job.totalCents - job.depositCents;
    const page = await openQuote(job.id);
    await page.getByLabel('Amount taken ($)').fill('100.00');
    await page.getByLabel('Cash').check();
    await page.getByRole('button', { name: 'Record counter payment' }).click();
    await page.getByText('Recorded $100.00 taken at the counter').waitFor();
    await expect(page.getByTestId('balance-due').textContent()).resolves.toBe(dollars(due - 10_000));
    await page.getByText(/Cash at the counter, taken by/).waitFor();
    await expectNoSeriousA11yViolations(page);

    // Too much is stopped before it is sent.
    await page.getByLabel('Amount taken ($)').fill(((due - 10_000) / 100 + 1).toFixed(2));
    await page.getByRole('button', { name: 'Record counter payment' }).click();
    await page
      .getByRole('alert')
      .getByText(/At most/)
      .waitFor();

    await page.getByLabel('Amount taken ($)').fill(((due - 10_000) / 100).toFixed(2));
    await page.getByLabel('Card at the counter').check();
    await page.getByRole('button', { name: 'Record counter payment' }).click();
    await page.getByText(/^Paid in full/).waitFor();
    await expect(page.getByTestId('balance-due').textContent()).resolves.toBe('$0.00');
    await expect(page.getByText('State: Balance paid, closed').isVisible()).resolves.toBe(true);
    await page.close();

    const customer = await browser.newPage();
    customer.setDefaultTimeout(10_000);
    await customer.goto(`${appUrl}/q/${job.token}`);
    await customer.getByRole('heading', { name: 'What you have paid' }).waitFor();
    await expect(customer.getByText('Balance, cash at the counter', { exact: false }).isVisible()).resolves.toBe(true);
    await expect(customer.getByText('Balance, card at the counter', { exact: false }).isVisible()).resolves.toBe(true);
    await expect(customer.getByRole('link', { name: 'Final invoice (PDF)' }).isVisible()).resolves.toBe(true);
    await customer.close();
  });
});
