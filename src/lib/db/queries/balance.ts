import { Op, type Transaction } from 'sequelize';
import type Stripe from 'stripe';
import type { SessionUser } from '@/lib/auth/guard';
import { recordAudit } from '@/lib/audit';
import { appBaseUrl } from '@/lib/env';
import type { FieldError } from '@/lib/http/responses';
import { sendMail } from '@/lib/mail';
import { payments } from '@/lib/payments';
import { retryOnLockContention } from '@/lib/db/lock-contention';
import { balanceDueCents, counts, type PaymentMethod } from '@/lib/quotes/balance';
import { isPastValidUntil } from '@/lib/quotes/deposit-rules';
import { stateWord } from '@/lib/quotes/lifecycle';
import { db, Payment, Quote, ShopSettings } from '../models';
import type { CheckoutOutcome, CheckoutState, WebhookResult } from './deposits';
import { settleOpenSessions } from './deposits';
import { balanceDueMail, sendPaymentReceipt } from './payment-notices';
import { addQuoteLink } from './quote-links';
import { moveQuote } from './quote-lifecycle';
import { getQuote, getQuoteByToken, newQuoteToken, sha256, type QuoteRecord } from './quotes';

// The balance: what is left once the deposit is paid, taken exactly once. Staff e-mail a pay-the-balance
// link (a checkout through the payments SDK, with the deposit's rules: one open session handed out
// again, a second payment refunded at once) or record money taken at the counter. Every path locks the
// quote row first and its payments second, like the deposit, and a rollback over locks runs again.
// When nothing is left to pay, the quote closes (lifecycle via 'payment').

export type BalanceOutcome =
  | { ok: true; record: QuoteRecord }
  | { ok: false; status: 404 | 409 | 422 | 502 | 503; message: string; errors?: FieldError[]; current?: QuoteRecord | null };

class Stop extends Error {
  constructor(readonly outcome: Exclude<BalanceOutcome, { ok: true }>) {
    super(outcome.message);
  }
}

const stop = async (status: 404 | 409 | 422 | 502, message: string, quoteId?: number, errors?: FieldError[], t?: Transaction): Promise<never> => {
  throw new Stop({ ok: false, status, message, ...(errors ? { errors } : {}), ...(quoteId ? { current: await getQuote(quoteId, t) } : {}) });
};

/** Locks the quote (checking the caller's version) and its payments; a refusal is a value. */
async function withLockedBalance(id: number, version: number, fn: (quote: Quote, rows: Payment[], t: Transaction) => Promise<number | null>): Promise<{ outcome: BalanceOutcome; paymentId: number | null }> {
  db();
  try {
    let paymentId: number | null = null;
    await retryOnLockContention(() =>
      db().transaction(async (t) => {
        const quote = await Quote.findByPk(id, { transaction: t, lock: t.LOCK.UPDATE });
        if (!quote) return stop(404, `No quote with id ${id}.`);
        if (quote.version !== version) await stop(409, `Quote ${quote.number} changed after you opened it. Nothing was recorded; look again and retry.`, id, undefined, t);
        if (quote.status !== 'deposit-paid') {
          await stop(409, `Quote ${quote.number} is ${stateWord(quote.status).toLowerCase()}: a balance is taken once the deposit is paid and until the job is paid in full.`, id, undefined, t);
        }
        const rows = await Payment.findAll({ where: { quoteId: id }, order: [['id', 'ASC']], transaction: t, lock: t.LOCK.UPDATE });
        paymentId = await fn(quote, rows, t);
      }),
    );
    return { outcome: { ok: true, record: (await getQuote(id))! }, paymentId };
  } catch (error) {
    if (error instanceof Stop) return { outcome: error.outcome, paymentId: null };
    throw error;
  }
}

/** Open balance checkouts are expired through the SDK; false when one is already paid or cannot be stopped. */
async function expireOpenBalanceSessions(rows: Payment[], t: Transaction): Promise<boolean> {
  for (const pending of rows.filter((p) => p.purpose === 'balance' && p.status === 'pending' && p.providerSessionId)) {
    try {
      const session = await payments().checkout.sessions.retrieve(pending.providerSessionId!);
      if (session.status === 'complete') return false;
      if (session.status === 'open') await payments().checkout.sessions.expire(session.id);
    } catch {
      return false;
    }
    pending.set({ status: 'expired' });
    await pending.save({ transaction: t });
  }
  return true;
}

/** Closes the quote when nothing is left to pay; called with the quote and its payments locked. */
async function closeWhenPaid(quote: Quote, who: { user?: SessionUser; actor?: string }, paymentId: number, t: Transaction): Promise<void> {
  const rows = await Payment.findAll({ where: { quoteId: quote.id }, transaction: t });
  if (balanceDueCents(quote.totalCents, rows) === 0) await moveQuote(quote, 'closed', 'payment', who, t, { paymentId });
}

export type CounterPaymentInput = { version: number; amountCents: number; method: Exclude<PaymentMethod, 'online'> };

