import { recordAudit } from '@/lib/audit';
import type { SessionUser } from '@/lib/auth/guard';
import { db } from '@/lib/db/models';
import { lockRefundableDeposit, setRefundedCents } from '@/lib/db/queries/quote-payments';
import { getQuote, lockQuote } from '@/lib/db/queries/quotes';
import { settleFullRefund } from '@/lib/db/queries/refund-effects';
import { HttpError } from '@/lib/http/errors';
import { payments } from '@/lib/payments';
import { sendRefundNotice } from './quote-notices';
import { fieldsRefused, noQuoteWithId, stateRefused } from './refusals';
import type { AfterFullRefund, QuoteRecord } from './types';

// A manager's refund of the deposit, through the payments SDK. What a full refund does to the quote is
// src/lib/db/queries/refund-effects.ts; the customer's notice goes after the commit.

/**
 * Refunds part or all of the paid deposit; never more than is left. A full refund cancels the job (or
 * reopens the quote, as the manager chooses) and e-mails the customer. A refund the provider refuses
 * changes nothing (502).
 */
export async function refundQuote(
  id: number,
  amountCents: number,
  reason: string | undefined,
  user: SessionUser,
  afterFullRefund: AfterFullRefund = 'cancel',
): Promise<QuoteRecord> {
  const settled = await db().transaction(async (t) => {
    // The quote row first, then its payments: the order every money path locks in.
    const quote = await lockQuote(id, t);
    if (!quote) throw noQuoteWithId(id);
    const payment = await lockRefundableDeposit(id, t);
    if (!payment || !payment.providerPaymentId)
      throw stateRefused(`Quote ${quote.number} has no paid deposit to refund.`);
    const left = payment.amountCents - payment.refundedCents;
    if (amountCents > left) {
      throw fieldsRefused([
        {
          field: 'amountCents',
          message: `at most ${left} cents can be refunded (paid ${payment.amountCents}, already refunded ${payment.refundedCents})`,
        },
      ]);
    }
    try {
      await payments().refunds.create(
        {
          payment_intent: payment.providerPaymentId,
          amount: amountCents,
          metadata: { quoteId: String(id), byUser: String(user.id), ...(reason ? { note: reason.slice(0, 200) } : {}) },
        },
        { idempotencyKey: `refund-${payment.id}-${payment.refundedCents}-${amountCents}` },
      );
    } catch (error) {
      const message = error instanceof Error ? error.message : 'no answer';
      throw new HttpError(502, `The payment service refused the refund: ${message}. Nothing was changed.`);
    }
    // The webhook may have landed first; both sides take the larger running total, so it is counted once.
    await payment.reload({ transaction: t, lock: t.LOCK.UPDATE });
    const refunded = Math.min(
      payment.amountCents,
      Math.max(payment.refundedCents, payment.amountCents - left + amountCents),
    );
    await setRefundedCents(payment, refunded, t);
    await recordAudit(
      {
        user,
        action: 'payment.refund-requested',
        entityType: 'quote',
        entityId: id,
        after: { paymentId: payment.id, amountCents, reason: reason ?? null },
      },
      t,
    );
    return payment.status === 'refunded' && (await settleFullRefund(quote, afterFullRefund, { user }, t));
  });
  if (settled) await sendRefundNotice(id);
  return (await getQuote(id))!;
}
