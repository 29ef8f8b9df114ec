import { QueryTypes, type Sequelize } from 'sequelize';
import { signedInAgent } from '../support/auth';
import { connectTestDatabase, disconnectTestDatabase } from '../support/database';
import { makeDepositPaidQuote, makeDraftQuote, type FixtureQuote } from '../support/quote-fixtures';
import { expectedReport } from '../support/report-expected';
import type { ReportSummary } from '@/lib/reports/types';

// The report's per-day totals (report_quote_days, report_margin_days; database/migrations/
// 20261207000900-report-day-totals.js) are kept by triggers in the transactions that write quotes and
// their lines. After every step of a sequence of writes — drafts, deposits paid through the payments
// fake, partial and full refunds (the quote leaving "converted"), line edits, a quote moved to another
// day, a converted quote deleted with its lines — the kept totals must equal the same totals recomputed
// from the rows with plain GROUP BYs, and the summary must equal the plain JavaScript computation.

type Agent = Awaited<ReturnType<typeof signedInAgent>>;
type QuoteDay = { day: string; status: string; sent: number; quotes: number; value: number };
type MarginDay = {
  day: string;
  kind: string;
  cam: number;
  part: number;
  quantity: string;
  n: number;
  revenue: number;
};

let sequelize: Sequelize;
let counter: Agent;
let manager: Agent;

beforeAll(async () => {
  sequelize = connectTestDatabase();
  [counter, manager] = await Promise.all([signedInAgent('counter'), signedInAgent('manager')]);
});
afterAll(() => disconnectTestDatabase());

const rows = <T extends object>(sql: string, replacements: Record<string, unknown> = {}) =>
  sequelize.query<T>(sql, { type: QueryTypes.SELECT, replacements });
const run = (sql: string, replacements: Record<string, unknown> = {}) => sequelize.query(sql, { replacements });
// The driver hands sums back as strings or bigints: both sides are compared as plain numbers and strings.
const quoteDay = (r: QuoteDay) => ({
  day: String(r.day),
  status: String(r.status),
  sent: Number(r.sent),
  quotes: Number(r.quotes),
  value: Number(r.value),
});
const marginDay = (r: MarginDay) => ({
  day: String(r.day),
  kind: String(r.kind),
  cam: Number(r.cam),
  part: Number(r.part),
  quantity: String(r.quantity),
  n: Number(r.n),
  revenue: Number(r.revenue),
});

/** What the triggers have kept, rows that cancelled out to nothing left out. */
async function kept() {
  const quoteDays = await rows<QuoteDay>(
    `SELECT DATE_FORMAT(day, '%Y-%m-%d') AS day, status, sent + 0 AS sent, quotes, value_cents AS value FROM report_quote_days
      WHERE quotes <> 0 OR value_cents <> 0 ORDER BY day, status, sent`,
  );
  const marginDays = await rows<MarginDay>(
    `SELECT DATE_FORMAT(day, '%Y-%m-%d') AS day, kind, cam_id AS cam, part_id AS part, quantity, line_count AS n, revenue_cents AS revenue
       FROM report_margin_days WHERE line_count <> 0 OR revenue_cents <> 0 ORDER BY day, kind, cam_id, part_id, quantity`,
  );
  return { quoteDays: quoteDays.map(quoteDay), marginDays: marginDays.map(marginDay) };
}

/** The same totals recomputed from quotes and quote_lines as they stand. */
async function recomputed() {
  const quoteDays = await rows<QuoteDay>(
    `SELECT DATE_FORMAT(created_at, '%Y-%m-%d') AS day, CAST(status AS CHAR) AS status, (sent_at IS NOT NULL) + 0 AS sent,
            COUNT(*) AS quotes, SUM(total_cents) AS value
       FROM quotes GROUP BY 1, 2, 3 ORDER BY 1, 2, 3`,
  );
  const marginDays = await rows<MarginDay>(
    `SELECT DATE_FORMAT(q.created_at, '%Y-%m-%d') AS day, CAST(ql.kind AS CHAR) AS kind, COALESCE(ql.cam_id, 0) AS cam,
            COALESCE(ql.part_id, 0) AS part, ql.quantity, COUNT(*) AS n, SUM(ql.total_cents) AS revenue
       FROM quotes q JOIN quote_lines ql ON ql.quote_id = q.id
      WHERE q.status IN ('deposit-paid', 'closed') AND ql.kind IN ('cam', 'part')
      GROUP BY 1, 2, 3, 4, 5 ORDER BY 1, 2, 3, 4, 5`,
  );
  return { quoteDays: quoteDays.map(quoteDay), marginDays: marginDays.map(marginDay) };
}

async function expectTotalsToMatchTheRows() {
  expect(await kept()).toEqual(await recomputed());
}

const utcDay = (ms: number) => new Date(ms).toISOString().slice(0, 10);
const TODAY = utcDay(Date.now());
const FROM = utcDay(Date.now() - 364 * 86_400_000);

