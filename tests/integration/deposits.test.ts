import crypto from 'node:crypto';
import { QueryTypes, type Sequelize } from 'sequelize';
import Stripe from 'stripe';
import request from 'supertest';
import { signedInAgent } from '../support/auth';
import { connectTestDatabase, disconnectTestDatabase } from '../support/database';
import { dayFromToday, makeSentQuote } from '../support/quote-fixtures';
import { readRuntime } from '../support/runtime';
import type { QuoteRecord } from '@/lib/quotes/types';

// Exactly-once deposits (issue 12, item 3), over HTTP against the real build, MariaDB and the payments
// fake. Every test makes its own customer, build and sent quote, so none depends on another or on the date.
const { appUrl, paymentsUrl, env } = readRuntime();
const stripe = new Stripe(env.STRIPE_SECRET_KEY, {
  host: '127.0.0.1',
  port: Number(env.STRIPE_API_PORT),
  protocol: 'http',
});

type Quote = QuoteRecord;

let sequelize: Sequelize;
let counter: Awaited<ReturnType<typeof signedInAgent>>;

beforeAll(async () => {
  sequelize = connectTestDatabase();
  counter = await signedInAgent('counter');
});
afterAll(() => disconnectTestDatabase());

const readQuote = async (id: number) => (await counter.get(`/api/quotes/${id}`)).body as Quote;
const checkoutJson = (token: string) =>
  request(appUrl).post(`/api/q/${token}/checkout`).set('Accept', 'application/json');
const sessionIdOf = (url: string) => new URL(url).pathname.split('/').pop()!;

async function pollQuote(id: number, until: (q: Quote) => boolean, timeoutMs = 15_000): Promise<Quote> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const q = await readQuote(id);
    if (until(q) || Date.now() > deadline) return q;
    await new Promise((r) => setTimeout(r, 150));
  }
}

async function paymentRows(quoteId: number) {
  return sequelize.query<{ id: number; status: string; provider_session_id: string }>(
    'SELECT id, status, provider_session_id FROM payments WHERE quote_id = ? ORDER BY id',
    {
      replacements: [quoteId],
      type: QueryTypes.SELECT,
    },
  );
}

/** A checkout.session.completed event as the provider would send it, signed with the shop's secret. */
function signedCompletedEvent(session: Record<string, unknown>) {
  const body = JSON.stringify({
    id: `evt_test_${crypto.randomBytes(8).toString('hex')}`,
    object: 'event',
    type: 'checkout.session.completed',
    created: Math.floor(Date.now() / 1000),
    data: {
      object: {
        object: 'checkout.session',
        status: 'complete',
        payment_status: 'paid',
        currency: 'usd',
        client_reference_id: null,
        ...session,
      },
    },
  });
  return {
    body,
    signature: stripe.webhooks.generateTestHeaderString({ payload: body, secret: env.STRIPE_WEBHOOK_SECRET }),
  };
}
const deliver = ({ body, signature }: { body: string; signature: string }) =>
  request(appUrl)
    .post('/api/payments/webhook')
    .set('Stripe-Signature', signature)
    .set('content-type', 'application/json')
    .send(body);

describe('one checkout session per quote', () => {
  it('five checkout posts at once open one provider session and one pending payment', async () => {
    const quote = await makeSentQuote(counter, 'Five posts');
    const answers = await Promise.all(Array.from({ length: 5 }, () => checkoutJson(quote.token)));
    expect(answers.map((a) => a.status)).toEqual([200, 200, 200, 200, 200]);
    expect(new Set(answers.map((a) => a.body.url)).size).toBe(1);
    const rows = await paymentRows(quote.id);
    expect(rows).toHaveLength(1);
    expect(rows[0]).toMatchObject({ status: 'pending', provider_session_id: sessionIdOf(answers[0].body.url) });
    // A form post later is sent to the same page.
    const again = await request(appUrl).post(`/api/q/${quote.token}/checkout`);
    expect(again.status).toBe(303);
    expect(again.headers.location).toBe(answers[0].body.url);
    expect(await paymentRows(quote.id)).toHaveLength(1);
  });

  it('cancelling on the pay page leaves the quote as sent, not accepted', async () => {
    const quote = await makeSentQuote(counter, 'Cancel on pay page');
    const started = await request(appUrl).post(`/api/q/${quote.token}/checkout`).expect(303);
    const payPage = new URL(started.headers.location);
    const cancelled = await request(paymentsUrl).post(`${payPage.pathname}/cancel`);
    expect(cancelled.status).toBe(303);
    expect(cancelled.headers.location).toBe(`${appUrl}/q/${quote.token}?cancelled=1`);
    expect((await readQuote(quote.id)).status).toBe('sent');
    const page = await request(appUrl).get(`/q/${quote.token}?cancelled=1`);
    expect(page.text).toContain('Payment not made');
    expect(page.text).toContain('Accept and pay the deposit');
    expect(page.text).not.toContain('Accepted, deposit not paid yet');
  });

  it('two tabs pay one session; afterwards a checkout answers 409 with the paid state', async () => {
    const quote = await makeSentQuote(counter, 'Two tabs');
    const first = await checkoutJson(quote.token).expect(200);
    const second = await checkoutJson(quote.token).expect(200);
    expect(second.body.url).toBe(first.body.url);
    expect(second.body.reused).toBe(true);
    await request(paymentsUrl)
      .post(`/_test/sessions/${sessionIdOf(first.body.url)}/complete`)
      .expect(200);
    // The second tab's "Pay" meets a session that is already complete: the provider takes nothing more.
    expect((await request(paymentsUrl).post(`/_test/sessions/${sessionIdOf(second.body.url)}/complete`)).status).toBe(
      400,
    );
    const paid = await pollQuote(quote.id, (q) => q.status === 'deposit-paid');
    expect(paid.payments).toEqual([expect.objectContaining({ status: 'paid', amountCents: quote.depositCents })]);
    expect(paid.paidCents).toBe(quote.depositCents);
    const refused = await checkoutJson(quote.token);
    expect(refused.status).toBe(409);
    expect(refused.body.state).toMatchObject({ status: 'deposit-paid', depositPaid: true });
    expect(refused.body.message).toMatch(/already been paid/);
    expect(await paymentRows(quote.id)).toHaveLength(1);
  });
});

