import { QueryTypes, type Sequelize } from 'sequelize';
import Stripe from 'stripe';
import request from 'supertest';
import { signedInAgent } from '../support/auth';
import { connectTestDatabase, disconnectTestDatabase } from '../support/database';
import { makePaidJob } from '../support/job-fixtures';
import { waitForMailsTo, type Mail } from '../support/mail';
import { pdfText } from '../support/pdf-text';
import { readRuntime } from '../support/runtime';
import { FIXTURE_CAM_ID } from '../support/quote-fixtures';
import type { QuoteRecord } from '@/lib/quotes/types';
import { postRefund } from '../support/refunds';

// The balance (issue 12, item 7) over HTTP against the real build, MariaDB and both fakes: the balance
// due once the deposit is paid, money taken at the counter, the pay-the-balance e-mail and its checkout
// (exactly once, like the deposit), and the quote closing when nothing is left to pay.
const { appUrl, paymentsUrl, env } = readRuntime();
const stripe = new Stripe(env.STRIPE_SECRET_KEY, {
  host: '127.0.0.1',
  port: Number(env.STRIPE_API_PORT),
  protocol: 'http',
});

type Agent = Awaited<ReturnType<typeof signedInAgent>>;
type Quote = QuoteRecord;
type MailWithFiles = Mail & { attachments?: { filename: string; size: number }[] };

let sequelize: Sequelize;
let counter: Agent;
let manager: Agent;
let tech: Agent;

beforeAll(async () => {
  sequelize = connectTestDatabase();
  [counter, manager, tech] = await Promise.all([
    signedInAgent('counter'),
    signedInAgent('manager'),
    signedInAgent('tech'),
  ]);
});
afterAll(() => disconnectTestDatabase());

const readQuote = async (id: number) => (await counter.get(`/api/quotes/${id}`)).body as Quote;
const sessionIdOf = (url: string) => new URL(url).pathname.split('/').pop()!;
const pay = (quote: Pick<Quote, 'id' | 'version'>, amountCents: number, method = 'cash', agent = counter) =>
  agent.post(`/api/quotes/${quote.id}/payments`).send({ version: quote.version, amountCents, method });

async function pollQuote(id: number, until: (q: Quote) => boolean, timeoutMs = 15_000): Promise<Quote> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const q = await readQuote(id);
    if (until(q) || Date.now() > deadline) return q;
    await new Promise((r) => setTimeout(r, 150));
  }
}

async function audits(quoteId: number, action: string) {
  return sequelize.query<{ actor: string; after: unknown }>(
    'SELECT actor, `after` FROM audit_log WHERE action = :action AND entity_type = :type AND entity_id = :id ORDER BY id',
    {
      replacements: { action, type: 'quote', id: String(quoteId) },
      type: QueryTypes.SELECT,
    },
  );
}
const parsed = (v: unknown) => (typeof v === 'string' ? JSON.parse(v) : v) as Record<string, unknown>;

async function mailWith(email: string, subject: RegExp, count = 1): Promise<MailWithFiles[]> {
  const deadline = Date.now() + 10_000;
  for (;;) {
    const found = ((await waitForMailsTo(email)) as MailWithFiles[]).filter((m) => subject.test(m.subject));
    if (found.length >= count || Date.now() > deadline) return found;
    await new Promise((r) => setTimeout(r, 150));
  }
}

describe('the balance due once the deposit is paid', () => {
  it('is the total less the deposit, in cents, on the quote', async () => {
    const job = await makePaidJob(counter, 'Balance shown');
    const quote = await readQuote(job.id);
    expect(quote.status).toBe('deposit-paid');
    expect(quote.depositPaidCents).toBe(job.depositCents);
    expect(quote.balancePaidCents).toBe(0);
    expect(quote.balanceDueCents).toBe(job.totalCents - job.depositCents);
    expect(quote.balanceDueCents).toBeGreaterThan(0);
  });

  it('adds back a part refund of the deposit', async () => {
    const job = await makePaidJob(counter, 'Balance after refund');
    const refunded = await postRefund(manager, job.id, { amountCents: 2_500 });
    expect(refunded.status).toBe(200);
    expect(refunded.body.balanceDueCents).toBe(job.totalCents - job.depositCents + 2_500);
  });
});