/**
 * Money taken at the counter (cash or a card on the shop's terminal), recorded with who took it and when.
 * At most the balance due (422 on amountCents); the caller's version guards against a double submit.
 * An open online balance checkout is expired first, so the customer cannot pay the same money twice.
 */
export async function recordCounterPayment(id: number, input: CounterPaymentInput, user: SessionUser): Promise<BalanceOutcome> {
  const { outcome, paymentId } = await withLockedBalance(id, input.version, async (quote, rows, t) => {
    const due = balanceDueCents(quote.totalCents, rows);
    if (due === 0) await stop(409, `Quote ${quote.number} has nothing left to pay.`, id, undefined, t);
    if (input.amountCents > due) await stop(422, 'Some fields need attention.', undefined, [{ field: 'amountCents', message: `at most ${due} cents is left to pay on quote ${quote.number}` }]);
    if (!(await expireOpenBalanceSessions(rows, t))) {
      await stop(409, 'The customer is paying the balance online right now. Wait a minute and look again before taking money at the counter.', id, undefined, t);
    }
    const settings = await ShopSettings.findOne({ order: [['id', 'ASC']], transaction: t });
    const payment = await Payment.create(
      {
        quoteId: quote.id, provider: 'counter', providerSessionId: null, providerPaymentId: null, amountCents: input.amountCents, currency: settings?.currency ?? 'usd',
        status: 'paid', paidAt: new Date(), purpose: 'balance', method: input.method, recordedByUserId: user.id,
      },
      { transaction: t },
    );
    await recordAudit({ user, action: 'payment.counter-recorded', entityType: 'quote', entityId: quote.id, after: { paymentId: payment.id, amountCents: input.amountCents, method: input.method, dueBeforeCents: due } }, t);
    // The quote's version moves with every payment, so the same form submitted twice records once.
    quote.changed('updatedAt', true);
    await quote.save({ transaction: t });
    await closeWhenPaid(quote, { user }, payment.id, t);
    return payment.id;
  });
  if (outcome.ok && paymentId) await sendPaymentReceipt(id, paymentId);
  return outcome;
}

/**
 * E-mails the customer the balance due with a fresh private link to their quote page, where they pay it
 * online. The e-mail goes inside the transaction: a refused e-mail changes nothing (502).
 */
export async function requestBalance(id: number, input: { version: number }, user: SessionUser): Promise<BalanceOutcome> {
  try {
    const { outcome } = await withLockedBalance(id, input.version, async (quote, rows, t) => {
      const due = balanceDueCents(quote.totalCents, rows);
      if (due === 0) await stop(409, `Quote ${quote.number} has nothing left to pay.`, id, undefined, t);
      const record = (await getQuote(id, t))!;
      if (!record.customer.email) await stop(422, 'Some fields need attention.', undefined, [{ field: 'customer.email', message: 'the customer has no e-mail address; add one, or take the balance at the counter' }]);
      const token = newQuoteToken();
      await addQuoteLink(quote.id, sha256(token), 'balance', t);
      quote.set({ balanceRequestedAt: new Date() });
      await quote.save({ transaction: t });
      await recordAudit({ user, action: 'quote.balance-requested', entityType: 'quote', entityId: quote.id, after: { to: record.customer.email, balanceCents: due } }, t);
      const settings = await ShopSettings.findOne({ order: [['id', 'ASC']], transaction: t });
      await sendMail(await balanceDueMail({ ...record, balanceDueCents: due }, settings, `${appBaseUrl()}/q/${token}`));
      return null;
    });
    return outcome;
  } catch (error) {
    if (error instanceof Error && /Mail was not accepted|fetch failed|ECONNREFUSED/.test(error.message)) {
      return { ok: false, status: 502, message: 'The e-mail could not be sent, so nothing was changed. Try again in a moment.' };
    }
    throw error;
  }
}

// ---- The customer's "Pay the balance" ----

function balanceState(quote: Quote, rows: readonly Payment[], confirming = false): CheckoutState {
  return { status: quote.status, depositPaid: rows.some((p) => p.purpose === 'deposit' && counts(p)), validUntil: quote.validUntil ?? null, expired: isPastValidUntil(quote.validUntil ?? null), paymentConfirming: confirming };
}

const providerDown: CheckoutOutcome = { ok: false, status: 502, message: 'The payment service did not answer. Nothing was charged; please try again in a moment.' };

/** The checkout for the balance due; the deposit's exactly-once rules, for the balance. */
export async function startBalanceCheckout(token: string): Promise<CheckoutOutcome> {
  const found = await getQuoteByToken(token);
  if (!found) return { ok: false, status: 404, message: 'This link does not open a quote.' };
  const quoteId = found.quote.id;
  try {
    return await retryOnLockContention(() => db().transaction((t) => balanceCheckoutLocked(quoteId, token, found.shop.currency, found.quote.customer.email, t)));
  } catch (error) {
    console.error('[balance] checkout failed', error);
    return { ok: false, status: 503, message: 'We could not start the payment just now. Nothing was charged; please try again in a moment.' };
  }
}