describe('a second completed session', () => {
  it('is refunded automatically through the SDK, recorded, and never counted', async () => {
    const quote = await makeSentQuote(counter, 'Second session');
    const first = await checkoutJson(quote.token).expect(200);
    // A second open session for the same deposit, as the old code left behind on every extra click.
    const legacy = await stripe.checkout.sessions.create({
      mode: 'payment',
      line_items: [
        {
          quantity: 1,
          price_data: {
            currency: 'usd',
            unit_amount: quote.depositCents,
            product_data: { name: `Deposit for quote ${quote.number}` },
          },
        },
      ],
      success_url: `${appUrl}/q/${quote.token}?paid=1`,
      client_reference_id: String(quote.id),
      metadata: { quoteId: String(quote.id), quoteNumber: quote.number },
    });
    await sequelize.query(
      "INSERT INTO payments (quote_id, provider, provider_session_id, amount_cents, refunded_cents, currency, status, created_at, updated_at) VALUES (?, 'stripe', ?, ?, 0, 'usd', 'pending', NOW(), NOW())",
      {
        replacements: [quote.id, legacy.id, quote.depositCents],
      },
    );

    await request(paymentsUrl)
      .post(`/_test/sessions/${sessionIdOf(first.body.url)}/complete`)
      .expect(200);
    await pollQuote(quote.id, (q) => q.status === 'deposit-paid');
    const late = await request(paymentsUrl).post(`/_test/sessions/${legacy.id}/complete`).expect(200);
    expect(late.body.delivery.attempts[0].statusCode).toBe(200);

    const after = await pollQuote(quote.id, (q) =>
      q.payments.some((p) => p.providerSessionId === legacy.id && p.status === 'refunded'),
    );
    const original = after.payments.find((p) => p.providerSessionId === sessionIdOf(first.body.url))!;
    const duplicate = after.payments.find((p) => p.providerSessionId === legacy.id)!;
    expect(original).toMatchObject({ status: 'paid', refundedCents: 0 });
    expect(duplicate).toMatchObject({
      status: 'refunded',
      refundedCents: quote.depositCents,
      duplicateOfPaymentId: original.id,
    });
    expect(after.paidCents).toBe(quote.depositCents);
    expect(after.refundedCents).toBe(0);
    // The money really went back at the provider.
    const session = await stripe.checkout.sessions.retrieve(legacy.id, { expand: ['payment_intent'] });
    const intent = session.payment_intent as Stripe.PaymentIntent;
    const charge = await stripe.charges.retrieve(intent.latest_charge as string);
    expect(charge.amount_refunded).toBe(quote.depositCents);
    const audits = await sequelize.query<{ n: number }>(
      "SELECT COUNT(*) AS n FROM audit_log WHERE action = 'payment.duplicate-refunded' AND entity_id = ?",
      { replacements: [String(quote.id)], type: QueryTypes.SELECT },
    );
    expect(Number(audits[0].n)).toBe(1);
    // Delivered again, it is not refunded or counted a second time.
    const replay = JSON.stringify(late.body.event);
    const again = await deliver({
      body: replay,
      signature: stripe.webhooks.generateTestHeaderString({ payload: replay, secret: env.STRIPE_WEBHOOK_SECRET }),
    });
    expect(again.body.result).toBe('already');
    expect((await stripe.charges.retrieve(intent.latest_charge as string)).amount_refunded).toBe(quote.depositCents);
  });
});

