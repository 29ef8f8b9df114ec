import crypto from 'node:crypto';
import type Stripe from 'stripe';
import request from 'supertest';
import { towingTruck } from '@/lib/builds/sample-trucks';
import type { QuoteLineRecord, QuoteRecord } from '@/lib/quotes/types';
import { readRuntime } from './runtime';
import { DEMO } from './demo';

// Quotes a test owns from start to finish: its own customer (a unique invented e-mail), build and quote,
// made through the API as counter staff would, optionally sent so the private link is known.
type Agent = ReturnType<typeof request.agent>;
export type FixtureQuote = {
  id: number;
  number: string;
  version: number;
  depositCents: number;
  totalCents: number;
  customerEmail: string;
  token: string | null;
  buildId: number;
};

/** YYYY-MM-DD, days from today (UTC); negative for the past. */
export const dayFromToday = (days: number) => new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10);

// A stock 5.3 L towing truck (figures approximate, from memory), the shape the interview form sends.
export const truckProfile = towingTruck;

export const FIXTURE_CAM_ID = DEMO.cams.bigTruck219; // a seeded truck cam the demo's rules price for this build

/** A draft on a build of its own: `profile` (default truckProfile()) and the fixture cam, priced by the shop's rules. */
export async function makeDraftQuote(
  staff: Agent,
  label: string,
  options: { validUntil?: string; extraLines?: unknown[]; customerName?: string; profile?: object } = {},
): Promise<FixtureQuote> {
  const customerEmail = `${label.toLowerCase().replace(/[^a-z0-9]+/g, '-')}-${crypto.randomBytes(4).toString('hex')}@example.com`;
  const build = await staff.post('/api/builds').send({
    customer: { name: options.customerName ?? `Fixture ${label}`, email: customerEmail },
    vehicleLabel: `Fixture truck (${label})`,
    profile: options.profile ?? truckProfile(),
  });
  if (build.status !== 201) throw new Error(`build fixture answered ${build.status}: ${JSON.stringify(build.body)}`);
  const made = await staff.post('/api/quotes').send({
    buildId: build.body.id,
    camId: FIXTURE_CAM_ID,
    ...(options.extraLines ? { extraLines: options.extraLines } : {}),
  });
  if (made.status !== 201) throw new Error(`quote fixture answered ${made.status}: ${JSON.stringify(made.body)}`);
  let quote = made.body;
  if (options.validUntil) {
    const dated = await staff
      .patch(`/api/quotes/${quote.id}`)
      .send({ version: quote.version, validUntil: options.validUntil });
    if (dated.status !== 200)
      throw new Error(`validUntil fixture answered ${dated.status}: ${JSON.stringify(dated.body)}`);
    quote = dated.body;
  }
  return {
    id: quote.id,
    number: quote.number,
    version: quote.version,
    depositCents: quote.depositCents,
    totalCents: quote.totalCents,
    customerEmail,
    token: null,
    buildId: build.body.id,
  };
}

/** A draft sent to its customer; the private token is read back from the mail fake. */
export async function makeSentQuote(
  staff: Agent,
  label: string,
  options: { validUntil?: string; customerName?: string } = {},
): Promise<FixtureQuote & { token: string }> {
  const { appUrl, mailUrl } = readRuntime();
  const draft = await makeDraftQuote(staff, label, options);
  const sent = await staff.post(`/api/quotes/${draft.id}/send`);
  if (sent.status !== 200) throw new Error(`send fixture answered ${sent.status}: ${JSON.stringify(sent.body)}`);
  const messages = (await request(mailUrl).get('/messages').query({ to: draft.customerEmail })).body as {
    subject: string;
    text: string;
  }[];
  const mail = messages.find((m) => m.subject.includes(draft.number));
  const match = mail && new RegExp(`${appUrl.replace(/[.:/]/g, '\\$&')}/q/([A-Za-z0-9_-]+)`).exec(mail.text);
  if (!match) throw new Error(`no quote link e-mailed to ${draft.customerEmail}`);
  return { ...draft, version: sent.body.version, token: match[1] };
}

/** Pays a sent quote's deposit through the payments fake and waits until the webhook has recorded it. */
export async function payDeposit(staff: Agent, quote: FixtureQuote & { token: string }): Promise<void> {
  await completeCheckout(await startCheckout(quote.token));
  await waitForQuote(staff, quote.id, (q) => q.status === 'deposit-paid');
}

/** Starts the deposit checkout from the customer's private link, as the pay button does; the session's id. */
export async function startCheckout(token: string): Promise<string> {
  const { appUrl } = readRuntime();
  const started = await request(appUrl).post(`/api/q/${token}/checkout`).set('Accept', 'application/json');
  if (started.status !== 200)
    throw new Error(`checkout fixture answered ${started.status}: ${JSON.stringify(started.body)}`);
  return new URL(started.body.url).pathname.split('/').pop()!;
}

/** The customer pays on the payments fake's page; returns the signed event it sent to the app's webhook. */
export async function completeCheckout(sessionId: string): Promise<Stripe.Event> {
  const done = await request(readRuntime().paymentsUrl).post(`/_test/sessions/${sessionId}/complete`);
  if (done.status !== 200) throw new Error(`payment fixture answered ${done.status}: ${JSON.stringify(done.body)}`);
  return done.body.event as Stripe.Event;
}

/** Reads the quote until `until` holds; throws after `timeoutMs` (webhooks arrive after the payment). */
export async function waitForQuote(
  staff: Agent,
  id: number,
  until: (quote: QuoteRecord) => boolean,
  timeoutMs = 15_000,
): Promise<QuoteRecord> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const quote = (await staff.get(`/api/quotes/${id}`)).body as QuoteRecord;
    if (until(quote)) return quote;
    if (Date.now() > deadline)
      throw new Error(`quote ${quote.number ?? id} never reached the expected state (now ${quote.status})`);
    await new Promise((r) => setTimeout(r, 150));
  }
}

/** A sent quote whose deposit the customer has paid, with the checkout session and the webhook event that recorded it. */
export async function makeDepositPaidQuote(staff: Agent, label: string, options: { customerName?: string } = {}) {
  const sent = await makeSentQuote(staff, label, options);
  const sessionId = await startCheckout(sent.token);
  const event = await completeCheckout(sessionId);
  const quote = await waitForQuote(staff, sent.id, (q) => q.status === 'deposit-paid');
  return { ...sent, quote, sessionId, event };
}

/** A stored line as the quote page sends it back in a PATCH (the fields staff may type). */
export const editableLine = (l: QuoteLineRecord) => ({
  kind: l.kind,
  description: l.description,
  quantity: l.quantity,
  unitPriceCents: l.unitPriceCents,
  discountCents: l.discountCents,
  camId: l.camId,
  partId: l.partId,
  laborOperationId: l.laborOperationId,
});
