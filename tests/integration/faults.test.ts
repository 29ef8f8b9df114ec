import { spawn, type ChildProcess } from 'node:child_process';
import crypto from 'node:crypto';
import fs from 'node:fs';
import net from 'node:net';
import path from 'node:path';
import { QueryTypes, type Sequelize } from 'sequelize';
import Stripe from 'stripe';
import request from 'supertest';
import { signedInAgent } from '../support/auth';
import { connectTestDatabase, disconnectTestDatabase } from '../support/database';
import { waitForMailsTo } from '../support/mail';
import { makeDraftQuote, makeSentQuote } from '../support/quote-fixtures';
import { RUNTIME_FILE, readRuntime, type TestRuntime } from '../support/runtime';
import type { QuoteRecord } from '@/lib/quotes/types';

// Bad luck (issue 13 item 12): the payments service away while a customer pays the deposit, the mail
// service away while a quote is sent, and two app instances receiving the same webhook at once. (MariaDB
// away: database-outage.test.ts.)
const ROOT = path.resolve(__dirname, '../..');
const runtime = readRuntime();
const { appUrl, mailUrl, paymentsUrl, env } = runtime;
const stripe = new Stripe(env.STRIPE_SECRET_KEY, {
  host: '127.0.0.1',
  port: Number(env.STRIPE_API_PORT),
  protocol: 'http',
});

let sequelize: Sequelize;
let counter: Awaited<ReturnType<typeof signedInAgent>>;
const customers: string[] = [];

beforeAll(async () => {
  sequelize = connectTestDatabase();
  counter = await signedInAgent('counter');
});
afterAll(async () => {
  for (const email of customers) {
    await sequelize.query(
      'DELETE p FROM payments p JOIN quotes q ON q.id = p.quote_id JOIN customers c ON c.id = q.customer_id WHERE c.email = ?',
      { replacements: [email] },
    );
    await sequelize.query('DELETE q FROM quotes q JOIN customers c ON c.id = q.customer_id WHERE c.email = ?', {
      replacements: [email],
    });
    await sequelize.query('DELETE FROM customers WHERE email = ?', { replacements: [email] });
  }
  await disconnectTestDatabase();
});

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = net.createServer();
    server.on('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const { port } = server.address() as net.AddressInfo;
      server.close(() => resolve(port));
    });
  });
}

