import { QueryTypes } from 'sequelize';
import { averageCents, goodsMargin, netDepositsCents, rateBp, type Margin, type MarginLine } from '@/lib/reports/arithmetic';
import { addDays, type ReportRange } from '@/lib/schemas/report';
import { db } from '../models';
import { QUOTE_STATUSES, type QuoteStatus } from '../models/quote';

// The manager's numbers for a date range (both days included, UTC). What each number counts:
// - quotes by status, their values, the average and the conversion: quotes *created* in the range,
//   in the state they are in now; "sent" for the conversion means the quote was ever sent (sent_at set);
// - deposits taken and their refunds: payments *paid* in the range (paid_at), with what has been refunded
//   of them so far;
// - margin: cam and part lines of deposit-paid quotes created in the range, price − the catalogue's
//   current cost (quote lines keep no cost of their own);
// - most-quoted cams: the quote's chosen cam, top 5 by number of quotes, with how many got a deposit.
// Every amount is integer cents; formatting is the page's job.

export type StatusFigure = { status: QuoteStatus; count: number; valueCents: number };
export type TopCam = { camId: number; sku: string; name: string; quotes: number; deposits: number };
export type ReportSummary = {
  range: ReportRange;
  created: { count: number; valueCents: number };
  byStatus: StatusFigure[];
  conversion: { sentCount: number; depositPaidCount: number; rateBp: number | null };
  averageQuoteCents: number | null;
  deposits: { count: number; takenCents: number; refundedCents: number; netCents: number };
  margin: { cams: Margin; parts: Margin; total: Margin };
  topCams: TopCam[];
};

const PAID_PAYMENT_STATES = ['paid', 'partially-refunded', 'refunded'];

/** The range as half-open UTC datetimes: [from 00:00, the day after to 00:00). */
function bounds(range: Pick<ReportRange, 'from' | 'to'>) {
  return { start: `${range.from} 00:00:00`, end: `${addDays(range.to, 1)} 00:00:00` };
}

const n = (v: unknown) => Number(v ?? 0);

async function select<T extends object>(sql: string, replacements: Record<string, unknown>): Promise<T[]> {
  return db().query<T>(sql, { type: QueryTypes.SELECT, replacements });
}

export async function quotesByStatus(range: ReportRange): Promise<StatusFigure[]> {
  const rows = await select<{ status: QuoteStatus; count: unknown; value: unknown }>(
    `SELECT status, COUNT(*) AS count, COALESCE(SUM(total_cents), 0) AS value
       FROM quotes WHERE created_at >= :start AND created_at < :end GROUP BY status`,
    bounds(range),
  );
  const found = new Map(rows.map((r) => [r.status, r]));
  return QUOTE_STATUSES.map((status) => ({ status, count: n(found.get(status)?.count), valueCents: n(found.get(status)?.value) }));
}

export async function sentConversion(range: ReportRange): Promise<ReportSummary['conversion']> {
  const [row] = await select<{ sent: unknown; paid: unknown }>(
    `SELECT COUNT(*) AS sent, COALESCE(SUM(status = 'deposit-paid'), 0) AS paid
       FROM quotes WHERE created_at >= :start AND created_at < :end AND sent_at IS NOT NULL`,
    bounds(range),
  );
  const sentCount = n(row?.sent);
  const depositPaidCount = n(row?.paid);
  return { sentCount, depositPaidCount, rateBp: rateBp(depositPaidCount, sentCount) };
}

export async function depositsTaken(range: ReportRange): Promise<ReportSummary['deposits']> {
  const [row] = await select<{ count: unknown; taken: unknown; refunded: unknown }>(
    `SELECT COUNT(*) AS count, COALESCE(SUM(amount_cents), 0) AS taken, COALESCE(SUM(refunded_cents), 0) AS refunded
       FROM payments WHERE status IN (:states) AND paid_at >= :start AND paid_at < :end`,
    { ...bounds(range), states: PAID_PAYMENT_STATES },
  );
  const takenCents = n(row?.taken);
  const refundedCents = n(row?.refunded);
  return { count: n(row?.count), takenCents, refundedCents, netCents: netDepositsCents(takenCents, refundedCents) };
}

