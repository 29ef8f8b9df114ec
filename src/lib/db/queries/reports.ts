import 'server-only';
import { QueryTypes } from 'sequelize';
import { averageCents, marginOfSums as marginOf, netDepositsCents, rateBp } from '@/lib/reports/arithmetic';
import { addDays, type ReportRange } from '@/lib/schemas/report';
import type { ReportSummary, StatusFigure, TopCam } from '@/lib/reports/types';
import { db } from '../models';
import { QUOTE_STATUSES } from '../models/quote';

// The manager's numbers for a date range (both days included, UTC). What each number counts:
// - quotes by status, their values, the average and the conversion: quotes *created* in the range,
//   in the state they are in now; "sent" for the conversion means the quote was ever sent (sent_at set);
//   a quote is converted once its deposit is paid, and stays converted when the job is later closed
//   (`converted`: deposit paid or closed; a deposit refunded in full moves the quote back out);
// - deposits taken and their refunds: deposit payments *paid* in the range (paid_at), with what has been
//   refunded of them so far; balances the same for the balance payments (online and at the counter);
// - margin: cam and part lines of converted quotes created in the range, price − the catalogue's
//   current cost (quote lines keep no cost of their own);
// - most-quoted cams: the quote's chosen cam, top 5 by number of quotes, with how many converted.
// Every amount is integer cents; formatting is the page's job.

const PAID_PAYMENT_STATES = ['paid', 'partially-refunded', 'refunded'];
/** A quote whose deposit was paid: booked, or done and closed (fixed words, so written into the SQL). */
const converted = (column: string) => `${column} IN ('deposit-paid', 'closed')`;

/** The range as half-open UTC datetimes: [from 00:00, the day after to 00:00). */
function bounds(range: Pick<ReportRange, 'from' | 'to'>) {
  return { start: `${range.from} 00:00:00`, end: `${addDays(range.to, 1)} 00:00:00` };
}

const n = (v: unknown) => Number(v ?? 0);

async function select<T extends object>(sql: string, replacements: Record<string, unknown>): Promise<T[]> {
  return db().query<T>(sql, { type: QueryTypes.SELECT, replacements });
}

/** The range as whole UTC days, both included: the per-day totals' key. */
const days = (range: Pick<ReportRange, 'from' | 'to'>) => ({ from: range.from, to: range.to });

/**
 * Counts and values by state and the sent conversion from report_quote_days (kept per creation day, state
 * and sent-or-not by triggers on quotes; database/migrations/20261207000900-report-day-totals.js): a year
 * is a few thousand rows, where the quotes themselves were 67,000 at size L.
 */
export async function quoteFigures(
  range: ReportRange,
): Promise<{ byStatus: StatusFigure[]; conversion: ReportSummary['conversion'] }> {
  const e = (v: string) => db().escape(v);
  const perStatus = QUOTE_STATUSES.map(
    (status, i) =>
      `COALESCE(SUM(IF(status = ${e(status)}, quotes, 0)), 0) AS c${i}, COALESCE(SUM(IF(status = ${e(status)}, value_cents, 0)), 0) AS v${i}`,
  ).join(', ');
  const [row] = await select<Record<string, unknown>>(
    `SELECT ${perStatus}, COALESCE(SUM(IF(sent, quotes, 0)), 0) AS sent, COALESCE(SUM(IF(sent AND ${converted('status')}, quotes, 0)), 0) AS paid
       FROM report_quote_days WHERE day >= :from AND day <= :to`,
    days(range),
  );
  const byStatus = QUOTE_STATUSES.map((status, i) => ({
    status,
    count: n(row?.[`c${i}`]),
    valueCents: n(row?.[`v${i}`]),
  }));
  const sentCount = n(row?.sent);
  const depositPaidCount = n(row?.paid);
  return { byStatus, conversion: { sentCount, depositPaidCount, rateBp: rateBp(depositPaidCount, sentCount) } };
}

export async function depositsTaken(
  range: ReportRange,
  purpose: 'deposit' | 'balance' = 'deposit',
): Promise<ReportSummary['deposits']> {
  const [row] = await select<{ count: unknown; taken: unknown; refunded: unknown }>(
    `SELECT COUNT(*) AS count, COALESCE(SUM(amount_cents), 0) AS taken, COALESCE(SUM(refunded_cents), 0) AS refunded
       FROM payments WHERE status IN (:states) AND purpose = :purpose AND paid_at >= :start AND paid_at < :end`,
    { ...bounds(range), states: PAID_PAYMENT_STATES, purpose },
  );
  const takenCents = n(row?.taken);
  const refundedCents = n(row?.refunded);
  return { count: n(row?.count), takenCents, refundedCents, netCents: netDepositsCents(takenCents, refundedCents) };
}

