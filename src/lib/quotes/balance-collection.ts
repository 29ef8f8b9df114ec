import type { Transaction } from 'sequelize';
import { recordAudit } from '@/lib/audit';
import type { SessionUser } from '@/lib/auth/guard';
import { hashToken, randomToken } from '@/lib/auth/tokens';
import { retryOnLockContention } from '@/lib/db/lock-contention';
import { db, type Payment, type Quote } from '@/lib/db/models';
import { insertCounterPayment, lockPayments, markExpired, paymentsOf } from '@/lib/db/queries/quote-payments';
import { moveQuote, type AuditActor } from '@/lib/db/queries/quote-lifecycle';
import { addQuoteLink } from '@/lib/db/queries/quote-links';
import { touchQuote, writeBalanceRequested } from '@/lib/db/queries/quote-writes';
import { getQuote, lockQuote, shopSettingsRow } from '@/lib/db/queries/quotes';
import { presentQuote } from './present';
import { appBaseUrl } from '@/lib/env';
import { HttpError } from '@/lib/http/errors';
import { MailError, sendMail } from '@/lib/mail';
import { payments } from '@/lib/payments';
import { balanceDueCents, type PaymentMethod } from './balance';
import { stateWord } from './lifecycle';
import { balanceDueMail, sendPaymentReceipt } from './payment-notices';
import { fieldsRefused, mailNotSent, noQuoteWithId } from './refusals';
import type { QuoteRecord } from './types';

// Collecting the balance: what is left once the deposit is paid, taken exactly once. Staff e-mail a
// pay-the-balance link (the customer pays through src/lib/quotes/checkout.ts) or record money taken at
// the counter. Every path locks the quote row first and its payments second, like the deposit, and a
// rollback over locks runs again. When nothing is left to pay, the quote closes (lifecycle via 'payment').

/** A 409 that carries the quote as it is now, so the page can show what changed. */
async function refusedWithQuote(
  quoteId: number,
  message: string,
  user: SessionUser,
  t: Transaction,
): Promise<HttpError> {
  const current = await getQuote(quoteId, t);
  return new HttpError(409, message, current ? { current: presentQuote(current, user) } : {});
}

/** Locks the quote (checking the caller's version and that a balance is being taken) and its payments. */
async function withLockedBalance<T>(
  id: number,
  version: number,
  user: SessionUser,
  fn: (quote: Quote, rows: Payment[], t: Transaction) => Promise<T>,
): Promise<T> {
  return retryOnLockContention(() =>
    db().transaction(async (t) => {
      const quote = await lockQuote(id, t);
      if (!quote) throw noQuoteWithId(id);
      if (quote.version !== version)
        throw await refusedWithQuote(
          id,
          `Quote ${quote.number} changed after you opened it. Nothing was recorded; look again and retry.`,
          user,
          t,
        );
      if (quote.status !== 'deposit-paid') {
        throw await refusedWithQuote(
          id,
          `Quote ${quote.number} is ${stateWord(quote.status).toLowerCase()}: a balance is taken once the deposit is paid and until the job is paid in full.`,
          user,
          t,
        );
      }
      const rows = await lockPayments(id, t);
      return fn(quote, rows, t);
    }),
  );
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
    await markExpired(pending, t);
  }
  return true;
}

/** Closes the quote when nothing is left to pay; called with the quote and its payments locked. */
export async function closeWhenPaid(quote: Quote, who: AuditActor, paymentId: number, t: Transaction): Promise<void> {
  const rows = await paymentsOf(quote.id, t);
  if (balanceDueCents(quote.totalCents, rows) === 0) await moveQuote(quote, 'closed', 'payment', who, t, { paymentId });
}

export type CounterPaymentInput = { version: number; amountCents: number; method: Exclude<PaymentMethod, 'online'> };

/**
 * Money taken at the counter (cash or a card on the shop's terminal), recorded with who took it and when.
 * At most the balance due (422 on amountCents); the caller's version guards against a double submit.
 * An open online balance checkout is expired first, so the customer cannot pay the same money twice.
 */
export async function recordCounterPayment(
  id: number,
  input: CounterPaymentInput,
  user: SessionUser,
): Promise<QuoteRecord> {
  const paymentId = await withLockedBalance(id, input.version, user, async (quote, rows, t) => {
    const due = balanceDueCents(quote.totalCents, rows);
    if (due === 0) throw await refusedWithQuote(id, `Quote ${quote.number} has nothing left to pay.`, user, t);
    if (input.amountCents > due)
      throw fieldsRefused([
        { field: 'amountCents', message: `at most ${due} cents is left to pay on quote ${quote.number}` },
      ]);
    if (!(await expireOpenBalanceSessions(rows, t))) {
      throw await refusedWithQuote(
        id,
        'The customer is paying the balance online right now. Wait a minute and look again before taking money at the counter.',
        user,
        t,
      );
    }
    const settings = await shopSettingsRow(t);
    const payment = await insertCounterPayment(
      {
        quoteId: quote.id,
        amountCents: input.amountCents,
        currency: settings?.currency ?? 'usd',
        method: input.method,
        userId: user.id,
      },
      t,
    );
    await recordAudit(
      {
        user,
        action: 'payment.counter-recorded',
        entityType: 'quote',
        entityId: quote.id,
        after: { paymentId: payment.id, amountCents: input.amountCents, method: input.method, dueBeforeCents: due },
      },
      t,
    );
    // The quote's version moves with every payment, so the same form submitted twice records once.
    await touchQuote(quote, t);
    await closeWhenPaid(quote, { user }, payment.id, t);
    return payment.id;
  });
  const record = (await getQuote(id))!;
  await sendPaymentReceipt(id, paymentId);
  return record;
}

/**
 * E-mails the customer the balance due with a fresh private link to their quote page, where they pay it
 * online. The e-mail goes inside the transaction: a refused e-mail changes nothing (502).
 */
export async function requestBalance(id: number, input: { version: number }, user: SessionUser): Promise<QuoteRecord> {
  try {
    await withLockedBalance(id, input.version, user, async (quote, rows, t) => {
      const due = balanceDueCents(quote.totalCents, rows);
      if (due === 0) throw await refusedWithQuote(id, `Quote ${quote.number} has nothing left to pay.`, user, t);
      const record = (await getQuote(id, t))!;
      if (!record.customer.email)
        throw fieldsRefused([
          {
            field: 'customer.email',
            message: 'the customer has no e-mail address; add one, or take the balance at the counter',
          },
        ]);
      const token = randomToken();
      await addQuoteLink(quote.id, hashToken(token), 'balance', t);
      await writeBalanceRequested(quote, new Date(), t);
      await recordAudit(
        {
          user,
          action: 'quote.balance-requested',
          entityType: 'quote',
          entityId: quote.id,
          after: { to: record.customer.email, balanceCents: due },
        },
        t,
      );
      const settings = await shopSettingsRow(t);
      await sendMail(await balanceDueMail({ ...record, balanceDueCents: due }, settings, `${appBaseUrl()}/q/${token}`));
    });
  } catch (error) {
    if (error instanceof MailError)
      throw mailNotSent('The e-mail could not be sent, so nothing was changed. Try again in a moment.');
    throw error;
  }
  return (await getQuote(id))!;
}
