import type { Transaction } from 'sequelize';
import { recordAudit } from '@/lib/audit';
import type { SessionUser } from '@/lib/auth/guard';
import { retryOnLockContention } from '@/lib/db/lock-contention';
import { db, type Payment } from '@/lib/db/models';
import { lockRefundablePayment, rereadPayment, setRefundedCents } from '@/lib/db/queries/quote-payments';
import { touchQuote } from '@/lib/db/queries/quote-writes';
import { getQuote, lockQuote } from '@/lib/db/queries/quotes';
import { presentQuote } from './present';
import { settleAfterRefund } from '@/lib/db/queries/refund-effects';
import { HttpError } from '@/lib/http/errors';
import { payments } from '@/lib/payments';
import { sendRefundNotice } from './quote-notices';
import { fieldsRefused, noQuoteWithId, stateRefused } from './refusals';
import type { AfterFullRefund, QuoteRecord } from './types';

// A manager's refund of a payment on a quote: the deposit or a balance payment. Money paid online goes back
// through the payments SDK; money taken at the counter is handed back there and only recorded. What the
// refund does to the quote is src/lib/db/queries/refund-effects.ts; the customer's notice goes after the commit.

export type RefundInput = {
  version: number;
  amountCents: number;
  /** Which payment; without it, the latest deposit still held. */
  paymentId?: number;
  reason?: string;
  afterFullRefund?: AfterFullRefund;
};

/** Gives the money back: through the provider for an online payment; a counter payment is recorded only. */
async function giveBack(payment: Payment, input: RefundInput, quoteId: number, user: SessionUser): Promise<void> {
  if (payment.provider === 'counter') return;
  if (!payment.providerPaymentId) throw stateRefused('This payment has no payment-service record to refund against.');
  try {
    await payments().refunds.create(
      {
        payment_intent: payment.providerPaymentId,
        amount: input.amountCents,
        metadata: {
          quoteId: String(quoteId),
          byUser: String(user.id),
          ...(input.reason ? { note: input.reason.slice(0, 200) } : {}),
        },
      },
      { idempotencyKey: `refund-${payment.id}-${payment.refundedCents}-${input.amountCents}` },
    );
  } catch (error) {
    const message = error instanceof Error ? error.message : 'no answer';
    throw new HttpError(502, `The payment service refused the refund: ${message}. Nothing was changed.`);
  }
}

async function changedSince(id: number, message: string, user: SessionUser, t: Transaction): Promise<HttpError> {
  const current = await getQuote(id, t);
  return new HttpError(409, message, current ? { current: presentQuote(current, user) } : {});
}

/**
 * Refunds part or all of one paid payment; never more than is left on it. The caller's version guards
 * against a double click or a second post: the refund moves the quote's version, so the same request
 * refunds once and the other answers 409 with the quote as it is now. A refund that leaves a closed job
 * owing money reopens it with a balance due; once nothing is held the job is cancelled (or the quote
 * reopened, as the manager chooses). The customer is e-mailed. A refund the provider refuses changes
 * nothing (502).
 */
export async function refundQuote(id: number, input: RefundInput, user: SessionUser): Promise<QuoteRecord> {
  const done = await retryOnLockContention(() =>
    db().transaction(async (t) => {
      // The quote row first, then its payments: the order every money path locks in.
      const quote = await lockQuote(id, t);
      if (!quote) throw noQuoteWithId(id);
      if (quote.version !== input.version)
        throw await changedSince(
          id,
          `Quote ${quote.number} changed after you opened it (a refund or payment may just have been recorded). Nothing was refunded; look again and retry.`,
          user,
          t,
        );
      const payment = await lockRefundablePayment(id, input.paymentId, t);
      if (!payment) {
        if (input.paymentId !== undefined)
          throw fieldsRefused([
            {
              field: 'paymentId',
              message: `payment ${input.paymentId} is not a paid payment of quote ${quote.number} with money left to refund`,
            },
          ]);
        throw stateRefused(`Quote ${quote.number} has no paid deposit to refund.`);
      }
      const left = payment.amountCents - payment.refundedCents;
      if (input.amountCents > left) {
        throw fieldsRefused([
          {
            field: 'amountCents',
            message: `at most ${left} cents can be refunded (paid ${payment.amountCents}, already refunded ${payment.refundedCents})`,
          },
        ]);
      }
      await giveBack(payment, input, id, user);
      // The webhook may have landed first; both sides take the larger running total, so it is counted once.
      await rereadPayment(payment, t);
      const refunded = Math.min(
        payment.amountCents,
        Math.max(payment.refundedCents, payment.amountCents - left + input.amountCents),
      );
      await setRefundedCents(payment, refunded, t);
      await recordAudit(
        {
          user,
          action: 'payment.refund-requested',
          entityType: 'quote',
          entityId: id,
          after: {
            paymentId: payment.id,
            purpose: payment.purpose,
            method: payment.method,
            amountCents: input.amountCents,
            reason: input.reason ?? null,
          },
        },
        t,
      );
      await touchQuote(quote, t);
      await settleAfterRefund(quote, input.afterFullRefund ?? 'cancel', { user }, t);
      return { purpose: payment.purpose, atCounter: payment.provider === 'counter' };
    }),
  );
  await sendRefundNotice(id, { amountCents: input.amountCents, ...done });
  return (await getQuote(id))!;
}
