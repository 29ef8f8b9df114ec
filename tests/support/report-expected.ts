import { QueryTypes, type Sequelize } from 'sequelize';
import { QUOTE_STATE_LIST } from '@/lib/quotes/lifecycle';
import type { ReportSummary } from '@/lib/reports/types';

// The manager's report worked out the plain way, from every row of quotes, lines, payments and the
// catalogue with JavaScript sums: what the report code (per-day totals kept by triggers, grouped SQL)
// must answer exactly. Never built from the report code itself.
// The states themselves are the lifecycle's list (data, not report code).
const STATUSES = QUOTE_STATE_LIST;
type Margin = ReportSummary['margin']['total'];
const utcDay = (ms: number) => new Date(ms).toISOString().slice(0, 10);
// Converted: the deposit was paid, whether the job is still open or was closed since.
const converted = (status: string) => status === 'deposit-paid' || status === 'closed';
const halfUp = (num: number, den: number) => Math.floor((2 * num + den) / (2 * den)); // for num ≥ 0, den > 0

/** The report for from..to (both included, UTC days), worked out independently from the raw rows. */
export async function expectedReport(sequelize: Sequelize, from: string, to: string): Promise<ReportSummary> {
  const rows = <T extends object>(sql: string, replacements: Record<string, unknown> = {}) =>
    sequelize.query<T>(sql, { type: QueryTypes.SELECT, replacements });
  const inRange = (d: Date | string | null) => {
    if (!d) return false;
    const day = utcDay(new Date(d).getTime());
    return day >= from && day <= to;
  };
  const quotes = (
    await rows<{
      id: number;
      status: string;
      total_cents: number;
      sent_at: Date | null;
      created_at: Date;
      cam_id: number | null;
    }>('SELECT id, status, total_cents, sent_at, created_at, cam_id FROM quotes')
  ).filter((q) => inRange(q.created_at));
  const byStatus = STATUSES.map((status) => {
    const these = quotes.filter((q) => q.status === status);
    return { status, count: these.length, valueCents: these.reduce((s, q) => s + Number(q.total_cents), 0) };
  });
  const valueCents = quotes.reduce((s, q) => s + Number(q.total_cents), 0);
  const sent = quotes.filter((q) => q.sent_at !== null);
  const sentPaid = sent.filter((q) => converted(q.status));

  const allPayments = (
    await rows<{ amount_cents: number; refunded_cents: number; status: string; paid_at: Date | null; purpose: string }>(
      'SELECT amount_cents, refunded_cents, status, paid_at, purpose FROM payments',
    )
  ).filter((p) => ['paid', 'partially-refunded', 'refunded'].includes(p.status) && inRange(p.paid_at));
  const money = (purpose: string) => {
    const these = allPayments.filter((p) => p.purpose === purpose);
    const takenCents = these.reduce((s, p) => s + Number(p.amount_cents), 0);
    const refundedCents = these.reduce((s, p) => s + Number(p.refunded_cents), 0);
    return { count: these.length, takenCents, refundedCents, netCents: takenCents - refundedCents };
  };

  const paidIds = new Set(quotes.filter((q) => converted(q.status)).map((q) => q.id));
  const lines = await rows<{
    quote_id: number;
    kind: string;
    cam_id: number | null;
    part_id: number | null;
    quantity: string;
    total_cents: number;
  }>('SELECT quote_id, kind, cam_id, part_id, quantity, total_cents FROM quote_lines');
  const camCost = new Map(
    (await rows<{ id: number; cost_cents: number }>('SELECT id, cost_cents FROM cams')).map((c) => [
      c.id,
      Number(c.cost_cents),
    ]),
  );
  const partCost = new Map(
    (await rows<{ id: number; cost_cents: number }>('SELECT id, cost_cents FROM parts')).map((p) => [
      p.id,
      Number(p.cost_cents),
    ]),
  );
  const margin = (kind: 'cam' | 'part' | null): Margin => {
    let revenueCents = 0;
    let costCents = 0;
    for (const l of lines) {
      if (!paidIds.has(l.quote_id) || !['cam', 'part'].includes(l.kind) || (kind && l.kind !== kind)) continue;
      const unit = l.cam_id !== null ? camCost.get(l.cam_id) : l.part_id !== null ? partCost.get(l.part_id) : undefined;
      if (unit === undefined) continue;
      revenueCents += Number(l.total_cents);
      costCents += halfUp(Math.round(Number(l.quantity) * 100) * unit, 100);
    }
    const marginCents = revenueCents - costCents;
    const marginBp =
      revenueCents > 0 ? Math.sign(marginCents) * halfUp(Math.abs(marginCents) * 10_000, revenueCents) : null;
    return { revenueCents, costCents, marginCents, marginBp };
  };

  const cams = new Map(
    (await rows<{ id: number; sku: string; name: string }>('SELECT id, sku, name FROM cams')).map((c) => [c.id, c]),
  );
  const perCam = new Map<number, { quotes: number; deposits: number }>();
  for (const q of quotes) {
    if (q.cam_id === null) continue;
    const e = perCam.get(q.cam_id) ?? { quotes: 0, deposits: 0 };
    e.quotes += 1;
    if (converted(q.status)) e.deposits += 1;
    perCam.set(q.cam_id, e);
  }
  const topCams = [...perCam.entries()]
    .map(([camId, e]) => ({ camId, sku: cams.get(camId)!.sku, name: cams.get(camId)!.name, ...e }))
    .sort((a, b) => b.quotes - a.quotes || b.deposits - a.deposits || (a.sku < b.sku ? -1 : a.sku > b.sku ? 1 : 0))
    .slice(0, 5);

  return {
    range: { from, to, days: Math.round((Date.parse(to) - Date.parse(from)) / 86_400_000) + 1 },
    created: { count: quotes.length, valueCents },
    byStatus,
    conversion: {
      sentCount: sent.length,
      depositPaidCount: sentPaid.length,
      rateBp: sent.length ? halfUp(sentPaid.length * 10_000, sent.length) : null,
    },
    averageQuoteCents: quotes.length ? halfUp(valueCents, quotes.length) : null,
    deposits: money('deposit'),
    balances: money('balance'),
    margin: { cams: margin('cam'), parts: margin('part'), total: margin(null) },
    topCams,
  };
}