/**
 * Summed in the database, one row per kind, from report_margin_days: the cam and part lines of converted
 * quotes, counted per creation day and (kind, cam, part, quantity) by triggers on quotes and quote lines,
 * so a year is tens of thousands of small rows instead of the lines themselves. The catalogue costs are
 * looked up once per group. A line's cost is ROUND(quantity × unit cost): quantity is a DECIMAL(…,2) and
 * the cost whole cents, so the product is exact and MariaDB rounds exact values half away from zero — half
 * up for these non-negative amounts, the rule goodsMargin and the quote lines use; lines in one group share
 * their rounded cost, so n × ROUND(quantity × cost) is exactly the sum per line. cam_id / part_id 0 means
 * none, which no catalogue row matches.
 */
export async function goodsMarginOfPaidQuotes(range: ReportRange): Promise<ReportSummary['margin']> {
  const rows = await select<{ kind: 'cam' | 'part'; revenue: unknown; cost: unknown }>(
    `SELECT g.kind, SUM(g.revenue) AS revenue, SUM(g.n * ROUND(g.quantity * COALESCE(c.cost_cents, p.cost_cents))) AS cost
       FROM (SELECT kind, cam_id, part_id, quantity, SUM(line_count) AS n, SUM(revenue_cents) AS revenue
               FROM report_margin_days
              WHERE day >= :from AND day <= :to
              GROUP BY kind, cam_id, part_id, quantity ORDER BY NULL) g
       LEFT JOIN cams c ON c.id = g.cam_id
       LEFT JOIN parts p ON p.id = g.part_id
      WHERE COALESCE(c.cost_cents, p.cost_cents) IS NOT NULL
      GROUP BY g.kind ORDER BY NULL`,
    days(range),
  );
  const of = (kind: 'cam' | 'part') => rows.find((r) => r.kind === kind);
  const cams = marginOf(n(of('cam')?.revenue), n(of('cam')?.cost));
  const parts = marginOf(n(of('part')?.revenue), n(of('part')?.cost));
  return { cams, parts, total: marginOf(cams.revenueCents + parts.revenueCents, cams.costCents + parts.costCents) };
}

/** Counted on the quotes' covering index first, then only the top few joined to their cams. */
export async function mostQuotedCams(range: ReportRange, limit = 5): Promise<TopCam[]> {
  const rows = await select<{ camId: unknown; sku: string; name: string; quotes: unknown; deposits: unknown }>(
    `SELECT t.cam_id AS camId, c.sku, c.name, t.quotes, t.deposits
       FROM (SELECT cam_id, COUNT(*) AS quotes, COALESCE(SUM(${converted('status')}), 0) AS deposits
               FROM quotes
              WHERE created_at >= :start AND created_at < :end AND cam_id IS NOT NULL
              GROUP BY cam_id ORDER BY NULL) t
       JOIN cams c ON c.id = t.cam_id
      ORDER BY t.quotes DESC, t.deposits DESC, c.sku ASC
      LIMIT :limit`,
    { ...bounds(range), limit },
  );
  return rows.map((r) => ({
    camId: n(r.camId),
    sku: r.sku,
    name: r.name,
    quotes: n(r.quotes),
    deposits: n(r.deposits),
  }));
}

export async function reportSummary(range: ReportRange): Promise<ReportSummary> {
  const [{ byStatus, conversion }, deposits, balances, margin, topCams] = await Promise.all([
    quoteFigures(range),
    depositsTaken(range, 'deposit'),
    depositsTaken(range, 'balance'),
    goodsMarginOfPaidQuotes(range),
    mostQuotedCams(range),
  ]);
  const count = byStatus.reduce((s, f) => s + f.count, 0);
  const valueCents = byStatus.reduce((s, f) => s + f.valueCents, 0);
  return {
    range,
    created: { count, valueCents },
    byStatus,
    conversion,
    averageQuoteCents: averageCents(valueCents, count),
    deposits,
    balances,
    margin,
    topCams,
  };
}
