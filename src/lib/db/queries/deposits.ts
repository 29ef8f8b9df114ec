import { Op, type Transaction } from 'sequelize';
import type Stripe from 'stripe';
import { recordAudit } from '@/lib/audit';
import { appBaseUrl } from '@/lib/env';
import { payments } from '@/lib/payments';
import { retryOnLockContention } from '@/lib/db/lock-contention';
import { isPastValidUntil, sessionMismatches } from '@/lib/quotes/deposit-rules';
import { db, Payment, Quote } from '../models';
import { getQuoteByToken, sha256 } from './quotes';
import { sendRefundNotice, settleFullRefund } from './refund-effects';
import { canTransition, isOpen, stateWord } from '@/lib/quotes/lifecycle';
import { moveQuote } from './quote-lifecycle';
import { completeBalanceLocked } from './balance';
import { sendPaymentReceipt } from './payment-notices';

// The deposit, taken exactly once. Every path that changes a quote's payments locks the quote row
// first and its payments second, so checkouts and webhook deliveries queue behind one another instead
// of deadlocking; a rollback over locks is retried. A session the app did not open is never recorded.

/** What the customer's page and a refused checkout say about where the quote stands. */
export type CheckoutState = { status: Quote['status']; depositPaid: boolean; validUntil: string | null; expired: boolean; paymentConfirming: boolean };

export type CheckoutOutcome =
  | { ok: true; url: string; reused: boolean }
  | { ok: false; status: 404 | 409 | 502 | 503; message: string; state?: CheckoutState };

const HELD: readonly Payment['status'][] = ['paid', 'partially-refunded'];
// An open session this close to its own expiry is replaced rather than handed out again.
const REUSE_MARGIN_SECONDS = 10 * 60;

/** The deposit payment that counts: paid (or partly refunded) and not a refunded duplicate. */
const heldDeposit = (rows: readonly Payment[]) => rows.find((p) => p.purpose !== 'balance' && p.duplicateOfPaymentId === null && HELD.includes(p.status));

function stateOf(quote: Quote, rows: readonly Payment[], paymentConfirming = false): CheckoutState {
  const depositPaid = Boolean(heldDeposit(rows)) || quote.status === 'deposit-paid';
  return { status: quote.status, depositPaid, validUntil: quote.validUntil ?? null, expired: isPastValidUntil(quote.validUntil ?? null), paymentConfirming };
}

const refusal = (message: string, quote: Quote, rows: readonly Payment[], confirming = false): CheckoutOutcome => ({
  ok: false, status: 409, message, state: stateOf(quote, rows, confirming),
});
const providerDown: CheckoutOutcome = { ok: false, status: 502, message: 'The payment service did not answer. Nothing was charged; please try again in a moment.' };

/**
 * The open checkouts among `rows` (one purpose: the deposit or the balance): one for exactly `amountCents`
 * that is not about to lapse is handed out again; any other is expired through the SDK first. Returns the
 * answer to give (that session, "being confirmed", the provider down), or null to open a new session.
 */
export async function settleOpenSessions(rows: readonly Payment[], amountCents: number, confirming: (message: string) => CheckoutOutcome, t: Transaction): Promise<CheckoutOutcome | null> {
  for (const pending of rows.filter((p) => p.status === 'pending' && p.providerSessionId)) {
    let session: Stripe.Checkout.Session;
    try {
      session = await payments().checkout.sessions.retrieve(pending.providerSessionId!);
    } catch {
      return providerDown;
    }
    if (session.status === 'complete') return confirming('Your payment has reached the payment service and is being confirmed. Refresh this page in a minute; you will not be charged twice.');
    const fits = session.amount_total === amountCents && (session.currency ?? '') === pending.currency && session.expires_at - Date.now() / 1000 > REUSE_MARGIN_SECONDS;
    if (session.status === 'open' && fits && session.url) return { ok: true, url: session.url, reused: true };
    if (session.status === 'open') {
      try {
        await payments().checkout.sessions.expire(session.id);
      } catch {
        // It may have been paid in the meantime; its webhook decides, and a second payment is refunded.
        return confirming('A payment for this quote is in progress. Refresh this page in a minute.');
      }
    }
    pending.set({ status: 'expired' });
    await pending.save({ transaction: t });
  }
  return null;
}

/**
 * The customer's "Accept and pay the deposit". An open session for the same deposit is handed out again;
 * one that no longer fits (other amount, about to lapse) is expired through the SDK first. A paid,
 * closed or expired quote answers 409 with its state. The quote stays as it is until the money arrives.
 */
export async function startCheckout(token: string): Promise<CheckoutOutcome> {
  const found = await getQuoteByToken(token);
  if (!found) return { ok: false, status: 404, message: 'This link does not open a quote.' };
  const { shop } = found;
  const quoteId = found.quote.id;
  try {
    return await retryOnLockContention(() => db().transaction((t) => checkoutLocked(quoteId, token, shop.currency, found.quote.customer.email, t)));
  } catch (error) {
    console.error('[deposits] checkout failed', error);
    return { ok: false, status: 503, message: 'We could not start the payment just now. Nothing was charged; please try again in a moment.' };
  }
}

