import type { Transaction } from 'sequelize';
import type { SessionUser } from '@/lib/auth/guard';
import { recordAudit } from '@/lib/audit';
import { retryOnLockContention } from '@/lib/db/lock-contention';
import { isPastValidUntil } from '@/lib/quotes/deposit-rules';
import { canRevise, canTransition, refusalMessage, revisionNumber, staffMoves, stateWord, type QuoteStatus, type TransitionVia } from '@/lib/quotes/lifecycle';
import { balanceDueCents } from '@/lib/quotes/balance';
import { db, Payment, Quote, QuoteLine } from '../models';
import { getQuote, type QuoteRecord } from './quotes';

// Every change of a quote's state goes through moveQuote, with the row locked by the caller: the
// lifecycle's rules (src/lib/quotes/lifecycle.ts) decide, and each move leaves one audit row.

export type AuditActor = { user?: { id: number; email: string }; actor?: string };

export class LifecycleRefused extends Error {
  constructor(readonly from: QuoteStatus, readonly to: QuoteStatus, message: string) {
    super(message);
  }
}

/** Moves a locked quote to `to` by `via`, or throws LifecycleRefused; stamps the dates that go with it. */
export async function moveQuote(quote: Quote, to: QuoteStatus, via: TransitionVia, who: AuditActor, t: Transaction, note?: Record<string, unknown>): Promise<void> {
  const from = quote.status;
  if (!canTransition(from, to, via)) throw new LifecycleRefused(from, to, refusalMessage(from, to, via));
  const now = new Date();
  quote.set({ status: to });
  if (to === 'accepted' || to === 'deposit-paid') quote.set({ acceptedAt: quote.acceptedAt ?? now });
  if (to === 'closed') quote.set({ closedAt: now });
  if (from === to) quote.changed('updatedAt', true);
  await quote.save({ transaction: t });
  await recordAudit({ ...who, action: 'quote.transition', entityType: 'quote', entityId: quote.id, before: { status: from }, after: { status: to, via, ...(note ?? {}) } }, t);
}

/** What a refused move answers with: where the quote stands and what staff may do from there. */
export type LifecycleState = { status: QuoteStatus; word: string; allowed: QuoteStatus[]; validUntil: string | null; expired: boolean; replacedBy: number | null };

export function lifecycleState(quote: Pick<Quote, 'status' | 'validUntil' | 'replacedByQuoteId'>): LifecycleState {
  const validUntil = quote.validUntil ?? null;
  return { status: quote.status, word: stateWord(quote.status), allowed: staffMoves(quote.status), validUntil, expired: isPastValidUntil(validUntil), replacedBy: quote.replacedByQuoteId ?? null };
}

export type LifecycleOutcome =
  | { ok: true; record: QuoteRecord }
  | { ok: false; status: 404; message: string }
  | { ok: false; status: 409; message: string; state: LifecycleState; current: QuoteRecord | null };

class Refusal extends Error {
  constructor(readonly outcome: Exclude<LifecycleOutcome, { ok: true }>) {
    super(outcome.message);
  }
}

async function refuse(quote: Quote, message: string, t: Transaction): Promise<never> {
  throw new Refusal({ ok: false, status: 409, message, state: lifecycleState(quote), current: await getQuote(quote.id, t) });
}

/** Locks the quote, checks the caller saw its latest version, runs fn; every refusal is a value. */
async function withLockedQuote(id: number, version: number, fn: (quote: Quote, t: Transaction) => Promise<number>): Promise<LifecycleOutcome> {
  db();
  try {
    const resultId = await retryOnLockContention(() =>
      db().transaction(async (t) => {
        const quote = await Quote.findByPk(id, { transaction: t, lock: t.LOCK.UPDATE });
        if (!quote) throw new Refusal({ ok: false, status: 404, message: `No quote with id ${id}.` });
        if (quote.version !== version) await refuse(quote, `Quote ${quote.number} changed after you opened it (it is now ${stateWord(quote.status).toLowerCase()}). Nothing was changed; look again and retry.`, t);
        try {
          return await fn(quote, t);
        } catch (error) {
          if (error instanceof LifecycleRefused) return refuse(quote, error.message, t);
          throw error;
        }
      }),
    );
    return { ok: true, record: (await getQuote(resultId))! };
  } catch (error) {
    if (error instanceof Refusal) return error.outcome;
    throw error;
  }
}

/** Staff moving a quote: accepted, declined, expired, cancelled, closed. Only the moves lifecycle.ts allows. */
export function transitionQuote(id: number, input: { to: QuoteStatus; version: number; reason?: string }, user: SessionUser): Promise<LifecycleOutcome> {
  return withLockedQuote(id, input.version, async (quote, t) => {
    if (input.to === 'accepted' && isPastValidUntil(quote.validUntil ?? null)) {
      await refuse(quote, `Quote ${quote.number} was valid until ${quote.validUntil}; it can no longer be accepted. Revise it for a fresh price and date.`, t);
    }
    if (input.to === 'closed') {
      // A job closes when it is paid for: by hand only when nothing is left to pay.
      const rows = await Payment.findAll({ where: { quoteId: quote.id }, transaction: t, lock: t.LOCK.UPDATE });
      const due = balanceDueCents(quote.totalCents, rows);
      if (due > 0) {
        await refuse(quote, `Quote ${quote.number} still has a balance of ${(due / 100).toFixed(2)} dollars to pay. Record the payment taken at the counter or e-mail the customer the pay-the-balance link; the job closes when it is paid in full.`, t);
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
export function reviseQuote(id: number, input: { version: number }, user: SessionUser): Promise<LifecycleOutcome> {
  return withLockedQuote(id, input.version, async (old, t) => {
    if (!canRevise(old.status)) await refuse(old, refusalMessage(old.status, 'replaced', 'revise'), t);
    const revision = old.revision + 1;
    const fresh = await Quote.create(
      {
        number: revisionNumber(old.number, revision), customerId: old.customerId, buildId: old.buildId, camId: old.camId, createdByUserId: user.id,
        status: 'draft', publicTokenHash: null, subtotalCents: old.subtotalCents, taxRateBp: old.taxRateBp, taxCents: old.taxCents, totalCents: old.totalCents,
        depositCents: old.depositCents, validUntil: null, sentAt: null, acceptedAt: null, revision, revisionOfQuoteId: old.id,
      },
      { transaction: t },
    );
    const lines = await QuoteLine.findAll({ where: { quoteId: old.id }, order: [['sortOrder', 'ASC'], ['id', 'ASC']], transaction: t });
    await QuoteLine.bulkCreate(
      lines.map((l) => ({ quoteId: fresh.id, kind: l.kind, camId: l.camId, partId: l.partId, laborOperationId: l.laborOperationId, description: l.description, quantity: l.quantity, unitPriceCents: l.unitPriceCents, totalCents: l.totalCents, discountCents: l.discountCents, sortOrder: l.sortOrder })),
      { transaction: t },
    );
    old.set({ replacedByQuoteId: fresh.id });
    await moveQuote(old, 'replaced', 'revise', { user }, t, { by: fresh.number });
    await recordAudit({ user, action: 'quote.revised', entityType: 'quote', entityId: fresh.id, before: { quoteId: old.id, number: old.number }, after: { number: fresh.number } }, t);
    return fresh.id;
  });
}