async function balanceCheckoutLocked(quoteId: number, token: string, currency: string, email: string | null, t: Transaction): Promise<CheckoutOutcome> {
  const quote = await Quote.findByPk(quoteId, { transaction: t, lock: t.LOCK.UPDATE });
  if (!quote) return { ok: false, status: 404, message: 'This link does not open a quote.' };
  const rows = await Payment.findAll({ where: { quoteId }, order: [['id', 'ASC']], transaction: t, lock: t.LOCK.UPDATE });
  const refuse = (message: string, confirming = false): CheckoutOutcome => ({ ok: false, status: 409, message, state: balanceState(quote, rows, confirming) });
  const due = balanceDueCents(quote.totalCents, rows);
  if (quote.status === 'closed' || (quote.status === 'deposit-paid' && due === 0)) return refuse(`Quote ${quote.number} is paid in full; nothing more is due.`);
  if (quote.status !== 'deposit-paid') return refuse(`Quote ${quote.number} is ${stateWord(quote.status).toLowerCase()}; there is no balance to pay online. Please call the shop.`);
  if (!quote.balanceRequestedAt) return refuse(`The balance of quote ${quote.number} is paid when the job is done; we will e-mail you then.`);

  const open = await settleOpenSessions(rows.filter((p) => p.purpose === 'balance'), due, (message) => refuse(message, true), t);
  if (open) return open;

  const back = `${appBaseUrl()}/q/${token}`;
  const metadata = { quoteId: String(quote.id), quoteNumber: quote.number, purpose: 'balance' };
  let session: Stripe.Checkout.Session;
  try {
    session = await payments().checkout.sessions.create(
      {
        mode: 'payment',
        line_items: [{ quantity: 1, price_data: { currency, unit_amount: due, product_data: { name: `Balance for quote ${quote.number}` } } }],
        success_url: `${back}?paid=balance`,
        cancel_url: `${back}?cancelled=balance`,
        client_reference_id: String(quote.id),
        metadata,
        payment_intent_data: { metadata },
        ...(email ? { customer_email: email } : {}),
      },
      { idempotencyKey: `balance-${quote.number}-${rows.length + 1}-${sha256(token).slice(0, 16)}` },
    );
  } catch {
    return providerDown;
  }
  if (!session.url) return { ok: false, status: 502, message: 'The payment service gave no payment page. Nothing was charged; please try again.' };
  await Payment.create({ quoteId, providerSessionId: session.id, providerPaymentId: null, amountCents: due, currency, status: 'pending', paidAt: null, purpose: 'balance', method: 'online' }, { transaction: t });
  await recordAudit({ actor: 'customer-link', action: 'quote.balance-checkout-started', entityType: 'quote', entityId: quote.id, after: { session: session.id, amountCents: due } }, t);
  return { ok: true, url: session.url, reused: false };
}

/**
 * checkout.session.completed for a balance session (the webhook has checked the amount, currency and
 * quote against our own row, with both rows locked). Money for a quote that no longer owes it — paid at
 * the counter meanwhile, closed, or more than is left — goes back through the SDK at once, kept and
 * never counted; otherwise it is recorded and the quote closes when nothing is left.
 */
export async function completeBalanceLocked(quote: Quote, payment: Payment, intent: string, sessionId: string, t: Transaction): Promise<WebhookResult> {
  const others = await Payment.findAll({ where: { quoteId: quote.id, id: { [Op.ne]: payment.id } }, order: [['id', 'ASC']], transaction: t, lock: t.LOCK.UPDATE });
  const due = balanceDueCents(quote.totalCents, others);
  if (quote.status !== 'deposit-paid' || payment.amountCents > due) {
    const earlier = [...others].reverse().find((p) => p.purpose === 'balance' && counts(p));
    await payments().refunds.create(
      { payment_intent: intent, reason: earlier ? 'duplicate' : 'requested_by_customer', metadata: { quoteId: String(quote.id), paymentId: String(payment.id) } },
      { idempotencyKey: `balance-auto-refund-${sessionId}` },
    );
    payment.set({ status: 'refunded', refundedCents: payment.amountCents, paidAt: new Date(), providerPaymentId: intent, duplicateOfPaymentId: earlier?.id ?? null });
    await payment.save({ transaction: t });
    await recordAudit(
      { actor: 'payments-webhook', action: 'payment.balance-refunded', entityType: 'quote', entityId: quote.id, after: { paymentId: payment.id, session: sessionId, amountCents: payment.amountCents, dueCents: due, quoteStatus: quote.status, duplicateOfPaymentId: earlier?.id ?? null } },
      t,
    );
    return earlier ? { result: 'refunded-duplicate', duplicateOfPaymentId: earlier.id } : { result: 'refunded-closed-quote' };
  }
  payment.set({ status: 'paid', paidAt: new Date(), providerPaymentId: intent });
  await payment.save({ transaction: t });
  await recordAudit({ actor: 'payments-webhook', action: 'payment.received', entityType: 'quote', entityId: quote.id, after: { paymentId: payment.id, amountCents: payment.amountCents, purpose: 'balance' } }, t);
  await closeWhenPaid(quote, { actor: 'payments-webhook' }, payment.id, t);
  return { result: 'applied' };
}