async function waitFor(url: string, ok: (status: number | null) => boolean, timeoutMs: number): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const status = await fetch(url).then(
      (r) => r.status,
      () => null,
    );
    if (ok(status)) return;
    if (Date.now() > deadline)
      throw new Error(`${url} did not reach the expected state in ${timeoutMs} ms (last: ${status})`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

/**
 * Stops one of the suite's fakes (its own process group), runs `whileAway`, then starts it again on the same
 * port and data and records its new pid for the global teardown.
 */
async function withFakeAway(index: number, name: string, healthUrl: string, whileAway: () => Promise<void>) {
  const oldPid = readRuntime().pids[index];
  process.kill(-oldPid, 'SIGTERM');
  await waitFor(healthUrl, (s) => s === null, 10_000);
  try {
    await whileAway();
  } finally {
    const restarted = startDetached(`${name}-restarted`, [`docker-local/${name}/server.mjs`]);
    const updated: TestRuntime = {
      ...readRuntime(),
      pids: readRuntime().pids.map((pid) => (pid === oldPid ? restarted.pid! : pid)),
    };
    fs.writeFileSync(RUNTIME_FILE, JSON.stringify(updated, null, 2));
    await waitFor(healthUrl, (s) => s === 200, 15_000);
  }
}

/** Starts a detached server like the global setup does, logging under var/test/logs. */
function startDetached(name: string, args: string[], extraEnv: Record<string, string> = {}): ChildProcess {
  const out = fs.openSync(path.join(ROOT, 'var/test/logs', `${name}.log`), 'w');
  const child = spawn(process.execPath, args, {
    cwd: ROOT,
    env: { ...process.env, ...env, ...extraEnv },
    stdio: ['ignore', out, out],
    detached: true,
  });
  child.unref();
  return child;
}

const readQuote = async (id: number) => (await counter.get(`/api/quotes/${id}`)).body as QuoteRecord;
const sessionIdOf = (url: string) => new URL(url).pathname.split('/').pop()!;

describe('the payments service is away while a customer pays the deposit', () => {
  it('answers 502 with a clear message, changes nothing, and the same link pays once the service is back', async () => {
    const quote = await makeSentQuote(counter, 'Payments away');
    customers.push(quote.customerEmail);
    const before = await readQuote(quote.id);

    // Stop the suite's payments fake (global setup's second process), then start it again on the same port and data.
    await withFakeAway(1, 'payments-fake', `${paymentsUrl}/health`, async () => {
      const json = await request(appUrl).post(`/api/q/${quote.token}/checkout`).set('Accept', 'application/json');
      expect(json.status).toBe(502);
      expect(json.body.message).toMatch(/payment service did not answer.*Nothing was charged.*try again/i);
      const form = await request(appUrl).post(`/api/q/${quote.token}/checkout`);
      expect(form.status).toBe(502);
      expect(form.text).toMatch(/Nothing was charged/);
      const after = await readQuote(quote.id);
      expect(after).toMatchObject({ status: before.status, version: before.version, paidCents: 0 });
      expect(after.payments).toEqual([]);
      const page = await request(appUrl).get(`/q/${quote.token}`);
      expect(page.status).toBe(200);
      expect(page.text).toContain('Accept and pay the deposit');
    });

    const started = await request(appUrl)
      .post(`/api/q/${quote.token}/checkout`)
      .set('Accept', 'application/json')
      .expect(200);
    await request(paymentsUrl)
      .post(`/_test/sessions/${sessionIdOf(started.body.url)}/complete`)
      .expect(200);
    const deadline = Date.now() + 15_000;
    let paid = await readQuote(quote.id);
    while (paid.status !== 'deposit-paid' && Date.now() < deadline) {
      await new Promise((r) => setTimeout(r, 150));
      paid = await readQuote(quote.id);
    }
    expect(paid).toMatchObject({ status: 'deposit-paid', paidCents: quote.depositCents });
  });
});

describe('the mail service is away while a quote is sent', () => {
  it('answers 502, leaves the draft as it was with no link and no audit, and sends once the service is back', async () => {
    const draft = await makeDraftQuote(counter, 'Mail away');
    customers.push(draft.customerEmail);
    const before = await readQuote(draft.id);
    const sentAudits = async () =>
      (
        await sequelize.query<{ n: number }>(
          "SELECT COUNT(*) AS n FROM audit_log WHERE action = 'quote.sent' AND entity_type = 'quote' AND entity_id = ?",
          { replacements: [draft.id], type: QueryTypes.SELECT },
        )
      )[0].n;

    // The mail fake is global setup's first process.
    await withFakeAway(0, 'mail-fake', `${mailUrl}/health`, async () => {
      const sent = await counter.post(`/api/quotes/${draft.id}/send`);
      expect(sent.status).toBe(502);
      expect(sent.body.message).toEqual(expect.any(String));
      const after = await readQuote(draft.id);
      expect(after).toMatchObject({ status: 'draft', version: before.version });
      const [row] = await sequelize.query<{ hash: string | null; sentAt: Date | null }>(
        'SELECT public_token_hash AS hash, sent_at AS sentAt FROM quotes WHERE id = ?',
        { replacements: [draft.id], type: QueryTypes.SELECT },
      );
      expect(row).toEqual({ hash: null, sentAt: null });
      expect(Number(await sentAudits())).toBe(0);
    });

    await counter.post(`/api/quotes/${draft.id}/send`).expect(200);
    expect((await readQuote(draft.id)).status).toBe('sent');
    expect(Number(await sentAudits())).toBe(1);
    const [mail] = await waitForMailsTo(draft.customerEmail);
    expect(mail.subject).toContain(draft.number);
  });
});

describe('two app instances receive the same webhook at once', () => {
  let second: ChildProcess;
  let secondUrl: string;

  beforeAll(async () => {
    const port = await freePort();
    secondUrl = `http://127.0.0.1:${port}`;
    second = startDetached('app-second', [
      '--max-semi-space-size=64',
      'node_modules/next/dist/bin/next',
      'start',
      '-H',
      '127.0.0.1',
      '-p',
      String(port),
    ]);
    await waitFor(`${secondUrl}/api/health`, (s) => s === 200, 60_000);
  }, 90_000);
  afterAll(() => {
    try {
      process.kill(-second.pid!, 'SIGTERM');
    } catch {
      // already gone
    }
  });

  it('records one payment and one audit row for ten deliveries split across both', async () => {
    const quote = await makeSentQuote(counter, 'Two instances');
    customers.push(quote.customerEmail);
    const started = await request(appUrl)
      .post(`/api/q/${quote.token}/checkout`)
      .set('Accept', 'application/json')
      .expect(200);
    const body = JSON.stringify({
      id: `evt_test_${crypto.randomBytes(8).toString('hex')}`,
      object: 'event',
      type: 'checkout.session.completed',
      created: Math.floor(Date.now() / 1000),
      data: {
        object: {
          object: 'checkout.session',
          id: sessionIdOf(started.body.url),
          status: 'complete',
          payment_status: 'paid',
          currency: 'usd',
          amount_total: quote.depositCents,
          payment_intent: `pi_test_${crypto.randomBytes(6).toString('hex')}`,
          client_reference_id: String(quote.id),
          metadata: { quoteId: String(quote.id) },
        },
      },
    });
    const signature = stripe.webhooks.generateTestHeaderString({ payload: body, secret: env.STRIPE_WEBHOOK_SECRET });
    const answers = await Promise.all(
      Array.from({ length: 10 }, (_, i) =>
        request(i % 2 ? secondUrl : appUrl)
          .post('/api/payments/webhook')
          .set('Stripe-Signature', signature)
          .set('content-type', 'application/json')
          .send(body),
      ),
    );
    expect(answers.map((a) => a.status)).toEqual(Array(10).fill(200));
    expect(answers.filter((a) => a.body.result === 'applied')).toHaveLength(1);
    const rows = await sequelize.query<{ status: string }>('SELECT status FROM payments WHERE quote_id = ?', {
      replacements: [quote.id],
      type: QueryTypes.SELECT,
    });
    expect(rows).toEqual([{ status: 'paid' }]);
    const audits = await sequelize.query<{ n: number }>(
      "SELECT COUNT(*) AS n FROM audit_log WHERE action = 'payment.received' AND entity_id = ?",
      { replacements: [String(quote.id)], type: QueryTypes.SELECT },
    );
    expect(Number(audits[0].n)).toBe(1);
    expect(await readQuote(quote.id)).toMatchObject({ status: 'deposit-paid', paidCents: quote.depositCents });
  });
});
