import { centsToDollars, toCsv, type CsvCell } from '@/lib/catalogue/csv';
import type { QuoteExportRow } from '@/lib/db/queries/quote-export';

// The quotes export: one row per quote, money in dollars and cents. It goes through the catalogue's
// toCsv, so any text cell a spreadsheet would run as a formula gets a leading apostrophe.
export const QUOTE_CSV_HEADER = [
  'number',
  'status',
  'created_utc',
  'sent_utc',
  'customer',
  'vehicle',
  'cam_sku',
  'subtotal_usd',
  'tax_usd',
  'total_usd',
  'deposit_usd',
  'paid_usd',
  'refunded_usd',
] as const;

export function quotesToCsv(rows: readonly QuoteExportRow[]): string {
  const data: CsvCell[][] = rows.map((r) => [
    r.number,
    r.status,
    r.createdAt,
    r.sentAt,
    r.customerName,
    r.vehicleLabel,
    r.camSku,
    centsToDollars(r.subtotalCents),
    centsToDollars(r.taxCents),
    centsToDollars(r.totalCents),
    centsToDollars(r.depositCents),
    centsToDollars(r.paidCents),
    centsToDollars(r.refundedCents),
  ]);
  return toCsv(QUOTE_CSV_HEADER, data);
}

/** The header line alone, without its line break: the first thing a streamed export sends. */
export function quoteCsvHeader(): string {
  // Plain lower-case names: nothing to quote or neutralise (and papaparse ends an empty table with a CRLF).
  return QUOTE_CSV_HEADER.join(',');
}

/** Rows without the header, each ending in CRLF, to follow the header in a stream. */
export function quoteCsvRows(rows: readonly QuoteExportRow[]): string {
  if (!rows.length) return '';
  const csv = quotesToCsv(rows);
  // The header is fixed text without quotes or line breaks, so the first CRLF ends it.
  return `${csv.slice(csv.indexOf('\r\n') + 2)}\r\n`;
}