describe('money taken at the counter', () => {
  it('records a part payment with who and when, audited, e-mails a receipt PDF, and refuses the same form twice', async () => {
    const job = await makePaidJob(counter, 'Counter part');
    const before = await readQuote(job.id);
    const first = await pay(before, 10_000, 'card-present');
    expect(first.status).toBe(201);
    expect(first.body).toMatchObject({
      status: 'deposit-paid',
      balancePaidCents: 10_000,
      balanceDueCents: before.balanceDueCents - 10_000,
    });
    const payment = (first.body as Quote).payments.find((p) => p.purpose === 'balance')!;
    expect(payment).toMatchObject({
      status: 'paid',
      method: 'card-present',
      amountCents: 10_000,
      providerSessionId: null,
    });
    expect(payment.recordedBy?.name).toEqual(expect.any(String));
    const [row] = await sequelize.query<{ recorded_by_user_id: number; paid_at: Date; provider: string }>(
      'SELECT recorded_by_user_id, paid_at, provider FROM payments WHERE id = ?',
      { replacements: [payment.id], type: QueryTypes.SELECT },
    );
    expect(row.recorded_by_user_id).toEqual(expect.any(Number));
    expect(row.paid_at).not.toBeNull();
    expect(row.provider).toBe('counter');
    const audit = await audits(job.id, 'payment.counter-recorded');
    expect(audit).toHaveLength(1);
    expect(audit[0].actor).toBe('counter@lobewise.test');
    expect(parsed(audit[0].after)).toMatchObject({
      paymentId: payment.id,
      amountCents: 10_000,
      method: 'card-present',
    });

    // The same form sent again (a double click) carries the old version: refused, nothing recorded.
    const again = await pay(before, 10_000, 'card-present');
    expect(again.status).toBe(409);
    expect(again.body.current.balancePaidCents).toBe(10_000);
    expect((await readQuote(job.id)).payments.filter((p) => p.purpose === 'balance')).toHaveLength(1);

    const [mail] = await mailWith(job.customerEmail, /^Payment received for quote/);
    expect(mail.text).toContain('$100.00');
    expect(mail.text).toMatch(/still left to pay/);
    expect(mail.attachments?.map((a) => a.filename)).toEqual([`receipt-${job.number}-P${payment.id}.pdf`]);
  });

  it('closes the quote when the rest is paid, e-mails the receipt and the final invoice, and takes nothing more', async () => {
    const job = await makePaidJob(counter, 'Counter full');
    const quote = await readQuote(job.id);
    const paid = await pay(quote, quote.balanceDueCents, 'cash');
    expect(paid.status).toBe(201);
    expect(paid.body).toMatchObject({ status: 'closed', balanceDueCents: 0 });
    expect(paid.body.closedAt).not.toBeNull();
    const moves = (await audits(job.id, 'quote.transition')).map((r) => parsed(r.after));
    expect(moves.at(-1)).toMatchObject({ status: 'closed', via: 'payment' });

    const [mail] = await mailWith(job.customerEmail, /^Paid in full: quote/);
    expect(mail.text).toContain('paid in full');
    expect(mail.attachments?.map((a) => a.filename).sort()).toEqual(
      [`invoice-${job.number}-I.pdf`, `receipt-${job.number}-P${(paid.body as Quote).payments.at(-1)!.id}.pdf`].sort(),
    );
    expect(mail.attachments!.every((a) => a.size > 1_000)).toBe(true);

    const more = await pay(paid.body as Quote, 100, 'cash');
    expect(more.status).toBe(409);
    expect(more.body.message).toMatch(/balance paid, closed/i);
  });

  it('refuses more than is due, a bad method, a missing version, and technicians', async () => {
    const job = await makePaidJob(counter, 'Counter refusals');
    const quote = await readQuote(job.id);
    const over = await pay(quote, quote.balanceDueCents + 1);
    expect(over.status).toBe(422);
    expect(over.body.errors).toEqual([expect.objectContaining({ field: 'amountCents' })]);
    const method = await counter
      .post(`/api/quotes/${job.id}/payments`)
      .send({ version: quote.version, amountCents: 100, method: 'online' });
    expect(method.status).toBe(422);
    expect(method.body.errors).toEqual([expect.objectContaining({ field: 'method' })]);
    const fraction = await counter
      .post(`/api/quotes/${job.id}/payments`)
      .send({ version: quote.version, amountCents: 10.5, method: 'cash' });
    expect(fraction.body.errors).toEqual([expect.objectContaining({ field: 'amountCents' })]);
    const noVersion = await counter.post(`/api/quotes/${job.id}/payments`).send({ amountCents: 100, method: 'cash' });
    expect(noVersion.body.errors).toEqual([expect.objectContaining({ field: 'version' })]);
    expect((await pay(quote, 100, 'cash', tech)).status).toBe(403);
    expect((await readQuote(job.id)).payments.filter((p) => p.purpose === 'balance')).toEqual([]);
  });

  it('is refused before the deposit is paid, and a hand close is refused while a balance is due', async () => {
    const job = await makePaidJob(counter, 'Counter order');
    const quote = await readQuote(job.id);
    const close = await counter.post(`/api/quotes/${job.id}/transition`).send({ to: 'closed', version: quote.version });
    expect(close.status).toBe(409);
    expect(close.body.message).toMatch(/still has a balance/);
    expect(close.body.state.status).toBe('deposit-paid');
    const draft = await counter.post('/api/quotes').send({ buildId: job.buildId, camId: FIXTURE_CAM_ID });
    const early = await pay(draft.body, 100);
    expect(early.status).toBe(409);
    expect(early.body.message).toMatch(/once the deposit is paid/);
  });
});

