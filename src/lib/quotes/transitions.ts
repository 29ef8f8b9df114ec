import type { Transaction } from 'sequelize';
import { recordAudit } from '@/lib/audit';
import type { SessionUser } from '@/lib/auth/guard';
import { retryOnLockContention } from '@/lib/db/lock-contention';
import { db, type Quote } from '@/lib/db/models';
import { lockPayments } from '@/lib/db/queries/quote-payments';
import { insertRevision, LifecycleRefused, lifecycleState, moveQuote } from '@/lib/db/queries/quote-lifecycle';
import { writeReplaced } from '@/lib/db/queries/quote-writes';
import { getQuote, lockQuote } from '@/lib/db/queries/quotes';
import { presentQuote } from './present';
import { centsToText } from '@/lib/format';
import { HttpError } from '@/lib/http/errors';
import { balanceDueCents } from './balance';
import { isPastValidUntil } from './deposit-rules';
import { canRevise, refusalMessage, stateWord, type QuoteStatus } from './lifecycle';
import { noQuoteWithId } from './refusals';
import type { QuoteRecord } from './types';

// Staff moving a quote through its lifecycle (src/lib/quotes/lifecycle.ts) and revising a sent one.
// A refused move answers 409 with where the quote stands (state) and the quote as it is now (current).

/** The 409 for a move the quote cannot make from where it stands. */
async function refusal(quote: Quote, message: string, user: SessionUser, t: Transaction): Promise<HttpError> {
  const current = await getQuote(quote.id, t);
  return new HttpError(409, message, {
    state: lifecycleState(quote),
    current: current ? presentQuote(current, user) : null,
  });
}

/** Locks the quote, checks the caller saw its latest version, runs fn; returns the quote fn names, as it is after the commit. */
async function withLockedQuote(
  id: number,
  version: number,
  user: SessionUser,
  fn: (quote: Quote, t: Transaction) => Promise<number>,
): Promise<QuoteRecord> {
  const resultId = await retryOnLockContention(() =>
    db().transaction(async (t) => {
      const quote = await lockQuote(id, t);
      if (!quote) throw noQuoteWithId(id);
      if (quote.version !== version)
        throw await refusal(
          quote,
          `Quote ${quote.number} changed after you opened it (it is now ${stateWord(quote.status).toLowerCase()}). Nothing was changed; look again and retry.`,
          user,
          t,
        );
      try {
        return await fn(quote, t);
      } catch (error) {
        if (error instanceof LifecycleRefused) throw await refusal(quote, error.message, user, t);
        throw error;
      }
    }),
  );
  return (await getQuote(resultId))!;
}

/** Staff moving a quote: accepted, declined, expired, cancelled, closed. Only the moves lifecycle.ts allows. */
export function transitionQuote(
  id: number,
  input: { to: QuoteStatus; version: number; reason?: string },
  user: SessionUser,
): Promise<QuoteRecord> {
  return withLockedQuote(id, input.version, user, async (quote, t) => {
    if (input.to === 'accepted' && isPastValidUntil(quote.validUntil ?? null)) {
      throw await refusal(
        quote,
        `Quote ${quote.number} was valid until ${quote.validUntil}; it can no longer be accepted. Revise it for a fresh price and date.`,
        user,
        t,
      );
    }
    if (input.to === 'closed') {
      // A job closes when it is paid for: by hand only when nothing is left to pay.
      const due = balanceDueCents(quote.totalCents, await lockPayments(quote.id, t));
      if (due > 0) {
        throw await refusal(
          quote,
          `Quote ${quote.number} still has a balance of ${centsToText(due)} dollars to pay. Record the payment taken at the counter or e-mail the customer the pay-the-balance link; the job closes when it is paid in full.`,
          user,
          t,
        );
      }
    }
    await moveQuote(quote, input.to, 'staff', { user }, t, input.reason ? { reason: input.reason } : undefined);
    return quote.id;
  });
}

/**
 * A new revision of an unpaid quote: a draft with the same lines, numbered -R<n>, pointing back at the
 * one it replaces. The old one becomes "replaced"; its customer link keeps working and says so.
 */
export function reviseQuote(id: number, input: { version: number }, user: SessionUser): Promise<QuoteRecord> {
  return withLockedQuote(id, input.version, user, async (old, t) => {
    if (!canRevise(old.status)) throw await refusal(old, refusalMessage(old.status, 'replaced', 'revise'), user, t);
    const fresh = await insertRevision(old, user.id, t);
    await writeReplaced(old, fresh, { user }, t);
    await recordAudit(
      {
        user,
        action: 'quote.revised',
        entityType: 'quote',
        entityId: fresh.id,
        before: { quoteId: old.id, number: old.number },
        after: { number: fresh.number },
      },
      t,
    );
    return fresh.id;
  });
}
