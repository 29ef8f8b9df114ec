import 'server-only';
import type { Transaction } from 'sequelize';
import { recordAudit } from '@/lib/audit';
import { balanceDueCents, counts } from '@/lib/quotes/balance';
import type { AfterFullRefund } from '@/lib/quotes/types';
import { Quote } from '../models';
import { moveQuote, type AuditActor } from './quote-lifecycle';
import { HELD, paymentsOf } from './quote-payments';

// What a refund (of the deposit or of a balance payment) does to the quote, so no page keeps telling an
// old story: a closed job that owes money again goes back to an open job with a balance due; when no money
// is held any more, the job is cancelled (the default) or the quote reopened for a new payment, as the
// manager chooses. The moves themselves are the lifecycle's (src/lib/quotes/lifecycle.ts, via 'refund').

export type { AfterFullRefund };

/** Where the quote stands after a refund; 'unchanged' when its state did not move. */
export type RefundSettlement = 'unchanged' | 'balance-due' | 'cancelled' | 'reopened';

/** Called with the quote row (and the refunded payment) locked, after a payment's refunded amount changed. */
export async function settleAfterRefund(
  quote: Quote,
  after: AfterFullRefund,
  actor: AuditActor,
  t: Transaction,
): Promise<RefundSettlement> {
  const rows = await paymentsOf(quote.id, t);
  let settlement: RefundSettlement = 'unchanged';
  if (quote.status === 'closed' && balanceDueCents(quote.totalCents, rows) > 0) {
    await moveQuote(quote, 'deposit-paid', 'refund', actor, t);
    settlement = 'balance-due';
  }
  if (quote.status !== 'deposit-paid' && quote.status !== 'accepted') return settlement;
  if (rows.some((p) => counts(p) && HELD.includes(p.status))) return settlement;
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
  return to === 'sent' ? 'reopened' : 'cancelled';
}