async function checkoutLocked(quoteId: number, token: string, currency: string, email: string | null, t: Transaction): Promise<CheckoutOutcome> {
  const quote = await Quote.findByPk(quoteId, { transaction: t, lock: t.LOCK.UPDATE });
  if (!quote) return { ok: false, status: 404, message: 'This link does not open a quote.' };
  const rows = await Payment.findAll({ where: { quoteId }, order: [['id', 'ASC']], transaction: t, lock: t.LOCK.UPDATE });
  if (stateOf(quote, rows).depositPaid) return refusal(`The deposit for quote ${quote.number} has already been paid; nothing more is due online.`, quote, rows);
  if (quote.status === 'replaced') return refusal(`Quote ${quote.number} was replaced by a newer quote; please pay from the newer quote's link we e-mailed you.`, quote, rows);
  if (!isOpen(quote.status)) return refusal(`Quote ${quote.number} is ${stateWord(quote.status).toLowerCase()} and can no longer be paid online. Please call the shop.`, quote, rows);
  if (isPastValidUntil(quote.validUntil ?? null)) {
    return refusal(`Quote ${quote.number} was valid until ${quote.validUntil} and can no longer be accepted or paid. Ask the shop for a fresh quote.`, quote, rows);
  }
  if (quote.depositCents <= 0) return refusal('This quote has no deposit to pay.', quote, rows);

  const open = await settleOpenSessions(rows.filter((p) => p.purpose !== 'balance'), quote.depositCents, (message) => refusal(message, quote, rows, true), t);
  if (open) return open;

  const back = `${appBaseUrl()}/q/${token}`;
  let session: Stripe.Checkout.Session;
  try {
    session = await payments().checkout.sessions.create(
      {
        mode: 'payment',
        line_items: [{ quantity: 1, price_data: { currency, unit_amount: quote.depositCents, product_data: { name: `Deposit for quote ${quote.number}` } } }],
        success_url: `${back}?paid=1`,
        cancel_url: `${back}?cancelled=1`,
        client_reference_id: String(quote.id),
        metadata: { quoteId: String(quote.id), quoteNumber: quote.number },
        payment_intent_data: { metadata: { quoteId: String(quote.id), quoteNumber: quote.number } },
        ...(email ? { customer_email: email } : {}),
      },
      // A retried transaction asks for the same session again instead of opening a second one.
      { idempotencyKey: `checkout-${quote.number}-${rows.length + 1}-${sha256(token).slice(0, 16)}` },
    );
  } catch {
    return providerDown;
  }
  if (!session.url) return { ok: false, status: 502, message: 'The payment service gave no payment page. Nothing was charged; please try again.' };
  await Payment.create({ quoteId, providerSessionId: session.id, providerPaymentId: null, amountCents: quote.depositCents, currency, status: 'pending', paidAt: null }, { transaction: t });
  await recordAudit({ actor: 'customer-link', action: 'quote.checkout-started', entityType: 'quote', entityId: quote.id, after: { session: session.id, amountCents: quote.depositCents } }, t);
  return { ok: true, url: session.url, reused: false };
}

// ---- Webhook effects (each idempotent: the same event twice changes nothing) ----

export type WebhookResult =
  | { result: 'applied' | 'already' | 'ignored' }
  | { result: 'refused'; reason: string }
  | { result: 'refunded-duplicate'; duplicateOfPaymentId: number }
  | { result: 'refunded-closed-quote' };

const stripeId = (v: string | { id: string } | null | undefined) => (typeof v === 'string' ? v : (v?.id ?? null));
const OPEN: readonly Payment['status'][] = ['pending', 'expired', 'failed'];

/**
 * checkout.session.completed. Only a session the app opened (a payments row with its id) is recorded,
 * and only when it charged exactly the deposit asked for, for the quote it names. A second paid session
 * for a quote already paid, or money for a cancelled or declined quote, goes back through the SDK at once.
 * A refund the provider refuses rolls everything back and throws, so the delivery is retried later.
 */
export async function recordCheckoutCompleted(session: Stripe.Checkout.Session): Promise<WebhookResult> {
  if (session.payment_status !== 'paid') return { result: 'ignored' };
  db();
  // Not locked: a locking read of a row that is not there takes a gap lock, and concurrent inserts into
  // that gap deadlock. An unknown session is refused without writing anything.
  const known = await Payment.findOne({ where: { providerSessionId: session.id }, attributes: ['id', 'quoteId'] });
  if (!known) {
    console.warn(`[deposits] refused checkout.session.completed for ${session.id}: no checkout the app opened`);
    return { result: 'refused', reason: 'unknown-session' };
  }
  const outcome = await retryOnLockContention(() => db().transaction((t) => completeLocked(session, known.quoteId, known.id, t)));
  // After the commit, once: a replayed event answers 'already' and sends nothing.
  if (outcome.result === 'applied') await sendPaymentReceipt(known.quoteId, known.id);
  return outcome;
}

