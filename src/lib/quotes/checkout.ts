import type { Transaction } from 'sequelize';
import type Stripe from 'stripe';
import { recordAudit } from '@/lib/audit';
import { hashToken } from '@/lib/auth/tokens';
import { retryOnLockContention } from '@/lib/db/lock-contention';
import { db, type Payment, type Quote } from '@/lib/db/models';
import { HELD, insertPendingCheckout, lockPayments, markExpired } from '@/lib/db/queries/quote-payments';
import { lockQuote } from '@/lib/db/queries/quotes';
import { getPublicQuote } from './public-quote';
import { appBaseUrl } from '@/lib/env';
import { HttpError } from '@/lib/http/errors';
import { payments } from '@/lib/payments';
import { balanceDueCents, counts, type PaymentPurpose } from './balance';
import { isPastValidUntil } from './deposit-rules';
import { isOpen, stateWord } from './lifecycle';
import { linkOpensNothing, stateRefused } from './refusals';
import type { CheckoutStarted, CheckoutState } from './types';

// The customer's checkouts, the deposit and the balance, each taken exactly once. Every path that
// changes a quote's payments locks the quote row first and its payments second, so checkouts and webhook
// deliveries queue behind one another instead of deadlocking; a rollback over locks runs again.
// A refusal is returned from the locked step and thrown once its transaction has committed, so the
// sessions it settled on the way (expired through the SDK) stay settled.

type Locked = CheckoutStarted | HttpError;

// An open session this close to its own expiry is replaced rather than handed out again.
const REUSE_MARGIN_SECONDS = 10 * 60;

const providerDown = () =>
  new HttpError(502, 'The payment service did not answer. Nothing was charged; please try again in a moment.');
const noPaymentPage = () =>
  new HttpError(502, 'The payment service gave no payment page. Nothing was charged; please try again.');

/** The deposit payment that counts: paid (or partly refunded) and not a refunded duplicate. */
export const heldDeposit = (rows: readonly Payment[]) =>
  rows.find((p) => p.purpose !== 'balance' && p.duplicateOfPaymentId === null && HELD.includes(p.status));

function depositState(quote: Quote, rows: readonly Payment[], paymentConfirming = false): CheckoutState {
  const depositPaid = Boolean(heldDeposit(rows)) || quote.status === 'deposit-paid';
  return {
    status: quote.status,
    depositPaid,
    validUntil: quote.validUntil ?? null,
    expired: isPastValidUntil(quote.validUntil ?? null),
    paymentConfirming,
  };
}

function balanceState(quote: Quote, rows: readonly Payment[], paymentConfirming = false): CheckoutState {
  return {
    status: quote.status,
    depositPaid: rows.some((p) => p.purpose === 'deposit' && counts(p)),
    validUntil: quote.validUntil ?? null,
    expired: isPastValidUntil(quote.validUntil ?? null),
    paymentConfirming,
  };
}

/**
 * The open checkouts among `rows` (one purpose: the deposit or the balance): one for exactly `amountCents`
 * that is not about to lapse is handed out again; any other is expired through the SDK first. Returns the
 * answer to give (that session, "being confirmed", the provider down), or null to open a new session.
 */
async function settleOpenSessions(
  rows: readonly Payment[],
  amountCents: number,
  confirming: (message: string) => HttpError,
  t: Transaction,
): Promise<Locked | null> {
  for (const pending of rows.filter((p) => p.status === 'pending' && p.providerSessionId)) {
    let session: Stripe.Checkout.Session;
    try {
      session = await payments().checkout.sessions.retrieve(pending.providerSessionId!);
    } catch {
      return providerDown();
    }
    if (session.status === 'complete')
      return confirming(
        'Your payment has reached the payment service and is being confirmed. Refresh this page in a minute; you will not be charged twice.',
      );
    const fits =
      session.amount_total === amountCents &&
      (session.currency ?? '') === pending.currency &&
      session.expires_at - Date.now() / 1000 > REUSE_MARGIN_SECONDS;
    if (session.status === 'open' && fits && session.url) return { url: session.url, reused: true };
    if (session.status === 'open') {
      try {
        await payments().checkout.sessions.expire(session.id);
      } catch {
        // It may have been paid in the meantime; its webhook decides, and a second payment is refunded.
        return confirming('A payment for this quote is in progress. Refresh this page in a minute.');
      }
    }
    await markExpired(pending, t);
  }
  return null;
}

type NewSession = {
  quote: Quote;
  token: string;
  purpose: PaymentPurpose;
  amountCents: number;
  currency: string;
  email: string | null;
  attempt: number;
};

