// Drives docker-local/payments-fake through the real `stripe` SDK, exactly as the app will,
// and checks that its webhooks pass the SDK's own signature verification.
import fs from 'node:fs';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import os from 'node:os';
import path from 'node:path';
import Stripe from 'stripe';
import { startFakeProcess, stopFakeProcess, type FakeProcess } from '../support/fake-process';

const API_KEY = 'sk_test_suite_only';
const WEBHOOK_SECRET = 'whsec_suite_only';

type Fake = FakeProcess;
type Delivery = { status: string; attempts: { statusCode: number | null }[] };
type Sent = { event: Stripe.Event; delivery: Delivery };
type Received = { body: string; signature: string };

// Stands in for the app's webhook route: records raw bodies and can be told to fail.
function startReceiver() {
  const received: Received[] = [];
  const control = { failNext: 0 };
  const server = http.createServer((req, res) => {
    const chunks: Buffer[] = [];
    req.on('data', (c: Buffer) => chunks.push(c));
    req.on('end', () => {
      if (control.failNext > 0) {
        control.failNext -= 1;
        res.writeHead(503).end();
        return;
      }
      received.push({
        body: Buffer.concat(chunks).toString('utf8'),
        signature: String(req.headers['stripe-signature']),
      });
      res.writeHead(200, { 'Content-Type': 'application/json' }).end('{"received":true}');
    });
  });
  const ready = new Promise<string>((resolve) => {
    server.listen(0, '127.0.0.1', () =>
      resolve(`http://127.0.0.1:${(server.address() as AddressInfo).port}/hooks/payments`),
    );
  });
  return { server, received, control, ready };
}

const startFake = (dataDir: string, webhookUrl: string) =>
  startFakeProcess('payments-fake', {
    PAYMENTS_FAKE_PORT: '0',
    PAYMENTS_FAKE_API_KEY: API_KEY,
    PAYMENTS_FAKE_DATA_DIR: dataDir,
    PAYMENTS_FAKE_WEBHOOK_URL: webhookUrl,
    PAYMENTS_FAKE_WEBHOOK_SECRET: WEBHOOK_SECRET,
    PAYMENTS_FAKE_WEBHOOK_RETRY_MS: '50',
  });

async function waitFor<T>(probe: () => Promise<T | undefined> | T | undefined, what: string): Promise<T> {
  const deadline = Date.now() + 5_000;
  for (;;) {
    const value = await probe();
    if (value !== undefined) return value;
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 25));
  }
}

