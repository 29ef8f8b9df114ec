import 'server-only';
import type { Transaction } from 'sequelize';
import { recordAudit } from '@/lib/audit';
import { isPastValidUntil } from '@/lib/quotes/deposit-rules';
import {
  canTransition,
  refusalMessage,
  revisionNumber,
  staffMoves,
  stateWord,
  type QuoteStatus,
  type TransitionVia,
} from '@/lib/quotes/lifecycle';
import type { LifecycleState } from '@/lib/quotes/types';
import { Quote, QuoteLine } from '../models';

// Every change of a quote's state goes through moveQuote, with the row locked by the caller: the
// lifecycle's rules (src/lib/quotes/lifecycle.ts) decide, and each move leaves one audit row.
// Staff moves and revisions (with their refusals) are src/lib/quotes/transitions.ts.

export type AuditActor = { user?: { id: number; email: string }; actor?: string };

export class LifecycleRefused extends Error {
  constructor(
    readonly from: QuoteStatus,
    readonly to: QuoteStatus,
    message: string,
  ) {
    super(message);
  }
}

/** Moves a locked quote to `to` by `via`, or throws LifecycleRefused; stamps the dates that go with it. */
export async function moveQuote(
  quote: Quote,
  to: QuoteStatus,
  via: TransitionVia,
  who: AuditActor,
  t: Transaction,
  note?: Record<string, unknown>,
): Promise<void> {
  const from = quote.status;
  if (!canTransition(from, to, via)) throw new LifecycleRefused(from, to, refusalMessage(from, to, via));
  const now = new Date();
  quote.set({ status: to });
  if (to === 'accepted' || to === 'deposit-paid') quote.set({ acceptedAt: quote.acceptedAt ?? now });
  if (to === 'closed') quote.set({ closedAt: now });
  else if (from === 'closed') quote.set({ closedAt: null });
  if (from === to) quote.changed('updatedAt', true);
  await quote.save({ transaction: t });
  await recordAudit(
    {
      ...who,
      action: 'quote.transition',
      entityType: 'quote',
      entityId: quote.id,
      before: { status: from },
      after: { status: to, via, ...(note ?? {}) },
    },
    t,
  );
}

/** Where a quote stands and what staff may do from there (answered with a refused move). */
export function lifecycleState(quote: Pick<Quote, 'status' | 'validUntil' | 'replacedByQuoteId'>): LifecycleState {
  const validUntil = quote.validUntil ?? null;
  return {
    status: quote.status,
    word: stateWord(quote.status),
    allowed: staffMoves(quote.status),
    validUntil,
    expired: isPastValidUntil(validUntil),
    replacedBy: quote.replacedByQuoteId ?? null,
  };
}

/** A draft copy of a locked quote, numbered -R<n>, with the same lines, pointing back at it; returns the new row. */
export async function insertRevision(old: Quote, createdByUserId: number, t: Transaction): Promise<Quote> {
  const revision = old.revision + 1;
  const fresh = await Quote.create(
    {
      number: revisionNumber(old.number, revision),
      customerId: old.customerId,
      buildId: old.buildId,
      camId: old.camId,
      createdByUserId,
      status: 'draft',
      publicTokenHash: null,
      subtotalCents: old.subtotalCents,
      taxRateBp: old.taxRateBp,
      taxCents: old.taxCents,
      totalCents: old.totalCents,
      depositCents: old.depositCents,
      validUntil: null,
      sentAt: null,
      acceptedAt: null,
      revision,
      revisionOfQuoteId: old.id,
      // The same lines with the same discount: a manager's approval of it carries over.
      discountApproval: old.discountApproval,
      discountApprovedByUserId: old.discountApprovedByUserId,
      discountApprovedAt: old.discountApprovedAt,
    },
    { transaction: t },
  );
  const lines = await QuoteLine.findAll({
    where: { quoteId: old.id },
    order: [
      ['sortOrder', 'ASC'],
      ['id', 'ASC'],
    ],
    transaction: t,
  });
  await QuoteLine.bulkCreate(
    lines.map((l) => ({
      quoteId: fresh.id,
      kind: l.kind,
      camId: l.camId,
      partId: l.partId,
      laborOperationId: l.laborOperationId,
      description: l.description,
      quantity: l.quantity,
      unitPriceCents: l.unitPriceCents,
      totalCents: l.totalCents,
      discountCents: l.discountCents,
      sortOrder: l.sortOrder,
    })),
    { transaction: t },
  );
  return fresh;
}
