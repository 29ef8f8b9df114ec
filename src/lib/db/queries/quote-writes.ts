import 'server-only';
import type { Transaction } from 'sequelize';
import type { QuoteSnapshot } from '@/lib/quotes/types';
import type { Quote } from '../models';
import { moveQuote, type AuditActor } from './quote-lifecycle';
import { readJson } from './quote-snapshot';
import type { DiscountFields } from './quotes';

// The writes the quote flows (src/lib/quotes/) make on a quote row they have locked, one named function
// each, called inside the flow's transaction. The flows decide; these only write. The model's `version`
// moves with every save, which is what a caller's stale version is checked against.

type DraftTotals = { subtotalCents: number; taxCents: number; totalCents: number; depositCents: number };
/** What new lines change on the row: the totals and where the discount stands. */
export type LinesTerms = { totals: DraftTotals; discount: DiscountFields };

/**
 * A draft's new terms: the totals and discount approval of lines just written, and/or a new valid-until
 * day. New lines always move the version; a valid-until day equal to the stored one changes nothing.
 * Returns false when nothing was written.
 */
export async function writeQuoteTerms(
  quote: Quote,
  change: { lines?: LinesTerms; validUntil?: string | null },
  t: Transaction,
): Promise<boolean> {
  if (change.lines) {
    const { subtotalCents, taxCents, totalCents, depositCents } = change.lines.totals;
    quote.set({ subtotalCents, taxCents, totalCents, depositCents, ...change.lines.discount });
  }
  if (change.validUntil !== undefined) quote.set({ validUntil: change.validUntil });
  if (!change.lines && !quote.changed()) return false;
  if (change.lines) quote.changed('updatedAt', true);
  await quote.save({ transaction: t });
  return true;
}

/** A manager's approval of the discount waiting on the quote. */
export async function writeDiscountApproval(quote: Quote, managerId: number, at: Date, t: Transaction): Promise<void> {
  quote.set({ discountApproval: 'approved', discountApprovedByUserId: managerId, discountApprovedAt: at });
  await quote.save({ transaction: t });
}

/** Moves the version with nothing else changed (a counter payment: the same form sent twice records once). */
export async function touchQuote(quote: Quote, t: Transaction): Promise<void> {
  quote.changed('updatedAt', true);
  await quote.save({ transaction: t });
}

/** When staff last e-mailed the pay-the-balance link. */
export async function writeBalanceRequested(quote: Quote, at: Date, t: Transaction): Promise<void> {
  quote.set({ balanceRequestedAt: at });
  await quote.save({ transaction: t });
}

/** True once a quote's build profile and advice are frozen (its first send). */
const isFrozen = (quote: Quote) => readJson(quote.snapshotProfile) !== null;

/**
 * Sending's write: the new link's hash, when it was sent, the valid-until day and — on the first send only —
 * the frozen build profile and advice, saved with the move to 'sent' (moveQuote throws LifecycleRefused
 * for a quote that cannot be sent, and then nothing is written).
 */
export async function writeSent(
  quote: Quote,
  send: { tokenHash: string; sentAt: Date; validUntil: string; snapshot: QuoteSnapshot | null },
  who: AuditActor,
  t: Transaction,
  note?: Record<string, unknown>,
): Promise<void> {
  quote.set({ publicTokenHash: send.tokenHash, sentAt: send.sentAt, validUntil: send.validUntil });
  if (send.snapshot && !isFrozen(quote))
    quote.set({
      snapshotProfile: send.snapshot.profile as Record<string, unknown>,
      snapshotAdvice: send.snapshot.advice,
    });
  await moveQuote(quote, 'sent', 'send', who, t, note);
}

/** The old quote of a revision: points at the new one and moves to 'replaced'. */
export async function writeReplaced(
  old: Quote,
  fresh: { id: number; number: string },
  who: AuditActor,
  t: Transaction,
): Promise<void> {
  old.set({ replacedByQuoteId: fresh.id });
  await moveQuote(old, 'replaced', 'revise', who, t, { by: fresh.number });
}
