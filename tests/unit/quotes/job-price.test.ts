import { jobItemLine, jobLines, jobPriceCents, type JobItem } from '@/lib/quotes/job-price';
import { quoteTotals } from '@/lib/quotes/pricing';

// The one job price, worked by hand at a $135.00/h labour rate (the demo shop's).
const RATE = 13_500;
const cam = { id: 7, description: 'RB-198 Invented tow grind', priceCents: 36_900 };
const items: JobItem[] = [
  { type: 'labor', quantity: 1, laborOperation: { id: 1, name: 'Cam swap, truck', hours: 8 } },
  {
    type: 'part',
    quantity: 1,
    part: { id: 19, sku: 'GS-TC', name: 'Timing cover gasket set', priceCents: 3_900, category: 'gaskets' },
  },
  {
    type: 'part',
    quantity: 1,
    part: { id: 2, sku: 'SPR-600', name: 'Spring kit', priceCents: 34_900, category: 'springs' },
  },
  { type: 'labor', quantity: 1, laborOperation: { id: 4, name: 'Spring install', hours: 2 } },
  {
    type: 'part',
    quantity: 1,
    part: { id: 27, sku: 'TUNE-DYNO', name: 'Dyno tune', priceCents: 49_500, category: 'tune' },
  },
  { type: 'labor', quantity: 1, laborOperation: { id: 7, name: 'Dyno tune session', hours: 3 } },
];

describe('jobPriceCents (cam + needed parts + labour + tune, before tax)', () => {
  it('prices the demo pickup’s job by hand: $369 + $1,080 + $39 + $349 + $270 + $495 + $405 = $3,007.00', () => {
    expect(jobPriceCents(jobLines(cam, items, RATE))).toBe(300_700);
  });

  it('lines: the cam first, labour at the shop rate in hours, a tune-category part as an untaxed tune line', () => {
    const lines = jobLines(cam, items, RATE);
    expect(lines.map((l) => [l.kind, l.quantity, l.unitPriceCents])).toEqual([
      ['cam', 1, 36_900],
      ['labor', 8, RATE],
      ['part', 1, 3_900],
      ['part', 1, 34_900],
      ['labor', 2, RATE],
      ['tune', 1, 49_500],
      ['labor', 3, RATE],
    ]);
    expect(lines[0]).toMatchObject({ camId: 7, description: cam.description });
    expect(lines[5]).toMatchObject({ partId: 27, description: 'TUNE-DYNO Dyno tune' });
  });

  it('equals the pre-tax subtotal a quote of the same lines carries, to the cent', () => {
    const lines = jobLines(cam, items, RATE);
    const totals = quoteTotals(lines, 825, { percentBp: 2000, minCents: 20_000, maxCents: 100_000 });
    expect(totals.subtotalCents).toBe(jobPriceCents(lines));
    // Tax only on goods: the cam and the parts ($369 + $39 + $349 = $757 × 8.25 % = $62.4525 → $62.45).
    expect(totals.taxCents).toBe(6_245);
  });

  it('rounds each line to the cent as the quote does: 1.25 h × 1.5 at $135.00 is 1.88 h → $253.80', () => {
    const line = jobItemLine(
      { type: 'labor', quantity: 1.5, laborOperation: { id: 9, name: 'Odd job', hours: 1.25 } },
      RATE,
    )!;
    expect(line).toMatchObject({ quantity: 1.88, unitPriceCents: RATE });
    expect(jobPriceCents([line])).toBe(25_380);
    // A third of a $10.01 part: 0.33 × 1001 = 330.33 → 330 ¢.
    expect(
      jobPriceCents([
        jobItemLine({ type: 'part', quantity: 0.33, part: { id: 1, sku: 'X', name: 'x', priceCents: 1_001 } }, RATE)!,
      ]),
    ).toBe(330);
  });

  it('a cam alone is its own price; an item without its part or operation adds no line', () => {
    expect(jobPriceCents(jobLines(cam, [], RATE))).toBe(36_900);
    expect(
      jobLines(
        cam,
        [
          { type: 'part', quantity: 1, part: null },
          { type: 'labor', quantity: 1, laborOperation: null },
        ],
        RATE,
      ),
    ).toHaveLength(1);
  });
});
