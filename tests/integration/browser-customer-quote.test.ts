import fs from 'node:fs';
import path from 'node:path';
import type { Browser } from 'playwright-core';
import request from 'supertest';
import { signedInAgent } from '../support/auth';
import { expectNoSeriousA11yViolations } from '../support/a11y';
import { launchBrowser } from '../support/browser';
import { readRuntime } from '../support/runtime';
import { DEMO } from '../support/demo';

// The customer's side in a real browser on a phone-sized screen: open the e-mailed link, read the
// deposit and the policy, accept, pay on the payments fake's page, come back to a paid quote.
const { mailUrl } = readRuntime();
const SHOTS = path.resolve(__dirname, '../../var/test/screenshots');

describe('the customer quote page on a phone', () => {
  let browser: Browser;
  let link: string;
  let quoteId: number;

  beforeAll(async () => {
    browser = await launchBrowser();
    fs.mkdirSync(SHOTS, { recursive: true });
    const counter = await signedInAgent('counter');
    const made = await counter.post('/api/quotes').send({
      buildId: DEMO.builds.vranesStripCoupe,
      camId: DEMO.cams.stripStreet224,
      extraLines: [{ kind: 'labor', laborOperationId: DEMO.labor.camSwapCar }],
    });
    expect(made.status).toBe(201);
    quoteId = made.body.id;
    expect((await counter.post(`/api/quotes/${quoteId}/send`)).status).toBe(200);
    const messages = (await request(mailUrl).get('/messages').query({ to: 'teddy.vranes@example.com' })).body as {
      subject: string;
      text: string;
    }[];
    const mail = messages.find((m) => m.subject.includes(made.body.number))!;
    link = /(http:\/\/\S+\/q\/[A-Za-z0-9_-]+)/.exec(mail.text)![1];
  });
  afterAll(() => browser?.close());

  it('reads plainly, fits the screen, and takes the deposit through the payment page', async () => {
    const page = await browser.newPage({ viewport: { width: 390, height: 844 } });
    const consoleErrors: string[] = [];
    page.on('console', (m) => m.type() === 'error' && consoleErrors.push(m.text()));
    await page.goto(link, { waitUntil: 'load' });
    await expect(page.getByRole('heading', { level: 1 }).textContent()).resolves.toMatch(/Your quote Q-\d{4}-\d{4}/);
    await expect(page.getByRole('heading', { name: /Deposit to book the job: \$/ }).isVisible()).resolves.toBe(true);
    await expect(page.getByText('Your deposit holds the parts and a bay for your job.').isVisible()).resolves.toBe(
      true,
    );
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    expect(overflow).toBeLessThanOrEqual(0);
    const button = page.getByRole('button', { name: 'Accept and pay the deposit' });
    const box = await button.boundingBox();
    expect(box!.height).toBeGreaterThanOrEqual(48); // a generous touch target
    const bodySize = await page.evaluate(() =>
      parseFloat(getComputedStyle(document.querySelector('main > div')!).fontSize),
    );
    expect(bodySize).toBeGreaterThanOrEqual(18);
    await expectNoSeriousA11yViolations(page);
    await page.screenshot({ path: path.join(SHOTS, 'customer-quote-phone.png'), fullPage: true });

    await Promise.all([page.waitForURL(/\/pay\/cs_/), button.click()]);
    await Promise.all([
      page.waitForURL((url) => url.href.startsWith(`${link}?paid=1`)),
      page.getByRole('button', { name: /Pay/ }).first().click(),
    ]);
    // The webhook usually lands before the redirect; reload until it has.
    for (let i = 0; i < 20 && !(await page.getByText('Deposit paid — thank you').count()); i++) {
      await page.waitForTimeout(250);
      await page.reload();
    }
    await expect(page.getByRole('heading', { name: /Status: Deposit paid/ }).isVisible()).resolves.toBe(true);
    await expect(page.getByRole('button', { name: 'Accept and pay the deposit' }).count()).resolves.toBe(0);
    await expectNoSeriousA11yViolations(page);
    await page.screenshot({ path: path.join(SHOTS, 'customer-quote-paid-phone.png'), fullPage: true });
    expect(consoleErrors).toEqual([]);
    await page.close();
  });
});
