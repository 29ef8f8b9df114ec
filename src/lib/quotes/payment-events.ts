import type { Transaction } from 'sequelize';
import type Stripe from 'stripe';
import { recordAudit } from '@/lib/audit';
import { retryOnLockContention } from '@/lib/db/lock-contention';
import { db, type Payment, type Quote } from '@/lib/db/models';
import {
  lockPayment,
  lockPayments,
  markGivenBack,
  markPaid,
  paymentForProviderPayment,
  paymentForSession,
  setRefundedCents,
  type PaymentStatus,
} from '@/lib/db/queries/quote-payments';
import { moveQuote } from '@/lib/db/queries/quote-lifecycle';
import { lockQuote } from '@/lib/db/queries/quotes';
import { settleAfterRefund } from '@/lib/db/queries/refund-effects';
import { payments } from '@/lib/payments';
import { balanceDueCents, counts, type PaymentPurpose } from './balance';
import { closeWhenPaid } from './balance-collection';
import { heldDeposit } from './checkout';
import { sessionMismatches } from './deposit-rules';
import { canTransition } from './lifecycle';
import { sendPaymentReceipt } from './payment-notices';
import { sendRefundNotice } from './quote-notices';
import type { WebhookResult } from './types';

// What the payment provider's events do (the webhook, src/app/api/payments/webhook). Each is idempotent:
// the same event twice changes nothing. A session the app did not open is never recorded. The quote row
// is locked before its payments, as on every money path, and a rollback over locks runs again.

const stripeId = (v: string | { id: string } | null | undefined) => (typeof v === 'string' ? v : (v?.id ?? null));
const OPEN: readonly PaymentStatus[] = ['pending', 'expired', 'failed'];

/**
 * checkout.session.completed. Only a session the app opened (a payments row with its id) is recorded,
 * and only when it charged exactly the amount asked for, for the quote it names. A second paid session
 * for a quote already paid, or money for a cancelled or declined quote, goes back through the SDK at once.
 * A refund the provider refuses rolls everything back and throws, so the delivery is retried later.
 */
export async function recordCheckoutCompleted(session: Stripe.Checkout.Session): Promise<WebhookResult> {
  if (session.payment_status !== 'paid') return { result: 'ignored' };
  // An unknown session is refused without writing anything.
  const known = await paymentForSession(session.id);
  if (!known) {
    console.warn(`[deposits] refused checkout.session.completed for ${session.id}: no checkout the app opened`);
    return { result: 'refused', reason: 'unknown-session' };
  }
  const outcome = await retryOnLockContention(() =>
    db().transaction((t) => completeLocked(session, known.quoteId, known.id, t)),
  );
  // After the commit, once: a replayed event answers 'already' and sends nothing.
  if (outcome.result === 'applied') await sendPaymentReceipt(known.quoteId, known.id);
  return outcome;
}

async function completeLocked(
  session: Stripe.Checkout.Session,
  quoteId: number,
  paymentId: number,
  t: Transaction,
): Promise<WebhookResult> {
  const quote = await lockQuote(quoteId, t);
  const payment = await lockPayment(paymentId, t);
  if (!quote || !payment) return { result: 'refused', reason: 'unknown-session' };
  if (!OPEN.includes(payment.status)) return { result: 'already' };
  const intent = stripeId(session.payment_intent);
  const problems = sessionMismatches(session, {
    quoteId,
    amountCents: payment.amountCents,
    currency: payment.currency,
  });
  if (!intent) problems.push('the session has no payment');
  if (problems.length || !intent) {
    await recordAudit(
      {
        actor: 'payments-webhook',
        action: 'payment.refused',
        entityType: 'quote',
        entityId: quoteId,
        after: { paymentId, session: session.id, problems },
      },
      t,
    );
    return { result: 'refused', reason: problems.join('; ') };
  }
  if (payment.purpose === 'balance') return completeBalanceLocked(quote, payment, intent, session.id, t);
  const others = await lockPayments(quoteId, t, { except: paymentId });
  const earlier = heldDeposit(others);
  // Money for a quote the lifecycle says cannot be paid now (cancelled, declined, replaced, ...) goes back.
  const closed = !canTransition(quote.status, 'deposit-paid', 'payment');
  if (earlier || closed) {
    await payments().refunds.create(
      {
        payment_intent: intent,
        reason: earlier ? 'duplicate' : 'requested_by_customer',
        metadata: { quoteId: String(quoteId), paymentId: String(paymentId) },
      },
      { idempotencyKey: `deposit-auto-refund-${session.id}` },
    );
    await markGivenBack(payment, intent, earlier?.id ?? null, t);
    await recordAudit(
      {
        actor: 'payments-webhook',
        action: earlier ? 'payment.duplicate-refunded' : 'payment.closed-quote-refunded',
        entityType: 'quote',
        entityId: quoteId,
        after: {
          paymentId,
          session: session.id,
          amountCents: payment.amountCents,
          duplicateOfPaymentId: earlier?.id ?? null,
          quoteStatus: quote.status,
        },
      },
      t,
    );
    return earlier
      ? { result: 'refunded-duplicate', duplicateOfPaymentId: earlier.id }
      : { result: 'refunded-closed-quote' };
  }
  await markPaid(payment, intent, t);
  await moveQuote(quote, 'deposit-paid', 'payment', { actor: 'payments-webhook' }, t, { paymentId });
  await recordAudit(
    {
      actor: 'payments-webhook',
      action: 'payment.received',
      entityType: 'quote',
      entityId: quoteId,
      after: { paymentId, amountCents: payment.amountCents },
    },
    t,
  );
  return { result: 'applied' };
}