async function expectSummaryToMatchTheRows() {
  const res = await manager.get(`/api/reports/summary?from=${FROM}&to=${TODAY}`).expect(200);
  expect(res.body as ReportSummary).toEqual(await expectedReport(sequelize, FROM, TODAY));
}

/** A refund as the manager posts it: on the version of the quote they reviewed. */
async function refund(quoteId: number, body: Record<string, unknown>) {
  const { version } = (await manager.get(`/api/quotes/${quoteId}`).expect(200)).body as { version: number };
  await manager
    .post(`/api/quotes/${quoteId}/refund`)
    .send({ version, ...body })
    .expect(200);
}

describe('the report’s per-day totals after a sequence of writes', () => {
  let draft: FixtureQuote;
  let paid: Awaited<ReturnType<typeof makeDepositPaidQuote>>;

  it('match the rows before this file writes anything (whatever earlier tests did)', async () => {
    await expectTotalsToMatchTheRows();
  });

  it('count a new draft and a deposit paid through the payments fake (the quote becomes converted)', async () => {
    draft = await makeDraftQuote(counter, 'Day totals draft');
    await expectTotalsToMatchTheRows();
    paid = await makeDepositPaidQuote(counter, 'Day totals paid');
    const [{ n }] = await rows<{ n: number }>(
      `SELECT COUNT(*) AS n FROM quote_lines WHERE quote_id = :id AND kind IN ('cam', 'part')`,
      { id: paid.id },
    );
    expect(Number(n)).toBeGreaterThan(0); // the margin rows this quote brings are really there
    await expectTotalsToMatchTheRows();
    await expectSummaryToMatchTheRows();
  });

  it('keep a partial refund (still converted) and take the quote out on a full refund', async () => {
    await refund(paid.id, { amountCents: 1_000 });
    await expectTotalsToMatchTheRows();
    const other = await makeDepositPaidQuote(counter, 'Day totals refunded');
    await refund(other.id, { amountCents: other.depositCents, reason: 'customer changed plans' });
    const [{ status }] = await rows<{ status: string }>('SELECT status FROM quotes WHERE id = :id', { id: other.id });
    expect(status).toBe('cancelled');
    const reopened = await makeDepositPaidQuote(counter, 'Day totals reopened');
    await refund(reopened.id, { amountCents: reopened.depositCents, afterFullRefund: 'reopen' });
    await expectTotalsToMatchTheRows();
    await expectSummaryToMatchTheRows();
  });

  it('follow line edits on a converted quote: a new line, a changed quantity and price, a line removed', async () => {
    const [line] = await rows<{ id: number }>(
      "SELECT id FROM quote_lines WHERE quote_id = :id AND kind = 'part' ORDER BY id LIMIT 1",
      { id: paid.id },
    );
    await run(
      `INSERT INTO quote_lines (quote_id, kind, part_id, description, quantity, unit_price_cents, total_cents, sort_order)
       SELECT :id, 'part', part_id, 'Second set', 2.5, unit_price_cents, ROUND(2.5 * unit_price_cents), 90 FROM quote_lines WHERE id = :line`,
      { id: paid.id, line: line.id },
    );
    await expectTotalsToMatchTheRows();
    await run('UPDATE quote_lines SET quantity = 3, total_cents = 3 * unit_price_cents WHERE id = :line', {
      line: line.id,
    });
    await expectTotalsToMatchTheRows();
    await run("UPDATE quote_lines SET kind = 'other' WHERE quote_id = :id AND sort_order = 90", { id: paid.id });
    await expectTotalsToMatchTheRows();
    await run("DELETE FROM quote_lines WHERE quote_id = :id AND kind = 'other' AND sort_order = 90", { id: paid.id });
    await expectTotalsToMatchTheRows();
    await expectSummaryToMatchTheRows();
  });

  it('move a quote to another day, close a job, and drop a deleted converted quote with its lines', async () => {
    await run('UPDATE quotes SET created_at = created_at - INTERVAL 400 DAY WHERE id = :id', { id: draft.id });
    await run('UPDATE quotes SET created_at = created_at - INTERVAL 3 DAY WHERE id = :id', { id: paid.id });
    await expectTotalsToMatchTheRows();
    await run("UPDATE quotes SET status = 'closed', closed_at = NOW() WHERE id = :id", { id: paid.id });
    await expectTotalsToMatchTheRows();
    await expectSummaryToMatchTheRows();
    const gone = await makeDepositPaidQuote(counter, 'Day totals deleted');
    await run('DELETE FROM payments WHERE quote_id = :id', { id: gone.id });
    await run('DELETE FROM quotes WHERE id = :id', { id: gone.id }); // its lines go by the foreign key's cascade
    expect(await rows('SELECT id FROM quote_lines WHERE quote_id = :id', { id: gone.id })).toEqual([]);
    await expectTotalsToMatchTheRows();
    await expectSummaryToMatchTheRows();
  });
});
