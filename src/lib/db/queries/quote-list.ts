import 'server-only';
import { QueryTypes } from 'sequelize';
import type { QuoteListQuery } from '@/lib/schemas/quote-list';
import { Build, Customer, db, Payment, Quote } from '../models';
import type { QuoteStatus } from '../models/quote';
import { customerMatchSql } from './customers';
import { prefixLike, textSearch } from './text-search';

// The staff quote list: newest change first (id breaks ties), a page at a time with the total, by
// state and by a search over the number, the customer and the vehicle. The page's ids come from an
// index-ordered query (quotes_updated_at_id / quotes_status_updated_at_id); only that page's rows are
// then read with their customer, vehicle and payments.

export type QuoteSummary = {
  id: number;
  number: string;
  status: QuoteStatus;
  totalCents: number;
  depositCents: number;
  version: number;
  updatedAt: string;
  sentAt: string | null;
  customerName: string;
  vehicleLabel: string | null;
  paymentStatus: Payment['status'] | null;
  /** 'pending': a counter discount above the shop's limit waits for a manager (src/lib/quotes/discount-approval.ts). */
  discountApproval: Quote['discountApproval'];
};

type Row = Quote & { customer?: Customer; build?: Build | null; payments?: Payment[] };

const iso = (d: Date | string | null | undefined) => (d ? new Date(d).toISOString() : null);

/** "2026-0042" is how people say Q-2026-0042; anything else is matched from the number's start. */
function numberPrefix(q: string): string {
  const t = q.trim().toUpperCase();
  return prefixLike(/^\d{4}-\d*$/.test(t) ? `Q-${t}` : t);
}

/**
 * The ids that match q, as a derived table. A UNION of three indexed lookups (number prefix on the
 * unique index, customers and vehicles through their FULLTEXT indexes) instead of one OR, which MariaDB
 * could only answer by scanning every quote.
 */
function matchingIdsSql(q: string): string {
  const e = (v: string) => db().escape(v);
  const search = textSearch(q);
  const parts = [`SELECT id FROM quotes WHERE number LIKE ${e(numberPrefix(q))}`];
  if (search.kind !== 'nothing') {
    parts.push(
      `SELECT qc.id FROM customers c JOIN quotes qc ON qc.customer_id = c.id WHERE ${customerMatchSql(search, 'c')}`,
    );
  }
  if (search.kind === 'fulltext') {
    parts.push(
      `SELECT qb.id FROM builds b JOIN quotes qb ON qb.build_id = b.id WHERE MATCH(b.vehicle_label) AGAINST (${e(search.against)} IN BOOLEAN MODE)`,
    );
  }
  return parts.join(' UNION ');
}

/**
 * Without a search the total is read off quote_status_counts (kept by triggers on quotes, see
 * database/migrations/20261205001400-quote-counts-and-name-covers.js): an exact COUNT(*) walked 200,000
 * index entries on every page. A search counts its own matches, which its indexes keep few.
 */
function totalSql(from: string, where: string, status: QuoteListQuery['status'], searching: boolean): string {
  if (searching) return `SELECT COUNT(*) AS total FROM ${from} ${where}`;
  return `SELECT COALESCE(SUM(quotes), 0) AS total FROM quote_status_counts${status ? ` WHERE status = ${db().escape(status)}` : ''}`;
}

async function pageIds(query: QuoteListQuery): Promise<{ ids: number[]; total: number }> {
  const sequelize = db();
  const from = query.q ? `(${matchingIdsSql(query.q)}) m JOIN quotes q ON q.id = m.id` : 'quotes q';
  const where = query.status ? `WHERE q.status = ${sequelize.escape(query.status)}` : '';
  const offset = (query.page - 1) * query.pageSize;
  const [rows, counted] = await Promise.all([
    sequelize.query<{ id: number }>(
      `SELECT q.id FROM ${from} ${where} ORDER BY q.updated_at DESC, q.id DESC LIMIT ${query.pageSize} OFFSET ${offset}`,
      { type: QueryTypes.SELECT },
    ),
    sequelize.query<{ total: unknown }>(totalSql(from, where, query.status, Boolean(query.q)), {
      type: QueryTypes.SELECT,
    }),
  ]);
  return { ids: rows.map((r) => Number(r.id)), total: Number(counted[0]?.total ?? 0) };
}

export async function listQuotes(query: QuoteListQuery): Promise<{ items: QuoteSummary[]; total: number }> {
  const { ids, total } = await pageIds(query);
  if (!ids.length) return { items: [], total };
  const rows = (await Quote.findAll({
    where: { id: ids },
    include: [
      { model: Customer, as: 'customer', attributes: ['name'] },
      { model: Build, as: 'build', attributes: ['vehicleLabel'] },
      { model: Payment, as: 'payments', attributes: ['id', 'status'] },
    ],
  })) as Row[];
  const byId = new Map(rows.map((r) => [r.id, r]));
  const items = ids.flatMap((id) => {
    const q = byId.get(id);
    if (!q) return []; // deleted between the two reads
    const last = [...(q.payments ?? [])].sort((a, b) => b.id - a.id)[0];
    return [
      {
        id: q.id,
        number: q.number,
        status: q.status,
        totalCents: q.totalCents,
        depositCents: q.depositCents,
        version: q.version,
        updatedAt: iso(q.updatedAt)!,
        sentAt: iso(q.sentAt),
        customerName: q.customer?.name ?? 'Unknown customer',
        vehicleLabel: q.build?.vehicleLabel ?? null,
        paymentStatus: last?.status ?? null,
        discountApproval: q.discountApproval ?? 'none',
      },
    ];
  });
  return { items, total };
}
