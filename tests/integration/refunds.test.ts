import Stripe from 'stripe';
import request from 'supertest';
import { signedInAgent } from '../support/auth';
import { connectTestDatabase, disconnectTestDatabase } from '../support/database';
import { makeSentQuote, type FixtureQuote } from '../support/quote-fixtures';
import { postRefund } from '../support/refunds';
import { readRuntime } from '../support/runtime';
import type { QuoteRecord } from '@/lib/quotes/types';

// Refunds that tell the truth (issue 12, item 4): after a full refund no page says "Deposit paid" or
// "Your job is booked", the customer is e-mailed, and the manager chooses between cancelling the job and
// reopening the quote. A balance payment (online or at the counter) is refunded the same way, and a double
// click refunds once. Each test pays its own fixture quote through the payments fake.
const { appUrl, mailUrl, paymentsUrl, env } = readRuntime();
const stripe = new Stripe(env.STRIPE_SECRET_KEY, {
  host: '127.0.0.1',
  port: Number(env.STRIPE_API_PORT),
  protocol: 'http',
});

let counter: Awaited<ReturnType<typeof signedInAgent>>;
let manager: Awaited<ReturnType<typeof signedInAgent>>;

beforeAll(async () => {
  connectTestDatabase();
  [counter, manager] = await Promise.all([signedInAgent('counter'), signedInAgent('manager')]);
});
afterAll(() => disconnectTestDatabase());

async function paidQuote(label: string): Promise<FixtureQuote & { token: string }> {
  const quote = await makeSentQuote(counter, label);
  const started = await request(appUrl)
    .post(`/api/q/${quote.token}/checkout`)
    .set('Accept', 'application/json')
    .expect(200);
  await request(paymentsUrl)
    .post(`/_test/sessions/${new URL(started.body.url).pathname.split('/').pop()}/complete`)
    .expect(200);
  await waitForStatus(quote.id, 'deposit-paid');
  return quote;
}

/** What the payments fake says was refunded on a payment's charge. */
async function refundedAtProvider(intentId: string): Promise<number> {
  const intent = await stripe.paymentIntents.retrieve(intentId);
  return (await stripe.charges.retrieve(intent.latest_charge as string)).amount_refunded;
}

async function waitForStatus(id: number, status: string): Promise<void> {
  const deadline = Date.now() + 15_000;
  while ((await manager.get(`/api/quotes/${id}`)).body.status !== status) {
    if (Date.now() > deadline) throw new Error(`quote ${id} did not become ${status}`);
    await new Promise((r) => setTimeout(r, 150));
  }
}

const refundMails = async (to: string) =>
  ((await request(mailUrl).get('/messages').query({ to })).body as { subject: string; text: string }[]).filter((m) =>
    /refunded/.test(m.subject),
  );

describe('a full refund', () => {
  it('cancels the job by default: staff pages, jobs list and the customer page stop saying it is paid, and the customer is e-mailed', async () => {
    const quote = await paidQuote('Full refund');
    const before = await request(appUrl).get(`/q/${quote.token}`);
    expect(before.text).toContain('Your job is booked');
    expect((await manager.get('/jobs')).text).toContain(quote.number);

    const res = await postRefund(manager, quote.id, {
      amountCents: quote.depositCents,
      reason: 'customer changed plans',
    });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ status: 'cancelled', refundedCents: quote.depositCents });

    const staffPage = await manager.get(`/quotes/${quote.id}`);
    expect(staffPage.text).not.toContain('Deposit paid');
    expect(staffPage.text).toContain('Cancelled');
    expect((await manager.get('/quotes')).text).toContain(quote.number);
    expect((await manager.get('/jobs')).text).not.toContain(quote.number);
    const page = await request(appUrl).get(`/q/${quote.token}`);
    expect(page.text).not.toContain('Deposit paid');
    expect(page.text).not.toContain('Your job is booked');
    expect(page.text).toContain('Deposit refunded');
    expect(page.text).not.toContain('Accept and pay the deposit');

    const mails = await refundMails(quote.customerEmail);
    expect(mails).toHaveLength(1);
    expect(mails[0].subject).toContain(quote.number);
    expect(mails[0].text).toContain(
      (quote.depositCents / 100).toLocaleString('en-US', { style: 'currency', currency: 'USD' }),
    );
    expect(mails[0].text).toMatch(/cancelled/);
  });

  it('reopens the quote when the manager says so: the customer may pay again', async () => {
    const quote = await paidQuote('Refund and reopen');
    const res = await postRefund(manager, quote.id, { amountCents: quote.depositCents, afterFullRefund: 'reopen' });
    expect(res.status).toBe(200);
    expect(res.body.status).toBe('sent');
    const page = await request(appUrl).get(`/q/${quote.token}`);
    expect(page.text).not.toContain('Your job is booked');
    expect(page.text).toContain('Deposit refunded');
    expect(page.text).toContain('Accept and pay the deposit');
    expect(
      (await request(appUrl).post(`/api/q/${quote.token}/checkout`).set('Accept', 'application/json')).status,
    ).toBe(200);
    expect((await refundMails(quote.customerEmail))[0].text).toMatch(/open again/);
  });

  it('rejects an unknown choice by field', async () => {
    const quote = await paidQuote('Refund bad choice');
    const res = await postRefund(manager, quote.id, { amountCents: quote.depositCents, afterFullRefund: 'keep' });
    expect(res.status).toBe(422);
    expect(res.body.errors).toEqual([expect.objectContaining({ field: 'afterFullRefund' })]);
    expect((await manager.get(`/api/quotes/${quote.id}`)).body.status).toBe('deposit-paid');
  });
});