describe('the webhook trusts only what the app asked for', () => {
  it('refuses a signed session whose amount is not the deposit, or that names another quote', async () => {
    const quote = await makeSentQuote(counter, 'Forged amount');
    const other = await makeSentQuote(counter, 'Other quote');
    const started = await checkoutJson(quote.token).expect(200);
    const sessionId = sessionIdOf(started.body.url);
    const forged = await deliver(
      signedCompletedEvent({
        id: sessionId,
        amount_total: 100,
        payment_intent: 'pi_forged_one_dollar',
        metadata: { quoteId: String(quote.id) },
      }),
    );
    expect(forged.status).toBe(200);
    expect(forged.body.result).toBe('refused');
    const foreign = await deliver(
      signedCompletedEvent({
        id: sessionId,
        amount_total: quote.depositCents,
        payment_intent: 'pi_forged_other',
        metadata: { quoteId: String(other.id) },
      }),
    );
    expect(foreign.body.result).toBe('refused');
    const untouched = await readQuote(quote.id);
    expect(untouched.status).toBe('sent');
    expect(untouched.payments).toEqual([
      expect.objectContaining({ status: 'pending', amountCents: quote.depositCents }),
    ]);
    expect((await readQuote(other.id)).payments).toEqual([]);
    // The genuine payment still goes through, for exactly the deposit.
    await request(paymentsUrl).post(`/_test/sessions/${sessionId}/complete`).expect(200);
    const paid = await pollQuote(quote.id, (q) => q.status === 'deposit-paid');
    expect(paid.payments).toEqual([expect.objectContaining({ status: 'paid', amountCents: quote.depositCents })]);
  });

  it('ten concurrent deliveries for a session it never opened all answer, and record nothing', async () => {
    const quote = await makeSentQuote(counter, 'Unknown session');
    const event = signedCompletedEvent({
      id: `cs_test_never_opened_${crypto.randomBytes(6).toString('hex')}`,
      amount_total: quote.depositCents,
      payment_intent: 'pi_never',
      metadata: { quoteId: String(quote.id) },
    });
    const answers = await Promise.all(Array.from({ length: 10 }, () => deliver(event)));
    expect(answers.map((a) => a.status)).toEqual(Array(10).fill(200));
    expect(answers.every((a) => a.body.result === 'refused')).toBe(true);
    expect(await paymentRows(quote.id)).toEqual([]);
    expect((await readQuote(quote.id)).status).toBe('sent');
  });

  it('ten concurrent deliveries of a real completion apply it once', async () => {
    const quote = await makeSentQuote(counter, 'Concurrent deliveries');
    const started = await checkoutJson(quote.token).expect(200);
    const event = signedCompletedEvent({
      id: sessionIdOf(started.body.url),
      amount_total: quote.depositCents,
      payment_intent: `pi_test_${crypto.randomBytes(6).toString('hex')}`,
      client_reference_id: String(quote.id),
      metadata: { quoteId: String(quote.id) },
    });
    const answers = await Promise.all(Array.from({ length: 10 }, () => deliver(event)));
    expect(answers.map((a) => a.status)).toEqual(Array(10).fill(200));
    expect(answers.filter((a) => a.body.result === 'applied')).toHaveLength(1);
    expect(answers.filter((a) => a.body.result === 'already')).toHaveLength(9);
    const paid = await readQuote(quote.id);
    expect(paid).toMatchObject({ status: 'deposit-paid', paidCents: quote.depositCents });
    const audits = await sequelize.query<{ n: number }>(
      "SELECT COUNT(*) AS n FROM audit_log WHERE action = 'payment.received' AND entity_id = ?",
      { replacements: [String(quote.id)], type: QueryTypes.SELECT },
    );
    expect(Number(audits[0].n)).toBe(1);
  });
});

describe('valid-until is enforced', () => {
  it('a quote past its valid-until date cannot be accepted or paid, and its page says how to get a fresh one', async () => {
    const quote = await makeSentQuote(counter, 'Lapsed quote', { validUntil: dayFromToday(-2) });
    const page = await request(appUrl).get(`/q/${quote.token}`);
    expect(page.status).toBe(200);
    expect(page.text).toContain('can no longer be accepted or paid');
    expect(page.text).toContain('fresh quote');
    expect(page.text).not.toContain('Accept and pay the deposit');
    const refused = await checkoutJson(quote.token);
    expect(refused.status).toBe(409);
    expect(refused.body.state).toMatchObject({ status: 'sent', expired: true, validUntil: dayFromToday(-2) });
    expect((await request(appUrl).post(`/api/q/${quote.token}/checkout`)).status).toBe(409);
    expect(await paymentRows(quote.id)).toEqual([]);
  });

  it('a quote still inside its date shows it and can be paid', async () => {
    const quote = await makeSentQuote(counter, 'Current quote', { validUntil: dayFromToday(2) });
    const page = await request(appUrl).get(`/q/${quote.token}`);
    expect(page.text).toContain('Valid until');
    expect(page.text).toContain('Accept and pay the deposit');
    expect((await checkoutJson(quote.token)).status).toBe(200);
  });
});
