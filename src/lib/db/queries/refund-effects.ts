import 'server-only';
import { Op, type Transaction } from 'sequelize';
import { recordAudit } from '@/lib/audit';
import type { AfterFullRefund } from '@/lib/quotes/types';
import { Payment, Quote } from '../models';
import { moveQuote, type AuditActor } from './quote-lifecycle';

// What a full refund of the deposit does to the quote, so no page keeps saying "Deposit paid": the job
// is cancelled (the default) or the quote reopened for a new payment, as the manager chooses. The move
// itself is the lifecycle's (src/lib/quotes/lifecycle.ts, via 'refund').

export type { AfterFullRefund };

/**
 * Called with the quote row locked, after a payment's refunded amount changed. When no deposit is held
 * any more, a paid quote becomes cancelled or sent again. Returns true when it changed the quote.
 */
export async function settleFullRefund(
  quote: Quote,
  after: AfterFullRefund,
  actor: AuditActor,
  t: Transaction,
): Promise<boolean> {
  if (quote.status !== 'deposit-paid' && quote.status !== 'accepted') return false;
  const held = await Payment.count({
    where: { quoteId: quote.id, status: { [Op.in]: ['paid', 'partially-refunded'] }, duplicateOfPaymentId: null },
    transaction: t,
  });
  if (held > 0) return false;
  const to = after === 'reopen' ? 'sent' : 'cancelled';
  const from = quote.status;
  await moveQuote(quote, to, 'refund', actor, t);
  await recordAudit(
    {
      ...actor,
      action: 'quote.deposit-refunded',
      entityType: 'quote',
      entityId: quote.id,
      before: { status: from },
      after: { status: to },
    },
    t,
  );
  return true;
}
