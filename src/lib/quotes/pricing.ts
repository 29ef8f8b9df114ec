// Quote arithmetic, pure (no database, React or Next). Every amount is an integer number of cents;
// rates are basis points (1 bp = 0.01 %, so 825 bp = 8.25 %).
//
// Rounding, in one place: every product that can leave whole cents (quantity × unit price, a
// percentage of an amount) is rounded once, half away from zero ("half up" for the positive amounts
// quotes hold), on exact integers, never on floats:
//   - a line:    quantity is held in hundredths (DECIMAL(8,2)); total = round(hundredths × unit / 100),
//                less the line's discount (whole cents, never more than the line)
//   - tax:       on the sum of the taxable lines, not line by line: round(taxable × bp / 10 000)
//   - deposit:   round(total × percent bp / 10 000), then clamped to the shop's minimum and maximum,
//                and never more than the quote's total.
//
// What is taxable (isTaxable below, the only place that decides): goods — the cam, parts and any
// "other" line staff add — are taxed at the shop's rate; labour and the tune (a calibration service)
// are not. Shops in places that tax labour change that one function.

export const QUOTE_LINE_KIND_LIST = ['cam', 'part', 'labor', 'tune', 'other'] as const;
export type QuoteLineKind = (typeof QUOTE_LINE_KIND_LIST)[number];

export type PricedLineInput = { kind: QuoteLineKind; quantity: number; unitPriceCents: number; discountCents?: number };
export type DepositPolicy = { percentBp: number; minCents: number; maxCents: number };
export type QuoteTotals = {
  subtotalCents: number;
  taxableCents: number;
  taxRateBp: number;
  taxCents: number;
  totalCents: number;
  depositCents: number;
};

/** The one rule for which lines carry sales tax (see the note at the top of this file). */
export function isTaxable(kind: QuoteLineKind): boolean {
  return kind === 'cam' || kind === 'part' || kind === 'other';
}

/** a / b for non-negative integers a and positive b, rounded half up, exactly. */
export function divideRoundHalfUp(numerator: number, denominator: number): number {
  if (!Number.isSafeInteger(numerator) || !Number.isSafeInteger(denominator) || denominator <= 0 || numerator < 0) {
    throw new RangeError(
      `divideRoundHalfUp needs a non-negative safe integer over a positive one (got ${numerator} / ${denominator})`,
    );
  }
  const quotient = Math.floor(numerator / denominator);
  const remainder = numerator - quotient * denominator;
  return remainder * 2 >= denominator ? quotient + 1 : quotient;
}

/** Quantity (hours or units, at most two decimals) as a whole number of hundredths: 1.5 → 150. */
export function quantityHundredths(quantity: number): number {
  const hundredths = Math.round(quantity * 100);
  if (!Number.isFinite(quantity) || quantity < 0 || Math.abs(hundredths - quantity * 100) > 1e-6) {
    throw new RangeError(`quantity must be zero or more with at most two decimals (got ${quantity})`);
  }
  return hundredths;
}

/** quantity × unit price, rounded half up to the cent: 1.5 h × $135.00 = $202.50; 0.33 × 1001 ¢ = 330.33 → 330 ¢. */
export function lineTotalCents(quantity: number, unitPriceCents: number): number {
  if (!Number.isSafeInteger(unitPriceCents) || unitPriceCents < 0)
    throw new RangeError(`unit price must be whole cents, zero or more (got ${unitPriceCents})`);
  return divideRoundHalfUp(quantityHundredths(quantity) * unitPriceCents, 100);
}

/** A line after its discount: a discount on a taxed line lowers the taxed amount with it. */
export function lineNetCents(line: PricedLineInput): number {
  const gross = lineTotalCents(line.quantity, line.unitPriceCents);
  const discount = line.discountCents ?? 0;
  if (!Number.isSafeInteger(discount) || discount < 0 || discount > gross)
    throw new RangeError(`a discount must be whole cents between 0 and the line's ${gross} (got ${discount})`);
  return gross - discount;
}

/** Tax on an amount at a rate in basis points, rounded half up: 8.25 % of $100.01 = 825.0825 → 825 ¢. */
export function taxCents(taxableCents: number, rateBp: number): number {
  return divideRoundHalfUp(taxableCents * rateBp, 10_000);
}

/** The shop's deposit: a percentage of the total, clamped to [min, max], never more than the total. */
export function depositCents(totalCents: number, policy: DepositPolicy): number {
  if (totalCents <= 0) return 0;
  const share = divideRoundHalfUp(totalCents * policy.percentBp, 10_000);
  const clamped = Math.min(Math.max(share, policy.minCents), Math.max(policy.minCents, policy.maxCents));
  return Math.min(clamped, totalCents);
}

/** Subtotal, tax, total and deposit for a set of lines. */
export function quoteTotals(lines: readonly PricedLineInput[], taxRateBp: number, policy: DepositPolicy): QuoteTotals {
  let subtotal = 0;
  let taxable = 0;
  for (const line of lines) {
    const total = lineNetCents(line);
    subtotal += total;
    if (isTaxable(line.kind)) taxable += total;
  }
  const tax = taxCents(taxable, taxRateBp);
  const total = subtotal + tax;
  return {
    subtotalCents: subtotal,
    taxableCents: taxable,
    taxRateBp,
    taxCents: tax,
    totalCents: total,
    depositCents: depositCents(total, policy),
  };
}

/** Hours of labour at the shop's hourly rate, as one line's unit price and quantity. */
export function laborLine(
  hours: number,
  quantity: number,
  laborRateCents: number,
): { quantity: number; unitPriceCents: number } {
  // hours × quantity can carry more than two decimals (1.25 h × 1.5); keep the product in hundredths.
  return { quantity: Math.round(hours * quantity * 100) / 100, unitPriceCents: laborRateCents };
}

/** Quote numbers: Q-YYYY-NNNN, counting up within a year. */
export function formatQuoteNumber(year: number, sequence: number): string {
  return `Q-${year}-${String(sequence).padStart(4, '0')}`;
}

export function nextQuoteSequence(lastNumber: string | null, year: number): number {
  const match = lastNumber ? /^Q-(\d{4})-(\d{4,})$/.exec(lastNumber) : null;
  if (!match || Number(match[1]) !== year) return 1;
  return Number(match[2]) + 1;
}