export async function goodsMarginOfPaidQuotes(range: ReportRange): Promise<ReportSummary['margin']> {
  const rows = await select<{ kind: 'cam' | 'part'; total: unknown; hundredths: unknown; cost: unknown }>(
    `SELECT ql.kind, ql.total_cents AS total, ROUND(ql.quantity * 100) AS hundredths, COALESCE(c.cost_cents, p.cost_cents) AS cost
       FROM quote_lines ql
       JOIN quotes q ON q.id = ql.quote_id
       LEFT JOIN cams c ON c.id = ql.cam_id
       LEFT JOIN parts p ON p.id = ql.part_id
      WHERE q.status = 'deposit-paid' AND q.created_at >= :start AND q.created_at < :end
        AND ql.kind IN ('cam', 'part') AND COALESCE(c.cost_cents, p.cost_cents) IS NOT NULL`,
    bounds(range),
  );
  const lines = (kind?: 'cam' | 'part'): MarginLine[] =>
    rows.filter((r) => !kind || r.kind === kind).map((r) => ({ totalCents: n(r.total), quantityHundredths: n(r.hundredths), unitCostCents: n(r.cost) }));
  return { cams: goodsMargin(lines('cam')), parts: goodsMargin(lines('part')), total: goodsMargin(lines()) };
}

export async function mostQuotedCams(range: ReportRange, limit = 5): Promise<TopCam[]> {
  const rows = await select<{ camId: unknown; sku: string; name: string; quotes: unknown; deposits: unknown }>(
    `SELECT q.cam_id AS camId, c.sku, c.name, COUNT(*) AS quotes, COALESCE(SUM(q.status = 'deposit-paid'), 0) AS deposits
       FROM quotes q JOIN cams c ON c.id = q.cam_id
      WHERE q.created_at >= :start AND q.created_at < :end
      GROUP BY q.cam_id, c.sku, c.name
      ORDER BY quotes DESC, deposits DESC, c.sku ASC
      LIMIT :limit`,
    { ...bounds(range), limit },
  );
  return rows.map((r) => ({ camId: n(r.camId), sku: r.sku, name: r.name, quotes: n(r.quotes), deposits: n(r.deposits) }));
}

export async function reportSummary(range: ReportRange): Promise<ReportSummary> {
  const [byStatus, conversion, deposits, margin, topCams] = await Promise.all([
    quotesByStatus(range), sentConversion(range), depositsTaken(range), goodsMarginOfPaidQuotes(range), mostQuotedCams(range),
  ]);
  const count = byStatus.reduce((s, f) => s + f.count, 0);
  const valueCents = byStatus.reduce((s, f) => s + f.valueCents, 0);
  return { range, created: { count, valueCents }, byStatus, conversion, averageQuoteCents: averageCents(valueCents, count), deposits, margin, topCams };
}

export type QuoteExportRow = {
  number: string; status: QuoteStatus; createdAt: string; sentAt: string | null; customerName: string; vehicleLabel: string | null;
  camSku: string | null; subtotalCents: number; taxCents: number; totalCents: number; depositCents: number; paidCents: number; refundedCents: number;
};

export const QUOTE_EXPORT_MAX_ROWS = 10_000;

const isoOf = (v: unknown) => (v ? new Date(v as string | Date).toISOString() : null);

/** Quotes created in the range, oldest first, with what was paid and refunded on each. */
export async function quotesForExport(range: ReportRange): Promise<QuoteExportRow[]> {
  const rows = await select<Record<string, unknown>>(
    `SELECT q.number, q.status, q.created_at AS createdAt, q.sent_at AS sentAt, cu.name AS customerName, b.vehicle_label AS vehicleLabel,
            c.sku AS camSku, q.subtotal_cents AS subtotal, q.tax_cents AS tax, q.total_cents AS total, q.deposit_cents AS deposit,
            COALESCE(pay.paid, 0) AS paid, COALESCE(pay.refunded, 0) AS refunded
       FROM quotes q
       JOIN customers cu ON cu.id = q.customer_id
       LEFT JOIN builds b ON b.id = q.build_id
       LEFT JOIN cams c ON c.id = q.cam_id
       LEFT JOIN (SELECT quote_id, SUM(amount_cents) AS paid, SUM(refunded_cents) AS refunded FROM payments WHERE status IN (:states) GROUP BY quote_id) pay
              ON pay.quote_id = q.id
      WHERE q.created_at >= :start AND q.created_at < :end
      ORDER BY q.created_at ASC, q.id ASC
      LIMIT :limit`,
    { ...bounds(range), states: PAID_PAYMENT_STATES, limit: QUOTE_EXPORT_MAX_ROWS },
  );
  return rows.map((r) => ({
    number: String(r.number), status: r.status as QuoteStatus, createdAt: isoOf(r.createdAt)!, sentAt: isoOf(r.sentAt),
    customerName: String(r.customerName ?? ''), vehicleLabel: (r.vehicleLabel as string | null) ?? null, camSku: (r.camSku as string | null) ?? null,
    subtotalCents: n(r.subtotal), taxCents: n(r.tax), totalCents: n(r.total), depositCents: n(r.deposit), paidCents: n(r.paid), refundedCents: n(r.refunded),
  }));
}