/**
 * A completed balance session (the amount, currency and quote already checked against our own row, both
 * rows locked). Money for a quote that no longer owes it — paid at the counter meanwhile, closed, or more
 * than is left — goes back through the SDK at once, kept and never counted; otherwise it is recorded and
 * the quote closes when nothing is left.
 */
async function completeBalanceLocked(
  quote: Quote,
  payment: Payment,
  intent: string,
  sessionId: string,
  t: Transaction,
): Promise<WebhookResult> {
  const others = await lockPayments(quote.id, t, { except: payment.id });
  const due = balanceDueCents(quote.totalCents, others);
  if (quote.status !== 'deposit-paid' || payment.amountCents > due) {
    const earlier = [...others].reverse().find((p) => p.purpose === 'balance' && counts(p));
    await payments().refunds.create(
      {
        payment_intent: intent,
        reason: earlier ? 'duplicate' : 'requested_by_customer',
        metadata: { quoteId: String(quote.id), paymentId: String(payment.id) },
      },
      { idempotencyKey: `balance-auto-refund-${sessionId}` },
    );
    await markGivenBack(payment, intent, earlier?.id ?? null, t);
    await recordAudit(
      {
        actor: 'payments-webhook',
        action: 'payment.balance-refunded',
        entityType: 'quote',
        entityId: quote.id,
        after: {
          paymentId: payment.id,
          session: sessionId,
          amountCents: payment.amountCents,
          dueCents: due,
          quoteStatus: quote.status,
          duplicateOfPaymentId: earlier?.id ?? null,
        },
      },
      t,
    );
    return earlier
      ? { result: 'refunded-duplicate', duplicateOfPaymentId: earlier.id }
      : { result: 'refunded-closed-quote' };
  }
  await markPaid(payment, intent, t);
  await recordAudit(
    {
      actor: 'payments-webhook',
      action: 'payment.received',
      entityType: 'quote',
      entityId: quote.id,
      after: { paymentId: payment.id, amountCents: payment.amountCents, purpose: 'balance' },
    },
    t,
  );
  await closeWhenPaid(quote, { actor: 'payments-webhook' }, payment.id, t);
  return { result: 'applied' };
}

/** charge.refunded: the provider's running refunded amount is the truth; never counted twice. */
export async function recordChargeRefunded(charge: Stripe.Charge): Promise<WebhookResult> {
  const intent = stripeId(charge.payment_intent);
  if (!intent) return { result: 'ignored' };
  const known = await paymentForProviderPayment(intent);
  if (!known) return { result: 'ignored' };
  // Set inside the transaction's callback (control flow does not follow it there, hence the cast).
  let settled = null as { amountCents: number; purpose: PaymentPurpose } | null;
  const outcome = await retryOnLockContention(() =>
    db().transaction(async (t): Promise<WebhookResult> => {
      const quote = await lockQuote(known.quoteId, t);
      const payment = await lockPayment(known.id, t);
      if (!payment || !quote) return { result: 'ignored' };
      const refunded = Math.min(payment.amountCents, Math.max(payment.refundedCents, charge.amount_refunded));
      if (refunded === payment.refundedCents) return { result: 'already' };
      const before = payment.refundedCents;
      await setRefundedCents(payment, refunded, t);
      await recordAudit(
        {
          actor: 'payments-webhook',
          action: 'payment.refunded',
          entityType: 'quote',
          entityId: payment.quoteId,
          after: { paymentId: payment.id, refundedCents: refunded },
        },
        t,
      );
      // A refund made at the provider, outside the app: the job is cancelled, as the app's own default.
      const settlement = await settleAfterRefund(quote, 'cancel', { actor: 'payments-webhook' }, t);
      if (settlement !== 'unchanged') settled = { amountCents: refunded - before, purpose: payment.purpose };
      return { result: 'applied' };
    }),
  );
  if (settled) await sendRefundNotice(known.quoteId, settled);
  return outcome;
}