describe('the pay-the-balance link', () => {
  it('e-mails a private link; its page takes the balance online once, and the quote closes', async () => {
    const job = await makePaidJob(counter, 'Balance online');
    const quote = await readQuote(job.id);
    // Before staff ask for it, the customer cannot open a balance checkout.
    const early = await request(appUrl).post(`/api/q/${job.token}/balance-checkout`).set('Accept', 'application/json');
    expect(early.status).toBe(409);

    const asked = await counter.post(`/api/quotes/${job.id}/balance-request`).send({ version: quote.version });
    expect(asked.status).toBe(200);
    expect(asked.body.balanceRequestedAt).not.toBeNull();
    expect((await audits(job.id, 'quote.balance-requested')).length).toBe(1);
    const [mail] = await mailWith(job.customerEmail, /left to pay on quote/);
    expect(mail.subject).toContain(job.number);
    const link = /(http:\/\/\S+\/q\/([A-Za-z0-9_-]+))/.exec(mail.text)!;
    expect(link[2]).not.toBe(job.token);
    const page = await request(appUrl).get(new URL(link[1]).pathname);
    expect(page.status).toBe(200);
    expect(page.text).toContain('Job done — balance to pay');
    expect(page.text).toContain('Pay the balance of');
    // The quote's first link keeps working too.
    expect((await request(appUrl).get(`/q/${job.token}`)).status).toBe(200);

    const first = await request(appUrl).post(`/api/q/${link[2]}/balance-checkout`).set('Accept', 'application/json');
    const second = await request(appUrl).post(`/api/q/${link[2]}/balance-checkout`).set('Accept', 'application/json');
    expect(first.status).toBe(200);
    expect(second.body).toEqual({ url: first.body.url, reused: true });
    const session = await stripe.checkout.sessions.retrieve(sessionIdOf(first.body.url));
    expect(session.amount_total).toBe(quote.balanceDueCents);
    expect(session.metadata).toMatchObject({ quoteId: String(job.id), purpose: 'balance' });

    const done = await request(paymentsUrl)
      .post(`/_test/sessions/${sessionIdOf(first.body.url)}/complete`)
      .expect(200);
    const closed = await pollQuote(job.id, (q) => q.status === 'closed');
    expect(closed).toMatchObject({ status: 'closed', balanceDueCents: 0, balancePaidCents: quote.balanceDueCents });
    expect(closed.payments.filter((p) => p.purpose === 'balance')).toEqual([
      expect.objectContaining({ status: 'paid', method: 'online' }),
    ]);
    const [receipt] = await mailWith(job.customerEmail, /^Paid in full/);
    expect(receipt.attachments?.map((a) => a.filename)).toContain(`invoice-${job.number}-I.pdf`);

    // The same event delivered again changes nothing; a checkout now is refused.
    const replay = JSON.stringify(done.body.event);
    const again = await request(appUrl)
      .post('/api/payments/webhook')
      .set(
        'Stripe-Signature',
        stripe.webhooks.generateTestHeaderString({ payload: replay, secret: env.STRIPE_WEBHOOK_SECRET }),
      )
      .set('content-type', 'application/json')
      .send(replay);
    expect(again.body.result).toBe('already');
    expect((await mailWith(job.customerEmail, /^Paid in full/)).length).toBe(1);
    const after = await request(appUrl).post(`/api/q/${link[2]}/balance-checkout`).set('Accept', 'application/json');
    expect(after.status).toBe(409);
    expect(after.body.message).toMatch(/paid in full/);
  });

  it('gives back at once a balance paid online after the money was taken at the counter', async () => {
    const job = await makePaidJob(counter, 'Balance raced');
    const quote = await readQuote(job.id);
    await counter.post(`/api/quotes/${job.id}/balance-request`).send({ version: quote.version }).expect(200);
    const started = await request(appUrl)
      .post(`/api/q/${job.token}/balance-checkout`)
      .set('Accept', 'application/json');
    expect(started.status).toBe(200);
    // A counter payment that raced past the open checkout (the route itself expires open checkouts first).
    await sequelize.query(
      "INSERT INTO payments (quote_id, provider, amount_cents, refunded_cents, currency, status, paid_at, purpose, method, created_at, updated_at) VALUES (?, 'counter', ?, 0, 'usd', 'paid', NOW(), 'balance', 'cash', NOW(), NOW())",
      { replacements: [job.id, quote.balanceDueCents] },
    );
    await request(paymentsUrl)
      .post(`/_test/sessions/${sessionIdOf(started.body.url)}/complete`)
      .expect(200);
    const after = await pollQuote(job.id, (q) =>
      q.payments.some((p) => p.providerSessionId === sessionIdOf(started.body.url) && p.status === 'refunded'),
    );
    const online = after.payments.find((p) => p.providerSessionId === sessionIdOf(started.body.url))!;
    expect(online).toMatchObject({
      status: 'refunded',
      refundedCents: quote.balanceDueCents,
      duplicateOfPaymentId: expect.any(Number),
    });
    expect(after.balancePaidCents).toBe(quote.balanceDueCents);
    const session = await stripe.checkout.sessions.retrieve(sessionIdOf(started.body.url), {
      expand: ['payment_intent'],
    });
    const charge = await stripe.charges.retrieve(
      (session.payment_intent as Stripe.PaymentIntent).latest_charge as string,
    );
    expect(charge.amount_refunded).toBe(quote.balanceDueCents);
    expect((await audits(job.id, 'payment.balance-refunded')).length).toBe(1);
  });

  it('a counter payment expires the open online checkout, so the customer cannot pay twice', async () => {
    const job = await makePaidJob(counter, 'Balance expired by counter');
    let quote = await readQuote(job.id);
    quote = (await counter.post(`/api/quotes/${job.id}/balance-request`).send({ version: quote.version }).expect(200))
      .body;
    const started = await request(appUrl)
      .post(`/api/q/${job.token}/balance-checkout`)
      .set('Accept', 'application/json');
    expect((await pay(quote, 5_000)).status).toBe(201);
    expect((await stripe.checkout.sessions.retrieve(sessionIdOf(started.body.url))).status).toBe('expired');
    // The next checkout asks for what is left now.
    const next = await request(appUrl).post(`/api/q/${job.token}/balance-checkout`).set('Accept', 'application/json');
    expect(next.body.reused).toBe(false);
    expect((await stripe.checkout.sessions.retrieve(sessionIdOf(next.body.url))).amount_total).toBe(
      quote.balanceDueCents - 5_000,
    );
  });

  it('answers 422 naming a missing version, 409 for a stale one, 403 for technicians', async () => {
    const job = await makePaidJob(counter, 'Balance request refusals');
    const quote = await readQuote(job.id);
    expect((await counter.post(`/api/quotes/${job.id}/balance-request`).send({})).body.errors).toEqual([
      expect.objectContaining({ field: 'version' }),
    ]);
    expect(
      (await counter.post(`/api/quotes/${job.id}/balance-request`).send({ version: quote.version - 1 })).status,
    ).toBe(409);
    expect((await tech.post(`/api/quotes/${job.id}/balance-request`).send({ version: quote.version })).status).toBe(
      403,
    );
  });
});