describe('a partial refund', () => {
  it('keeps the job booked, says what was refunded, and tells the customer so', async () => {
    const quote = await paidQuote('Partial refund');
    const res = await postRefund(manager, quote.id, { amountCents: 1_000 });
    expect(res.status).toBe(200);
    expect(res.body.status).toBe('deposit-paid');
    const page = await request(appUrl).get(`/q/${quote.token}`);
    expect(page.text).toContain('part refunded');
    const mails = await refundMails(quote.customerEmail);
    expect(mails).toHaveLength(1);
    expect(mails[0].subject).toMatch(/deposit/);
    expect(mails[0].text).toContain('$10.00');
    expect(mails[0].text).toMatch(/stays booked/);
  });
});

describe('refunds against double clicks and concurrent posts', () => {
  it('refunds once when the same refund is posted twice at the same moment; the other answers 409', async () => {
    const quote = await paidQuote('Refund twice');
    const { version } = (await manager.get(`/api/quotes/${quote.id}`)).body as QuoteRecord;
    const post = () => manager.post(`/api/quotes/${quote.id}/refund`).send({ version, amountCents: 1_500 });
    const answers = await Promise.all([post(), post(), post()]);
    expect(answers.map((a) => a.status).sort()).toEqual([200, 409, 409]);
    const refused = answers.find((a) => a.status === 409)!;
    expect(refused.body.message).toMatch(/changed after you opened it/);
    expect(refused.body.current.refundedCents).toBe(1_500);
    const after = (await manager.get(`/api/quotes/${quote.id}`)).body as QuoteRecord;
    expect(after.refundedCents).toBe(1_500);
    const intent = after.payments[0].providerPaymentId!;
    expect(await refundedAtProvider(intent)).toBe(1_500);
    expect(await refundMails(quote.customerEmail)).toHaveLength(1);
  });

  it('refuses a refund without the version it was reviewed on, by field', async () => {
    const quote = await paidQuote('Refund without version');
    const res = await manager.post(`/api/quotes/${quote.id}/refund`).send({ amountCents: 100 });
    expect(res.status).toBe(422);
    expect(res.body.errors).toEqual([expect.objectContaining({ field: 'version' })]);
  });
});