/** A new hosted checkout for `amountCents`, recorded as a pending payment of the quote. */
async function openSession(
  { quote, token, purpose, amountCents, currency, email, attempt }: NewSession,
  t: Transaction,
): Promise<Locked> {
  const back = `${appBaseUrl()}/q/${token}`;
  const balance = purpose === 'balance';
  const metadata = { quoteId: String(quote.id), quoteNumber: quote.number, ...(balance ? { purpose: 'balance' } : {}) };
  let session: Stripe.Checkout.Session;
  try {
    session = await payments().checkout.sessions.create(
      {
        mode: 'payment',
        line_items: [
          {
            quantity: 1,
            price_data: {
              currency,
              unit_amount: amountCents,
              product_data: { name: `${balance ? 'Balance' : 'Deposit'} for quote ${quote.number}` },
            },
          },
        ],
        success_url: `${back}?paid=${balance ? 'balance' : '1'}`,
        cancel_url: `${back}?cancelled=${balance ? 'balance' : '1'}`,
        client_reference_id: String(quote.id),
        metadata,
        payment_intent_data: { metadata },
        ...(email ? { customer_email: email } : {}),
      },
      // A retried transaction asks for the same session again instead of opening a second one.
      {
        idempotencyKey: `${balance ? 'balance' : 'checkout'}-${quote.number}-${attempt}-${hashToken(token).slice(0, 16)}`,
      },
    );
  } catch {
    return providerDown();
  }
  if (!session.url) return noPaymentPage();
  await insertPendingCheckout({ quoteId: quote.id, sessionId: session.id, amountCents, currency, purpose }, t);
  await recordAudit(
    {
      actor: 'customer-link',
      action: balance ? 'quote.balance-checkout-started' : 'quote.checkout-started',
      entityType: 'quote',
      entityId: quote.id,
      after: { session: session.id, amountCents },
    },
    t,
  );
  return { url: session.url, reused: false };
}

/** Runs a locked checkout step; anything unexpected is a 503 that charged nothing. */
async function checkoutFor(
  token: string,
  what: string,
  step: (quoteId: number, currency: string, email: string | null, t: Transaction) => Promise<Locked>,
): Promise<CheckoutStarted> {
  const found = await getPublicQuote(token);
  if (!found) throw linkOpensNothing();
  let result: Locked;
  try {
    result = await retryOnLockContention(() =>
      db().transaction((t) => step(found.quote.id, found.shop.currency, found.quote.customer.email, t)),
    );
  } catch (error) {
    console.error(`[${what}] checkout failed`, error);
    throw new HttpError(
      503,
      'We could not start the payment just now. Nothing was charged; please try again in a moment.',
    );
  }
  if (result instanceof HttpError) throw result;
  return result;
}

/**
 * The customer's "Accept and pay the deposit". An open session for the same deposit is handed out again;
 * one that no longer fits (other amount, about to lapse) is expired through the SDK first. A paid,
 * closed or expired quote answers 409 with its state. The quote stays as it is until the money arrives.
 */
export function startCheckout(token: string): Promise<CheckoutStarted> {
  return checkoutFor(token, 'deposits', async (quoteId, currency, email, t) => {
    const quote = await lockQuote(quoteId, t);
    if (!quote) return linkOpensNothing();
    const rows = await lockPayments(quoteId, t);
    const refuse = (message: string, confirming = false) =>
      stateRefused(message, { state: depositState(quote, rows, confirming) });
    if (depositState(quote, rows).depositPaid)
      return refuse(`The deposit for quote ${quote.number} has already been paid; nothing more is due online.`);
    if (quote.status === 'replaced')
      return refuse(
        `Quote ${quote.number} was replaced by a newer quote; please pay from the newer quote's link we e-mailed you.`,
      );
    if (!isOpen(quote.status))
      return refuse(
        `Quote ${quote.number} is ${stateWord(quote.status).toLowerCase()} and can no longer be paid online. Please call the shop.`,
      );
    if (isPastValidUntil(quote.validUntil ?? null)) {
      return refuse(
        `Quote ${quote.number} was valid until ${quote.validUntil} and can no longer be accepted or paid. Ask the shop for a fresh quote.`,
      );
    }
    if (quote.depositCents <= 0) return refuse('This quote has no deposit to pay.');
    const open = await settleOpenSessions(
      rows.filter((p) => p.purpose !== 'balance'),
      quote.depositCents,
      (message) => refuse(message, true),
      t,
    );
    if (open) return open;
    return openSession(
      { quote, token, purpose: 'deposit', amountCents: quote.depositCents, currency, email, attempt: rows.length + 1 },
      t,
    );
  });
}

/** The customer's "Pay the balance": the deposit's exactly-once rules for the balance due. */
export function startBalanceCheckout(token: string): Promise<CheckoutStarted> {
  return checkoutFor(token, 'balance', async (quoteId, currency, email, t) => {
    const quote = await lockQuote(quoteId, t);
    if (!quote) return linkOpensNothing();
    const rows = await lockPayments(quoteId, t);
    const refuse = (message: string, confirming = false) =>
      stateRefused(message, { state: balanceState(quote, rows, confirming) });
    const due = balanceDueCents(quote.totalCents, rows);
    if (quote.status === 'closed' || (quote.status === 'deposit-paid' && due === 0))
      return refuse(`Quote ${quote.number} is paid in full; nothing more is due.`);
    if (quote.status !== 'deposit-paid')
      return refuse(
        `Quote ${quote.number} is ${stateWord(quote.status).toLowerCase()}; there is no balance to pay online. Please call the shop.`,
      );
    if (!quote.balanceRequestedAt)
      return refuse(`The balance of quote ${quote.number} is paid when the job is done; we will e-mail you then.`);
    const open = await settleOpenSessions(
      rows.filter((p) => p.purpose === 'balance'),
      due,
      (message) => refuse(message, true),
      t,
    );
    if (open) return open;
    return openSession(
      { quote, token, purpose: 'balance', amountCents: due, currency, email, attempt: rows.length + 1 },
      t,
    );
  });
}
