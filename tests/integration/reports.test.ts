import { QueryTypes, type Sequelize } from 'sequelize';
import request from 'supertest';
import { signedInAgent } from '../support/auth';
import { connectTestDatabase, disconnectTestDatabase } from '../support/database';
import { readRuntime } from '../support/runtime';
import { DEMO } from '../support/demo';
import { expectedReport } from '../support/report-expected';
import type { ReportSummary } from '@/lib/reports/types';

// The manager's numbers over HTTP against the real build and MariaDB. Every expected figure is worked
// out here from the database rows with plain SQL reads and JavaScript sums, never from the report code.
const { appUrl } = readRuntime();
const DAY = 86_400_000;
const utcDay = (ms: number) => new Date(ms).toISOString().slice(0, 10);
const TODAY = utcDay(Date.now());
const FROM = utcDay(Date.now() - 29 * DAY);

type Agent = Awaited<ReturnType<typeof signedInAgent>>;
type Summary = ReportSummary;

let sequelize: Sequelize;
let manager: Agent;
let counter: Agent;
let tech: Agent;

beforeAll(async () => {
  sequelize = connectTestDatabase();
  [manager, counter, tech] = await Promise.all([
    signedInAgent('manager'),
    signedInAgent('counter'),
    signedInAgent('tech'),
  ]);
});
afterAll(() => disconnectTestDatabase());

const rows = <T extends object>(sql: string, replacements: Record<string, unknown> = {}) =>
  sequelize.query<T>(sql, { type: QueryTypes.SELECT, replacements });

/** The report, worked out independently from the raw rows of the last 30 days. */
const expectedFromRows = () => expectedReport(sequelize, FROM, TODAY);

const summary = async (query = `?from=${FROM}&to=${TODAY}`) => {
  const res = await manager.get(`/api/reports/summary${query}`);
  expect(res.status).toBe(200);
  return res.body as Summary;
};

describe('the summary for the last 30 days', () => {
  it('includes the seeded demo quotes (sent, deposit-paid, draft) and their one paid deposit', async () => {
    const seeded = await rows<{ number: string; status: string }>(
      "SELECT number, status FROM quotes WHERE number IN ('Q-2026-0101', 'Q-2026-0102', 'Q-2026-0103') ORDER BY number",
    );
    expect(seeded.map((q) => q.status)).toEqual(['sent', 'deposit-paid', 'draft']);
    const body = await summary();
    for (const status of ['sent', 'deposit-paid', 'draft'])
      expect(body.byStatus.find((s) => s.status === status)!.count).toBeGreaterThanOrEqual(1);
    expect(body.deposits.count).toBeGreaterThanOrEqual(1);
    expect(body.margin.total.revenueCents).toBeGreaterThan(0);
  });

  it('answers the counts and cents worked out from the database rows', async () => {
    const expected = await expectedFromRows();
    expect(await summary()).toEqual(expected);
  });

  it('uses the last 30 days when no dates are given', async () => {
    const body = await summary('');
    expect(body.range).toEqual({ from: FROM, to: TODAY, days: 30 });
  });

  it('is empty for a range with no quotes', async () => {
    const body = await summary('?from=2001-01-01&to=2001-12-31');
    expect(body.created).toEqual({ count: 0, valueCents: 0 });
    expect(body.byStatus.every((s) => s.count === 0 && s.valueCents === 0)).toBe(true);
    expect(body.conversion.rateBp).toBeNull();
    expect(body.averageQuoteCents).toBeNull();
    expect(body.topCams).toEqual([]);
    expect(body.margin.total).toEqual({ revenueCents: 0, costCents: 0, marginCents: 0, marginBp: null });
  });
});