describe('payments fake via the stripe SDK', () => {
  const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'payments-fake-test-'));
  const receiver = startReceiver();
  let fake: Fake;
  let stripe: Stripe;

  const sdk = (key: string) =>
    new Stripe(key, { host: '127.0.0.1', port: fake.port, protocol: 'http', maxNetworkRetries: 0 });

  const createDeposit = (overrides: Partial<Stripe.Checkout.SessionCreateParams> = {}) =>
    stripe.checkout.sessions.create({
      mode: 'payment',
      line_items: [
        { price_data: { currency: 'usd', unit_amount: 2500, product_data: { name: 'Cam swap deposit' } }, quantity: 2 },
        { price_data: { currency: 'usd', unit_amount: 1000, product_data: { name: 'Dyno slot hold' } }, quantity: 1 },
      ],
      success_url: 'http://app.example.test/quotes/q-101/paid?session={CHECKOUT_SESSION_ID}',
      cancel_url: 'http://app.example.test/quotes/q-101',
      customer_email: 'driver@example.test',
      client_reference_id: 'q-101',
      metadata: { quoteId: 'q-101' },
      payment_intent_data: { metadata: { quoteId: 'q-101' } },
      ...overrides,
    });

  const completeViaTestEndpoint = async (id: string) => {
    const response = await fetch(`${fake.baseUrl}/_test/sessions/${id}/complete`, { method: 'POST' });
    expect(response.status).toBe(200);
    return (await response.json()) as Sent;
  };

  beforeAll(async () => {
    fake = await startFake(dataDir, await receiver.ready);
    stripe = sdk(API_KEY);
  });

  afterAll(async () => {
    if (fake) await stopFakeProcess(fake);
    await new Promise((resolve) => receiver.server.close(resolve));
    fs.rmSync(dataDir, { recursive: true, force: true });
  });

  beforeEach(() => {
    receiver.received.length = 0;
    receiver.control.failNext = 0;
  });

  it('creates and retrieves an open checkout session that points at the hosted page', async () => {
    const session = await createDeposit();
    expect(session.id).toMatch(/^cs_test_/);
    expect(session).toMatchObject({
      object: 'checkout.session',
      mode: 'payment',
      status: 'open',
      payment_status: 'unpaid',
      amount_total: 6000,
      currency: 'usd',
      customer_email: 'driver@example.test',
      client_reference_id: 'q-101',
      metadata: { quoteId: 'q-101' },
      payment_intent: null,
    });
    expect(session.url).toBe(`${fake.baseUrl}/pay/${session.id}`);

    const again = await stripe.checkout.sessions.retrieve(session.id, { expand: ['line_items'] });
    expect(again.id).toBe(session.id);
    expect(again.line_items!.data.map((li) => [li.description, li.quantity, li.amount_total])).toEqual([
      ['Cam swap deposit', 2, 5000],
      ['Dyno slot hold', 1, 1000],
    ]);
  });

  it('rejects an incomplete line item with a parameter error', async () => {
    const bad = createDeposit({
      line_items: [{ price_data: { currency: 'usd', product_data: { name: 'x' } }, quantity: 1 }],
    });
    await expect(bad).rejects.toMatchObject({
      type: 'StripeInvalidRequestError',
      statusCode: 400,
      param: 'line_items[0][price_data][unit_amount]',
    });
  });

  it('completes a session and delivers a webhook the SDK verifies', async () => {
    const session = await createDeposit();
    const sent = await completeViaTestEndpoint(session.id);
    expect(sent.event.type).toBe('checkout.session.completed');
    expect(sent.delivery.status).toBe('delivered');

    expect(receiver.received).toHaveLength(1);
    const { body, signature } = receiver.received[0];
    expect(signature).toMatch(/^t=\d+,v1=[0-9a-f]{64}$/);
    const event = stripe.webhooks.constructEvent(body, signature, WEBHOOK_SECRET);
    expect(event.id).toBe(sent.event.id);
    expect(event.type).toBe('checkout.session.completed');
    const paid = event.data.object as Stripe.Checkout.Session;
    expect(paid).toMatchObject({
      id: session.id,
      status: 'complete',
      payment_status: 'paid',
      metadata: { quoteId: 'q-101' },
    });

    const tampered = body.replace('"amount_total": 6000', '"amount_total": 1');
    expect(tampered).not.toBe(body);
    expect(() => stripe.webhooks.constructEvent(tampered, signature, WEBHOOK_SECRET)).toThrow(
      Stripe.errors.StripeSignatureVerificationError,
    );
    expect(() => stripe.webhooks.constructEvent(body, signature, 'whsec_someone_else')).toThrow(
      Stripe.errors.StripeSignatureVerificationError,
    );

    const retrieved = await stripe.checkout.sessions.retrieve(session.id, { expand: ['payment_intent'] });
    expect(retrieved.status).toBe('complete');
    const intent = retrieved.payment_intent as Stripe.PaymentIntent;
    expect(intent).toMatchObject({
      status: 'succeeded',
      amount: 6000,
      currency: 'usd',
      metadata: { quoteId: 'q-101' },
    });
    expect((await stripe.paymentIntents.retrieve(intent.id)).amount_received).toBe(6000);
  });

  it('refuses to complete a session twice', async () => {
    const session = await createDeposit();
    await completeViaTestEndpoint(session.id);
    const second = await fetch(`${fake.baseUrl}/_test/sessions/${session.id}/complete`, { method: 'POST' });
    expect(second.status).toBe(400);
    expect(((await second.json()) as { error: { type: string } }).error.type).toBe('invalid_request_error');
  });

  it('retries a failed webhook delivery with back-off', async () => {
    receiver.control.failNext = 2;
    const session = await createDeposit();
    const sent = await completeViaTestEndpoint(session.id);
    expect(sent.delivery.status).toBe('pending');

    const entry = await waitFor(async () => {
      const list = (await (await fetch(`${fake.baseUrl}/_test/events`)).json()) as { data: Sent[] };
      const found = list.data.find((e) => e.event.id === sent.event.id);
      return found?.delivery.status === 'delivered' ? found : undefined;
    }, 'the retried delivery');
    expect(entry.delivery.attempts.map((a) => a.statusCode)).toEqual([503, 503, 200]);
    expect(receiver.received).toHaveLength(1);
    expect(
      stripe.webhooks.constructEvent(receiver.received[0].body, receiver.received[0].signature, WEBHOOK_SECRET).id,
    ).toBe(sent.event.id);
  });

  it('refunds part of a payment and refuses more than what is left', async () => {
    const session = await createDeposit();
    await completeViaTestEndpoint(session.id);
    const { payment_intent: intentId } = await stripe.checkout.sessions.retrieve(session.id);

    const partial = await stripe.refunds.create({ payment_intent: intentId as string, amount: 4000 });
    expect(partial).toMatchObject({ object: 'refund', amount: 4000, status: 'succeeded', payment_intent: intentId });
    expect((await stripe.refunds.retrieve(partial.id)).amount).toBe(4000);

    await expect(stripe.refunds.create({ payment_intent: intentId as string, amount: 2001 })).rejects.toMatchObject({
      type: 'StripeInvalidRequestError',
      statusCode: 400,
      code: 'amount_too_large',
      param: 'amount',
    });

    // Without an amount the refund takes whatever is left.
    expect((await stripe.refunds.create({ payment_intent: intentId as string })).amount).toBe(2000);

    const refundEvent = await waitFor(
      () =>
        receiver.received
          .map((r) => stripe.webhooks.constructEvent(r.body, r.signature, WEBHOOK_SECRET))
          .find((e) => e.type === 'charge.refunded' && (e.data.object as Stripe.Charge).refunded),
      'charge.refunded',
    );
    expect((refundEvent.data.object as Stripe.Charge).amount_refunded).toBe(6000);
  });

  it('raises an authentication error for a wrong key', async () => {
    await expect(sdk('sk_test_not_the_key').checkout.sessions.create({ mode: 'payment' })).rejects.toMatchObject({
      type: 'StripeAuthenticationError',
      statusCode: 401,
    });
  });

  it('answers unknown ids with resource_missing', async () => {
    await expect(stripe.checkout.sessions.retrieve('cs_test_does_not_exist')).rejects.toMatchObject({
      type: 'StripeInvalidRequestError',
      statusCode: 404,
      code: 'resource_missing',
    });
    await expect(stripe.refunds.retrieve('re_does_not_exist')).rejects.toMatchObject({
      statusCode: 404,
      code: 'resource_missing',
    });
  });

  it('replays a POST sent twice with the same idempotency key', async () => {
    const first = await createDeposit({ client_reference_id: 'q-idem' });
    const params = {
      mode: 'payment' as const,
      line_items: [{ price_data: { currency: 'usd', unit_amount: 500, product_data: { name: 'Hold' } }, quantity: 1 }],
    };
    const a = await stripe.checkout.sessions.create(params, { idempotencyKey: 'deposit-q-idem' });
    const b = await stripe.checkout.sessions.create(params, { idempotencyKey: 'deposit-q-idem' });
    expect(b.id).toBe(a.id);
    expect(a.id).not.toBe(first.id);
    await expect(
      stripe.checkout.sessions.create(
        { ...params, client_reference_id: 'other' },
        { idempotencyKey: 'deposit-q-idem' },
      ),
    ).rejects.toMatchObject({ type: 'StripeIdempotencyError' });
  });

  it('expires an open session and refuses to expire it again', async () => {
    const session = await createDeposit();
    expect((await stripe.checkout.sessions.expire(session.id)).status).toBe('expired');
    await expect(stripe.checkout.sessions.expire(session.id)).rejects.toMatchObject({ statusCode: 400 });
  });

  it('serves the hosted page and redirects to success_url after paying', async () => {
    const session = await createDeposit();
    const page = await (await fetch(session.url!)).text();
    expect(page).toContain('Pay (test card)');
    expect(page).toContain('Cancel');
    expect(page).toContain('$60.00');

    const cancel = await fetch(`${session.url}/cancel`, { method: 'POST', redirect: 'manual' });
    expect(cancel.status).toBe(303);
    expect(cancel.headers.get('location')).toBe('http://app.example.test/quotes/q-101');

    const pay = await fetch(`${session.url}/complete`, { method: 'POST', redirect: 'manual' });
    expect(pay.status).toBe(303);
    expect(pay.headers.get('location')).toBe(`http://app.example.test/quotes/q-101/paid?session=${session.id}`);
    expect((await stripe.checkout.sessions.retrieve(session.id)).payment_status).toBe('paid');
    const forSession = receiver.received
      .map((r) => JSON.parse(r.body) as Stripe.Event)
      .filter((e) => (e.data.object as { id?: string }).id === session.id);
    expect(forSession.map((e) => e.type)).toEqual(['checkout.session.completed']);
  });
});