describe('a refund of a balance payment', () => {
  /** A job whose balance the customer paid online through the pay-the-balance link: closed, paid in full. */
  async function closedJob(label: string): Promise<FixtureQuote & { token: string }> {
    const quote = await paidQuote(label);
    const { version } = (await manager.get(`/api/quotes/${quote.id}`)).body as QuoteRecord;
    await counter.post(`/api/quotes/${quote.id}/balance-request`).send({ version }).expect(200);
    const started = await request(appUrl)
      .post(`/api/q/${quote.token}/balance-checkout`)
      .set('Accept', 'application/json')
      .expect(200);
    await request(paymentsUrl)
      .post(`/_test/sessions/${new URL(started.body.url).pathname.split('/').pop()}/complete`)
      .expect(200);
    await waitForStatus(quote.id, 'closed');
    return quote;
  }

  it('gives money back through the payments fake; the closed job owes it again on every page, and the customer is told', async () => {
    const quote = await closedJob('Balance refund');
    const closed = (await manager.get(`/api/quotes/${quote.id}`)).body as QuoteRecord;
    const balance = closed.payments.find((p) => p.purpose === 'balance')!;
    expect(balance).toMatchObject({ status: 'paid', method: 'online' });
    // Closed and never booked, it is off the jobs list; owing money again, it is back on it.
    expect((await manager.get('/jobs')).text).not.toContain(quote.number);

    const res = await postRefund(manager, quote.id, {
      paymentId: balance.id,
      amountCents: 4_000,
      reason: 'overcharged',
    });
    expect(res.status).toBe(200);
    const after = res.body as QuoteRecord;
    expect(after).toMatchObject({
      status: 'deposit-paid',
      refundedCents: 4_000,
      balanceDueCents: 4_000,
      closedAt: null,
    });
    expect(after.payments.find((p) => p.id === balance.id)).toMatchObject({
      status: 'partially-refunded',
      refundedCents: 4_000,
    });
    // The deposit is untouched; the money went back on the balance payment's own charge.
    expect(after.payments.find((p) => p.purpose === 'deposit')).toMatchObject({ status: 'paid', refundedCents: 0 });
    expect(await refundedAtProvider(balance.providerPaymentId!)).toBe(4_000);

    const staffPage = await manager.get(`/quotes/${quote.id}`);
    expect(staffPage.text).not.toContain('Balance paid, closed');
    expect(staffPage.text).toContain('Deposit paid');
    expect((await manager.get('/jobs')).text).toContain(quote.number);
    const page = await request(appUrl).get(`/q/${quote.token}`);
    expect(page.text).not.toContain('Paid in full');
    expect(page.text).toContain('Balance payment refunded');
    expect(page.text).toContain('$40.00 is left to pay');

    const mails = await refundMails(quote.customerEmail);
    expect(mails).toHaveLength(1);
    expect(mails[0].subject).toBe(`Your balance payment for quote ${quote.number} has been refunded`);
    expect(mails[0].text).toContain('$40.00');
    expect(mails[0].text).toMatch(/\$40\.00 is now left to pay/);
  });

  it('refunds a balance taken at the counter without the payment service, and cancels when nothing is held', async () => {
    const quote = await paidQuote('Counter balance refund');
    const open = (await manager.get(`/api/quotes/${quote.id}`)).body as QuoteRecord;
    const cash = await counter
      .post(`/api/quotes/${quote.id}/payments`)
      .send({ version: open.version, amountCents: open.balanceDueCents, method: 'cash' });
    expect(cash.body.status).toBe('closed');
    const counterPayment = (cash.body as QuoteRecord).payments.find((p) => p.purpose === 'balance')!;
    const deposit = (cash.body as QuoteRecord).payments.find((p) => p.purpose === 'deposit')!;

    const back = await postRefund(manager, quote.id, {
      paymentId: counterPayment.id,
      amountCents: counterPayment.amountCents,
    });
    expect(back.status).toBe(200);
    expect(back.body).toMatchObject({ status: 'deposit-paid', balanceDueCents: counterPayment.amountCents });
    expect((await refundMails(quote.customerEmail))[0].text).toMatch(/handed back at the counter/);
    // A refunded payment cannot be refunded again; a payment of another quote is not this quote's.
    const again = await postRefund(manager, quote.id, { paymentId: counterPayment.id, amountCents: 1 });
    expect(again.status).toBe(422);
    expect(again.body.errors).toEqual([expect.objectContaining({ field: 'paymentId' })]);

    const last = await postRefund(manager, quote.id, { paymentId: deposit.id, amountCents: deposit.amountCents });
    expect(last.status).toBe(200);
    expect(last.body.status).toBe('cancelled');
    expect((await manager.get('/jobs')).text).not.toContain(quote.number);
    const page = await request(appUrl).get(`/q/${quote.token}`);
    expect(page.text).toContain('Payments refunded — job cancelled');
    const mails = await refundMails(quote.customerEmail);
    expect(mails).toHaveLength(2);
    expect(mails.some((m) => /cancelled/.test(m.text))).toBe(true);
  });
});
