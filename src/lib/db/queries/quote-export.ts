import 'server-only';
import { QueryTypes } from 'sequelize';
import { addDays, type ReportRange } from '@/lib/schemas/report';
import { db } from '../models';
import type { QuoteStatus } from '../models/quote';

// The quotes CSV: every quote created in the range, oldest first, read a chunk at a time so the answer
// streams whatever the range holds (it used to stop silently at 10,000 rows). Each chunk continues after
// the last (created_at, id) it sent, on the quotes_created_at_id index, so a late chunk costs what the
// first does (no OFFSET); payments are summed for that chunk's quotes only. The customer's and the
// vehicle's names come off two small (id, name) indexes: the optimizer picks the primary keys on its
// own, and at 100,000 builds every one of those lookups read a page of profile JSON (1.0 s of 2.5 s).
// STRAIGHT_JOIN keeps quotes first: with a few thousand customers the optimizer once started from the
// customers' index instead and sorted every chunk (the EXPLAIN test caught it in CI, depending on how much
// the earlier tests had written).

export type QuoteExportRow = {
  number: string;
  status: QuoteStatus;
  createdAt: string;
  sentAt: string | null;
  customerName: string;
  vehicleLabel: string | null;
  camSku: string | null;
  subtotalCents: number;
  taxCents: number;
  totalCents: number;
  depositCents: number;
  paidCents: number;
  refundedCents: number;
};

export const QUOTE_EXPORT_CHUNK = 1_000;

const PAID_PAYMENT_STATES = ['paid', 'partially-refunded', 'refunded'];
const n = (v: unknown) => Number(v ?? 0);
const isoOf = (v: unknown) => (v ? new Date(v as string | Date).toISOString() : null);

type Raw = Record<string, unknown> & { id: number; k: string };

async function chunkAfter(range: ReportRange, after: { k: string; id: number } | null, size: number): Promise<Raw[]> {
  const keyset = after ? 'AND (q.created_at > :k OR (q.created_at = :k AND q.id > :id))' : '';
  return db().query<Raw>(
    `SELECT STRAIGHT_JOIN q.id, DATE_FORMAT(q.created_at, '%Y-%m-%d %H:%i:%s.%f') AS k, q.number, q.status, q.created_at AS createdAt, q.sent_at AS sentAt,
            cu.name AS customerName, b.vehicle_label AS vehicleLabel, c.sku AS camSku,
            q.subtotal_cents AS subtotal, q.tax_cents AS tax, q.total_cents AS total, q.deposit_cents AS deposit
       FROM quotes q FORCE INDEX (quotes_created_at_id)
       JOIN customers cu FORCE INDEX (customers_id_name) ON cu.id = q.customer_id
       LEFT JOIN builds b FORCE INDEX (builds_id_label) ON b.id = q.build_id
       LEFT JOIN cams c ON c.id = q.cam_id
      WHERE q.created_at >= :start AND q.created_at < :end ${keyset}
      ORDER BY q.created_at ASC, q.id ASC
      LIMIT :size`,
    {
      type: QueryTypes.SELECT,
      replacements: {
        start: `${range.from} 00:00:00`,
        end: `${addDays(range.to, 1)} 00:00:00`,
        k: after?.k ?? null,
        id: after?.id ?? null,
        size,
      },
    },
  );
}

async function paymentsOf(ids: number[]): Promise<Map<number, { paid: number; refunded: number }>> {
  if (!ids.length) return new Map();
  const rows = await db().query<{ quoteId: unknown; paid: unknown; refunded: unknown }>(
    `SELECT quote_id AS quoteId, SUM(amount_cents) AS paid, SUM(refunded_cents) AS refunded
       FROM payments WHERE quote_id IN (:ids) AND status IN (:states) GROUP BY quote_id`,
    { type: QueryTypes.SELECT, replacements: { ids, states: PAID_PAYMENT_STATES } },
  );
  return new Map(rows.map((r) => [n(r.quoteId), { paid: n(r.paid), refunded: n(r.refunded) }]));
}

/** The range's quotes, a chunk at a time, until there are none left. */
export async function* quoteExportChunks(
  range: ReportRange,
  size = QUOTE_EXPORT_CHUNK,
): AsyncGenerator<QuoteExportRow[]> {
  let after: { k: string; id: number } | null = null;
  for (;;) {
    const rows = await chunkAfter(range, after, size);
    if (!rows.length) return;
    const pay = await paymentsOf(rows.map((r) => n(r.id)));
    yield rows.map((r) => ({
      number: String(r.number),
      status: r.status as QuoteStatus,
      createdAt: isoOf(r.createdAt)!,
      sentAt: isoOf(r.sentAt),
      customerName: String(r.customerName ?? ''),
      vehicleLabel: (r.vehicleLabel as string | null) ?? null,
      camSku: (r.camSku as string | null) ?? null,
      subtotalCents: n(r.subtotal),
      taxCents: n(r.tax),
      totalCents: n(r.total),
      depositCents: n(r.deposit),
      paidCents: pay.get(n(r.id))?.paid ?? 0,
      refundedCents: pay.get(n(r.id))?.refunded ?? 0,
    }));
    if (rows.length < size) return;
    const last = rows[rows.length - 1];
    after = { k: last.k, id: n(last.id) };
  }
}
