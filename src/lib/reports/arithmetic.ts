import { divideRoundHalfUp } from '@/lib/quotes/pricing';

// The manager's report arithmetic, pure (no database, React or Next). Amounts are integer cents;
// rates are basis points (10 000 bp = 100 %), rounded half up once, on integers.

/** converted / of as basis points; null when there is nothing to divide by (no quote was sent). */
export function rateBp(converted: number, of: number): number | null {
  if (of <= 0) return null;
  return divideRoundHalfUp(converted * 10_000, of);
}

/** Average of a total over a count, in whole cents, rounded half up; null for no quotes. */
export function averageCents(totalCents: number, count: number): number | null {
  if (count <= 0) return null;
  if (totalCents < 0) return -divideRoundHalfUp(-totalCents, count);
  return divideRoundHalfUp(totalCents, count);
}

export type MarginLine = { totalCents: number; quantityHundredths: number; unitCostCents: number };
export type Margin = { revenueCents: number; costCents: number; marginCents: number; marginBp: number | null };

/**
 * Margin on goods: price − cost over sold lines. A line's cost is quantity × unit cost, rounded half up
 * once (the same rule as a line's price, src/lib/quotes/pricing.ts); the margin rate is margin / revenue.
 */
export function goodsMargin(lines: readonly MarginLine[]): Margin {
  let revenueCents = 0;
  let costCents = 0;
  for (const l of lines) {
    revenueCents += l.totalCents;
    costCents += divideRoundHalfUp(l.quantityHundredths * l.unitCostCents, 100);
  }
  return marginOfSums(revenueCents, costCents);
}

/** The margin of summed revenue and cost (the database sums them for the report; see reports.ts). */
export function marginOfSums(revenueCents: number, costCents: number): Margin {
  const marginCents = revenueCents - costCents;
  const marginBp =
    revenueCents > 0 ? Math.sign(marginCents) * divideRoundHalfUp(Math.abs(marginCents) * 10_000, revenueCents) : null;
  return { revenueCents, costCents, marginCents, marginBp };
}

/** Deposits taken less what was refunded of them. */
export function netDepositsCents(takenCents: number, refundedCents: number): number {
  return takenCents - refundedCents;
}