describe('receipts and the final invoice', () => {
  it('makes a receipt per payment and the invoice only once paid in full, from the quote as sent, for staff and the customer', async () => {
    const job = await makePaidJob(counter, 'Documents');
    let quote = await readQuote(job.id);
    const deposit = quote.payments.find((p) => p.purpose === 'deposit' && p.status === 'paid')!;
    const receipt = await counter.get(`/api/quotes/${job.id}/payments/${deposit.id}/receipt`).buffer(true);
    expect(receipt.status).toBe(200);
    expect(receipt.headers['content-type']).toBe('application/pdf');
    const receiptText = pdfText(receipt.body as Buffer);
    expect(receiptText).toContain(`Receipt ${job.number}-P${deposit.id}`);
    expect(receiptText).toContain(`$${(job.depositCents / 100).toLocaleString('en-US', { minimumFractionDigits: 2 })}`);
    expect(receiptText).toContain('Paid online by card');

    expect((await counter.get(`/api/quotes/${job.id}/invoice`)).status).toBe(409);
    expect((await request(appUrl).get(`/api/q/${job.token}/invoice`)).status).toBe(409);

    // The catalogue's price of the cam moves after the quote was sent; the invoice keeps the quoted price.
    const [cam] = await sequelize.query<{ price_cents: number }>('SELECT price_cents FROM cams WHERE id = :id', {
      replacements: { id: FIXTURE_CAM_ID },
      type: QueryTypes.SELECT,
    });
    const camLine = (await counter.get(`/api/quotes/${job.id}`)).body.lines.find(
      (l: { kind: string }) => l.kind === 'cam',
    ) as { description: string; totalCents: number };
    quote = (await pay(quote, quote.balanceDueCents, 'card-present')).body;
    await sequelize.query('UPDATE cams SET price_cents = price_cents + 77700 WHERE id = :id', {
      replacements: { id: FIXTURE_CAM_ID },
    });
    try {
      const invoice = await counter.get(`/api/quotes/${job.id}/invoice`).buffer(true);
      expect(invoice.status).toBe(200);
      const text = pdfText(invoice.body as Buffer);
      expect(text).toContain(`Invoice ${job.number}-I`);
      expect(text).toContain('Paid in full');
      expect(text).toContain(camLine.description);
      expect(text).toContain(`$${(camLine.totalCents / 100).toLocaleString('en-US', { minimumFractionDigits: 2 })}`);
      expect(text).not.toContain(
        `$${((Number(cam.price_cents) + 77_700) / 100).toLocaleString('en-US', { minimumFractionDigits: 2 })}`,
      );
      expect(text).toContain('Card at the counter');
      expect(text).toContain(`$${(job.totalCents / 100).toLocaleString('en-US', { minimumFractionDigits: 2 })}`);
      // The customer's own link has the same documents, and nothing of another quote.
      const theirs = await request(appUrl).get(`/api/q/${job.token}/invoice`).buffer(true);
      expect(theirs.status).toBe(200);
      expect(pdfText(theirs.body as Buffer)).toContain(`Invoice ${job.number}-I`);
      const balance = quote.payments.find((p) => p.purpose === 'balance')!;
      expect((await request(appUrl).get(`/api/q/${job.token}/receipts/${balance.id}`)).status).toBe(200);
      expect((await request(appUrl).get(`/api/q/${job.token}/receipts/1`)).status).toBe(404);
    } finally {
      await sequelize.query('UPDATE cams SET price_cents = :price WHERE id = :id', {
        replacements: { price: cam.price_cents, id: FIXTURE_CAM_ID },
      });
    }
  });
});
