import {
  depositCents,
  divideRoundHalfUp,
  formatQuoteNumber,
  isTaxable,
  laborLine,
  lineTotalCents,
  nextQuoteSequence,
  quantityHundredths,
  quoteTotals,
  taxCents,
} from '@/lib/quotes/pricing';

// Hand-worked examples; each figure below was worked out on paper, not by running the code.
const demoPolicy = { percentBp: 2000, minCents: 20_000, maxCents: 100_000 }; // 20 %, $200 … $1,000 (the demo shop's)

describe('rounding', () => {
  it('rounds half up, exactly, on integers', () => {
    expect(divideRoundHalfUp(5, 10)).toBe(1); // 0.5 → 1
    expect(divideRoundHalfUp(4, 10)).toBe(0); // 0.4 → 0
    expect(divideRoundHalfUp(15, 10)).toBe(2); // 1.5 → 2
    expect(divideRoundHalfUp(25, 10)).toBe(3); // 2.5 → 3 (half up, not banker's)
    expect(divideRoundHalfUp(0, 7)).toBe(0);
  });

  it('refuses what is not whole, non-negative arithmetic', () => {
    expect(() => divideRoundHalfUp(1.5, 10)).toThrow(RangeError);
    expect(() => divideRoundHalfUp(-1, 10)).toThrow(RangeError);
    expect(() => divideRoundHalfUp(1, 0)).toThrow(RangeError);
  });

  it('holds quantities in hundredths and refuses a third decimal', () => {
    expect(quantityHundredths(1.5)).toBe(150);
    expect(quantityHundredths(0.29)).toBe(29); // 0.29 * 100 = 28.999999999999996 in floats
    expect(() => quantityHundredths(1.005)).toThrow(RangeError);
    expect(() => quantityHundredths(-1)).toThrow(RangeError);
  });
});

describe('a line', () => {
  it('is quantity × unit price in cents', () => {
    expect(lineTotalCents(1, 43_900)).toBe(43_900); // one cam at $439.00
    expect(lineTotalCents(8, 13_500)).toBe(108_000); // 8 h × $135.00 = $1,080.00
    expect(lineTotalCents(1.5, 13_500)).toBe(20_250); // 1.5 h × $135.00 = $202.50
  });

  it('rounds the product once, half up', () => {
    expect(lineTotalCents(0.33, 1001)).toBe(330); // 330.33 ¢ → 330
    expect(lineTotalCents(0.5, 1001)).toBe(501); // 500.5 ¢ → 501
    expect(lineTotalCents(0.29, 100)).toBe(29); // not 28.999…
  });

  it('labour hours × quantity stay in hundredths', () => {
    expect(laborLine(1.25, 2, 13_500)).toEqual({ quantity: 2.5, unitPriceCents: 13_500 });
    expect(laborLine(3, 1, 9_950)).toEqual({ quantity: 3, unitPriceCents: 9_950 });
  });
});

describe('tax', () => {
  it('is the rate in basis points of the taxable amount, half up', () => {
    expect(taxCents(10_000, 825)).toBe(825); // 8.25 % of $100.00 = $8.25
    expect(taxCents(10_001, 825)).toBe(825); // 825.0825 ¢ → 825
    expect(taxCents(10_007, 825)).toBe(826); // 825.5775 ¢ → 826
    expect(taxCents(200, 825)).toBe(17); // 16.5 ¢ → 17 (half up)
    expect(taxCents(12_345, 0)).toBe(0);
  });

  it('falls on goods, not on labour or the tune (the one rule)', () => {
    expect(isTaxable('cam')).toBe(true);
    expect(isTaxable('part')).toBe(true);
    expect(isTaxable('other')).toBe(true);
    expect(isTaxable('labor')).toBe(false);
    expect(isTaxable('tune')).toBe(false);
  });
});

describe('deposit', () => {
  it('is the percentage of the total inside the range', () => {
    expect(depositCents(250_000, demoPolicy)).toBe(50_000); // 20 % of $2,500 = $500
    expect(depositCents(123_457, demoPolicy)).toBe(24_691); // 24,691.4 ¢ → 24,691
    expect(depositCents(123_458, demoPolicy)).toBe(24_692); // 24,691.6 ¢ → 24,692
  });

  it('is clamped to the minimum and the maximum', () => {
    expect(depositCents(50_000, demoPolicy)).toBe(20_000); // 20 % of $500 = $100 → the $200 minimum
    expect(depositCents(900_000, demoPolicy)).toBe(100_000); // 20 % of $9,000 = $1,800 → the $1,000 maximum
  });

  it('is never more than the total, and nothing for an empty quote', () => {
    expect(depositCents(15_000, demoPolicy)).toBe(15_000); // minimum $200 > total $150 → the total
    expect(depositCents(0, demoPolicy)).toBe(0);
  });
});

describe('a whole quote, worked by hand', () => {
  it('prices the demo towing truck with a mild cam', () => {
    // cam $369.00 (taxed) + gasket set $39.00 (taxed) + dyno tune $495.00 (not taxed)
    // + 8 h cam swap and 3 h tune session at $135.00 = $1,485.00 (not taxed)
    const lines = [
      { kind: 'cam' as const, quantity: 1, unitPriceCents: 36_900 },
      { kind: 'part' as const, quantity: 1, unitPriceCents: 3_900 },
      { kind: 'tune' as const, quantity: 1, unitPriceCents: 49_500 },
      { kind: 'labor' as const, quantity: 8, unitPriceCents: 13_500 },
      { kind: 'labor' as const, quantity: 3, unitPriceCents: 13_500 },
    ];
    // subtotal 36,900 + 3,900 + 49,500 + 108,000 + 40,500 = 238,800 ¢
    // taxable 40,800 ¢ × 8.25 % = 3,366 ¢ exactly; total 242,166 ¢; deposit 20 % = 48,433.2 → 48,433 ¢
    expect(quoteTotals(lines, 825, demoPolicy)).toEqual({
      subtotalCents: 238_800,
      taxableCents: 40_800,
      taxRateBp: 825,
      taxCents: 3_366,
      totalCents: 242_166,
      depositCents: 48_433,
    });
  });

  it('rounds tax once on the taxable sum, not per line', () => {
    // two goods lines of $0.06: tax per line would be round(0.495) + round(0.495) = 0 + 0 = 0 ¢;
    // on the sum: 12 ¢ × 8.25 % = 0.99 ¢ → 1 ¢
    const totals = quoteTotals(
      [
        { kind: 'part', quantity: 1, unitPriceCents: 6 },
        { kind: 'part', quantity: 1, unitPriceCents: 6 },
      ],
      825,
      demoPolicy,
    );
    expect(totals.taxCents).toBe(1);
    expect(totals.totalCents).toBe(13);
    expect(totals.depositCents).toBe(13); // the minimum is above the total
  });
});

describe('quote numbers', () => {
  it('count up within a year and restart in a new one', () => {
    expect(formatQuoteNumber(2026, 7)).toBe('Q-2026-0007');
    expect(nextQuoteSequence('Q-2026-0103', 2026)).toBe(104);
    expect(nextQuoteSequence('Q-2025-0950', 2026)).toBe(1);
    expect(nextQuoteSequence(null, 2026)).toBe(1);
    expect(formatQuoteNumber(2026, nextQuoteSequence('Q-2026-9999', 2026))).toBe('Q-2026-10000');
  });
});
