import { canSeeCosts } from '@/lib/auth/costs';
import type { SessionUser } from '@/lib/auth/guard';
import { counts } from './balance';
import type { PaymentRecord, QuoteRecord } from './types';

// What a reader of a quote may see. The query layer reads the whole record (src/lib/db/queries/quotes.ts);
// who sees costs is the `costs.read` row of the permission table, asked through src/lib/auth/costs.ts.

/** The quote without what the shop pays: no goods cost, no margin, no line's unit cost. */
export function withoutQuoteCosts(record: QuoteRecord): QuoteRecord {
  const { costCents: _c, marginCents: _m, ...rest } = record;
  void _c;
  void _m;
  return { ...rest, lines: rest.lines.map(({ unitCostCents: _u, ...line }) => (void _u, line)) };
}

/** Roles without 'costs.read' (technicians) read quotes without costs or margins. */
export function presentQuote(record: QuoteRecord, user: SessionUser): QuoteRecord {
  return canSeeCosts(user) ? record : withoutQuoteCosts(record);
}

const customerPayment = (p: PaymentRecord): PaymentRecord => ({
  ...p,
  providerSessionId: null,
  providerPaymentId: null,
  recordedBy: null,
});

/**
 * The quote as its customer reads it on the private link: no costs; the money that was taken (for their
 * receipts), never provider ids or who took it, nor which staff member approved a discount.
 */
export function customerQuote(record: QuoteRecord): QuoteRecord {
  const quote = withoutQuoteCosts(record);
  return {
    ...quote,
    discountApproval: { ...quote.discountApproval, approvedBy: null },
    payments: quote.payments.filter(counts).map(customerPayment),
  };
}