describe('a quote made in the test moves the numbers', () => {
  let quoteId = 0;
  let paymentId = 0;
  afterAll(async () => {
    if (paymentId) await sequelize.query('DELETE FROM payments WHERE id = :paymentId', { replacements: { paymentId } });
    if (quoteId) {
      await sequelize.query('DELETE FROM quote_lines WHERE quote_id = :quoteId', { replacements: { quoteId } });
      await sequelize.query('DELETE FROM quotes WHERE id = :quoteId', { replacements: { quoteId } });
    }
  });

  it('counts a new draft: one more draft, its value, one more quote for its cam', async () => {
    const before = await summary();
    const made = await manager
      .post('/api/quotes')
      .send({ buildId: DEMO.builds.whitlockTowingTruck, camId: DEMO.cams.bigTruck219 });
    expect(made.status).toBe(201);
    quoteId = made.body.id;
    const [row] = await rows<{ total_cents: number }>('SELECT total_cents FROM quotes WHERE id = :quoteId', {
      quoteId,
    });
    const after = await summary();
    const draft = (s: Summary) => s.byStatus.find((x) => x.status === 'draft')!;
    expect(draft(after).count).toBe(draft(before).count + 1);
    expect(draft(after).valueCents).toBe(draft(before).valueCents + Number(row.total_cents));
    expect(after.created.count).toBe(before.created.count + 1);
    expect(after.created.valueCents).toBe(before.created.valueCents + Number(row.total_cents));
    expect(after).toEqual(await expectedFromRows());
  });

  it('counts it as sent, deposit-paid and a deposit with a partial refund, margin and all', async () => {
    const before = await summary();
    const [q] = await rows<{ deposit_cents: number }>('SELECT deposit_cents FROM quotes WHERE id = :quoteId', {
      quoteId,
    });
    await sequelize.query(
      "UPDATE quotes SET status = 'deposit-paid', sent_at = NOW(), accepted_at = NOW() WHERE id = :quoteId",
      { replacements: { quoteId } },
    );
    const refund = 1_234;
    await sequelize.query(
      "INSERT INTO payments (quote_id, provider, provider_session_id, provider_payment_id, amount_cents, refunded_cents, currency, status, paid_at, created_at, updated_at) VALUES (:quoteId, 'stripe', :session, :intent, :amount, :refund, 'usd', 'partially-refunded', NOW(), NOW(), NOW())",
      {
        replacements: {
          quoteId,
          session: `cs_test_report_${quoteId}`,
          intent: `pi_test_report_${quoteId}`,
          amount: Number(q.deposit_cents),
          refund,
        },
      },
    );
    [{ id: paymentId }] = await rows<{ id: number }>('SELECT id FROM payments WHERE provider_session_id = :s', {
      s: `cs_test_report_${quoteId}`,
    });
    const after = await summary();
    expect(after.deposits.count).toBe(before.deposits.count + 1);
    expect(after.deposits.takenCents).toBe(before.deposits.takenCents + Number(q.deposit_cents));
    expect(after.deposits.refundedCents).toBe(before.deposits.refundedCents + refund);
    expect(after.deposits.netCents).toBe(after.deposits.takenCents - after.deposits.refundedCents);
    expect(after.conversion.sentCount).toBe(before.conversion.sentCount + 1);
    expect(after.conversion.depositPaidCount).toBe(before.conversion.depositPaidCount + 1);
    expect(after.margin.cams.revenueCents).toBeGreaterThan(before.margin.cams.revenueCents);
    expect(after.topCams.find((c) => c.camId === DEMO.cams.bigTruck219)!.deposits).toBe(
      (before.topCams.find((c) => c.camId === DEMO.cams.bigTruck219)?.deposits ?? 0) + 1,
    );
    expect(after).toEqual(await expectedFromRows());
  });

  it('still counts it as converted once the job is closed, and its balance payment as a balance, not a deposit', async () => {
    const before = await summary();
    const [q] = await rows<{ total_cents: number; deposit_cents: number }>(
      'SELECT total_cents, deposit_cents FROM quotes WHERE id = :quoteId',
      { quoteId },
    );
    const balance = Number(q.total_cents) - Number(q.deposit_cents);
    await sequelize.query("UPDATE quotes SET status = 'closed', closed_at = NOW() WHERE id = :quoteId", {
      replacements: { quoteId },
    });
    await sequelize.query(
      "INSERT INTO payments (quote_id, provider, amount_cents, refunded_cents, currency, status, paid_at, purpose, method, created_at, updated_at) VALUES (:quoteId, 'counter', :amount, 0, 'usd', 'paid', NOW(), 'balance', 'cash', NOW(), NOW())",
      { replacements: { quoteId, amount: balance } },
    );
    const after = await summary();
    // The conversion, the margin and the cam's conversions are those of the deposit-paid quote it was.
    expect(after.conversion).toEqual(before.conversion);
    expect(after.margin).toEqual(before.margin);
    expect(after.topCams).toEqual(before.topCams);
    expect(after.deposits).toEqual(before.deposits);
    expect(after.balances.count).toBe(before.balances.count + 1);
    expect(after.balances.takenCents).toBe(before.balances.takenCents + balance);
    expect(after).toEqual(await expectedFromRows());
    await sequelize.query("DELETE FROM payments WHERE quote_id = :quoteId AND purpose = 'balance'", {
      replacements: { quoteId },
    });
  });
});