async function completeLocked(session: Stripe.Checkout.Session, quoteId: number, paymentId: number, t: Transaction): Promise<WebhookResult> {
  const quote = await Quote.findByPk(quoteId, { transaction: t, lock: t.LOCK.UPDATE });
  const payment = await Payment.findByPk(paymentId, { transaction: t, lock: t.LOCK.UPDATE });
  if (!quote || !payment) return { result: 'refused', reason: 'unknown-session' };
  if (!OPEN.includes(payment.status)) return { result: 'already' };
  const intent = stripeId(session.payment_intent);
  const problems = sessionMismatches(session, { quoteId, amountCents: payment.amountCents, currency: payment.currency });
  if (!intent) problems.push('the session has no payment');
  if (problems.length) {
    await recordAudit({ actor: 'payments-webhook', action: 'payment.refused', entityType: 'quote', entityId: quoteId, after: { paymentId, session: session.id, problems } }, t);
    return { result: 'refused', reason: problems.join('; ') };
  }
  if (payment.purpose === 'balance') return completeBalanceLocked(quote, payment, intent!, session.id, t);
  const others = await Payment.findAll({ where: { quoteId, id: { [Op.ne]: paymentId } }, transaction: t, lock: t.LOCK.UPDATE });
  const earlier = heldDeposit(others);
  // Money for a quote the lifecycle says cannot be paid now (cancelled, declined, replaced, ...) goes back.
  const closed = !canTransition(quote.status, 'deposit-paid', 'payment');
  if (earlier || closed) {
    await payments().refunds.create(
      { payment_intent: intent!, reason: earlier ? 'duplicate' : 'requested_by_customer', metadata: { quoteId: String(quoteId), paymentId: String(paymentId) } },
      { idempotencyKey: `deposit-auto-refund-${session.id}` },
    );
    payment.set({ status: 'refunded', refundedCents: payment.amountCents, paidAt: new Date(), providerPaymentId: intent, duplicateOfPaymentId: earlier?.id ?? null });
    await payment.save({ transaction: t });
    await recordAudit(
      {
        actor: 'payments-webhook', action: earlier ? 'payment.duplicate-refunded' : 'payment.closed-quote-refunded', entityType: 'quote', entityId: quoteId,
        after: { paymentId, session: session.id, amountCents: payment.amountCents, duplicateOfPaymentId: earlier?.id ?? null, quoteStatus: quote.status },
      },
      t,
    );
    return earlier ? { result: 'refunded-duplicate', duplicateOfPaymentId: earlier.id } : { result: 'refunded-closed-quote' };
  }
  payment.set({ status: 'paid', paidAt: new Date(), providerPaymentId: intent });
  await payment.save({ transaction: t });
  await moveQuote(quote, 'deposit-paid', 'payment', { actor: 'payments-webhook' }, t, { paymentId });
  await recordAudit({ actor: 'payments-webhook', action: 'payment.received', entityType: 'quote', entityId: quoteId, after: { paymentId, amountCents: payment.amountCents } }, t);
  return { result: 'applied' };
}

function refundState(amountCents: number, refundedCents: number): Payment['status'] {
  return refundedCents >= amountCents ? 'refunded' : 'partially-refunded';
}

/** charge.refunded: the provider's running refunded amount is the truth; never counted twice. */
export async function recordChargeRefunded(charge: Stripe.Charge): Promise<WebhookResult> {
  const intent = stripeId(charge.payment_intent);
  if (!intent) return { result: 'ignored' };
  db();
  const known = await Payment.findOne({ where: { providerPaymentId: intent }, attributes: ['id', 'quoteId'] });
  if (!known) return { result: 'ignored' };
  let settled = false;
  const outcome = await retryOnLockContention(() =>
    db().transaction(async (t): Promise<WebhookResult> => {
      const quote = await Quote.findByPk(known.quoteId, { transaction: t, lock: t.LOCK.UPDATE });
      const payment = await Payment.findByPk(known.id, { transaction: t, lock: t.LOCK.UPDATE });
      if (!payment || !quote) return { result: 'ignored' };
      const refunded = Math.min(payment.amountCents, Math.max(payment.refundedCents, charge.amount_refunded));
      if (refunded === payment.refundedCents) return { result: 'already' };
      payment.set({ refundedCents: refunded, status: refundState(payment.amountCents, refunded) });
      await payment.save({ transaction: t });
      await recordAudit({ actor: 'payments-webhook', action: 'payment.refunded', entityType: 'quote', entityId: payment.quoteId, after: { paymentId: payment.id, refundedCents: refunded } }, t);
      // A refund made at the provider, outside the app: the job is cancelled, as the app's own default.
      settled = payment.status === 'refunded' && (await settleFullRefund(quote, 'cancel', { actor: 'payments-webhook' }, t));
      return { result: 'applied' };
    }),
  );
  if (settled) await sendRefundNotice(known.quoteId);
  return outcome;
}