describe('bad dates and who may ask', () => {
  it.each([
    ['?from=2026-13-01', 'from'],
    ['?from=yesterday', 'from'],
    ['?to=2026-02-30', 'to'],
    [`?from=${TODAY}&to=${FROM}`, 'from'],
    ['?from=2024-01-01&to=2025-06-30', 'to'],
  ])('answers 422 naming the field for %s', async (query, field) => {
    for (const path of ['/api/reports/summary', '/api/reports/quotes.csv']) {
      const res = await manager.get(`${path}${query}`);
      expect(res.status).toBe(422);
      expect(res.body.errors).toEqual([expect.objectContaining({ field, message: expect.any(String) })]);
    }
  });

  it('is the manager’s: counter and tech 403, signed out 401', async () => {
    for (const path of ['/api/reports/summary', '/api/reports/quotes.csv']) {
      expect((await counter.get(path)).status).toBe(403);
      expect((await tech.get(path)).status).toBe(403);
      expect((await request(appUrl).get(path)).status).toBe(401);
    }
  });
});

describe('the quotes CSV', () => {
  let customerId = 0;
  let quoteId = 0;
  afterAll(async () => {
    if (quoteId) await sequelize.query('DELETE FROM quotes WHERE id = :quoteId', { replacements: { quoteId } });
    if (customerId)
      await sequelize.query('DELETE FROM customers WHERE id = :customerId', { replacements: { customerId } });
  });

  it('lists the range’s quotes and neutralises a formula-like customer name', async () => {
    const name = '=HYPERLINK("http://example.invalid","Kestrel")';
    await sequelize.query('INSERT INTO customers (name, created_at, updated_at) VALUES (:name, NOW(), NOW())', {
      replacements: { name },
    });
    [{ id: customerId }] = await rows<{ id: number }>(
      'SELECT id FROM customers WHERE name = :name ORDER BY id DESC LIMIT 1',
      { name },
    );
    const number = `Q-1999-${String(customerId % 10_000).padStart(4, '0')}`;
    await sequelize.query(
      "INSERT INTO quotes (number, customer_id, status, subtotal_cents, tax_rate_bp, tax_cents, total_cents, deposit_cents, version, created_at, updated_at) VALUES (:number, :customerId, 'draft', 10000, 825, 825, 10825, 2165, 1, NOW(), NOW())",
      { replacements: { number, customerId } },
    );
    [{ id: quoteId }] = await rows<{ id: number }>('SELECT id FROM quotes WHERE number = :number', { number });

    const res = await manager
      .get(`/api/reports/quotes.csv?from=${FROM}&to=${TODAY}`)
      .buffer(true)
      .parse((r, done) => {
        let text = '';
        r.setEncoding('utf8');
        r.on('data', (c: string) => (text += c));
        r.on('end', () => done(null, text));
      });
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv/);
    expect(res.headers['content-disposition']).toContain(`lobewise-quotes-${FROM}-to-${TODAY}.csv`);
    const text = (res.body as string).replace(/^\uFEFF/, '');
    const lines = text.trim().split('\r\n');
    expect(lines[0]).toBe(
      'number,status,created_utc,sent_utc,customer,vehicle,cam_sku,subtotal_usd,tax_usd,total_usd,deposit_usd,paid_usd,refunded_usd',
    );
    const ours = lines.find((l) => l.startsWith(`${number},`));
    expect(ours).toBeDefined();
    // Papaparse quotes the cell (it holds quotes and a comma); inside, the apostrophe comes first.
    expect(ours).toContain(`"'=HYPERLINK(""http://example.invalid"",""Kestrel"")"`);
    expect(ours).not.toMatch(/,"?=HYPERLINK/);
    expect(ours).toContain(',108.25,21.65,0.00,0.00');
    // Every quote created in the range is a row.
    const [{ count }] = await rows<{ count: number }>(
      'SELECT COUNT(*) AS count FROM quotes WHERE created_at >= :from AND created_at < :end',
      { from: `${FROM} 00:00:00`, end: `${utcDay(Date.parse(TODAY) + DAY)} 00:00:00` },
    );
    expect(lines.length - 1).toBe(Number(count));
  });
});

describe('the Numbers page', () => {
  it('opens for the manager and sends counter staff back to the staff home', async () => {
    const page = await manager.get('/reports');
    expect(page.status).toBe(200);
    expect(page.text).toContain('Numbers');
    expect(page.text).toContain('href="/reports"');
    const denied = await counter.get('/reports');
    expect([303, 307]).toContain(denied.status);
    expect(denied.headers.location).toContain('/dashboard?denied=');
    const anonymous = await request(appUrl).get('/reports');
    expect([303, 307]).toContain(anonymous.status);
    expect(anonymous.headers.location).toContain('/sign-in');
  });
});
