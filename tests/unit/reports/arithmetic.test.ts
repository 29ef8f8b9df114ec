import { averageCents, goodsMargin, netDepositsCents, rateBp } from '@/lib/reports/arithmetic';
import { reportRangeSchema } from '@/lib/schemas/report';

// Hand-worked figures for the manager's report arithmetic (cents and basis points, half up).
describe('conversion rate in basis points', () => {
  it('is converted ÷ sent × 10 000, rounded half up once', () => {
    expect(rateBp(1, 2)).toBe(5_000); // 50 %
    expect(rateBp(1, 8)).toBe(1_250); // 12.5 % exactly
    expect(rateBp(1, 3)).toBe(3_333); // 3 333.33… → 3 333
    expect(rateBp(2, 3)).toBe(6_667); // 6 666.67 → 6 667
    expect(rateBp(1, 16)).toBe(625); // 625 exactly
    expect(rateBp(1, 80_000)).toBe(0); // 0.125 bp → 0
    expect(rateBp(1, 20_000)).toBe(1); // 0.5 bp → 1 (half up)
  });
  it('is null, not a division by zero, when nothing was sent', () => {
    expect(rateBp(0, 0)).toBeNull();
  });
});

describe('average quote value', () => {
  it('rounds the cents half up', () => {
    expect(averageCents(100, 3)).toBe(33); // 33.33
    expect(averageCents(200, 3)).toBe(67); // 66.67
    expect(averageCents(5, 2)).toBe(3); // 2.5 → 3
    expect(averageCents(0, 0)).toBeNull();
  });
});

describe('margin on cams and parts', () => {
  it('is price − quantity × unit cost, each line rounded half up once', () => {
    const m = goodsMargin([
      { totalCents: 43_900, quantityHundredths: 100, unitCostCents: 27_218 }, // a $439.00 cam costing $272.18
      { totalCents: 9_000, quantityHundredths: 200, unitCostCents: 2_900 }, // 2 × $45.00 part costing $29.00 → 5 800
      { totalCents: 750, quantityHundredths: 50, unitCostCents: 1_001 }, // 0.5 × $10.01 → 500.5 → 501
    ]);
    // revenue 43 900 + 9 000 + 750 = 53 650; cost 27 218 + 5 800 + 501 = 33 519; margin 20 131
    // rate 20 131 / 53 650 = 0.375228… → 3 752 bp
    expect(m).toEqual({ revenueCents: 53_650, costCents: 33_519, marginCents: 20_131, marginBp: 3_752 });
  });
  it('can be negative when a line sold below cost', () => {
    expect(goodsMargin([{ totalCents: 1_000, quantityHundredths: 100, unitCostCents: 1_200 }])).toEqual({
      revenueCents: 1_000,
      costCents: 1_200,
      marginCents: -200,
      marginBp: -2_000,
    });
  });
  it('has no rate when nothing was sold', () => {
    expect(goodsMargin([])).toEqual({ revenueCents: 0, costCents: 0, marginCents: 0, marginBp: null });
  });
});

describe('net deposits', () => {
  it('is taken − refunded', () => {
    expect(netDepositsCents(45_000, 12_550)).toBe(32_450);
  });
});

describe('the report date range', () => {
  const schema = reportRangeSchema(() => '2026-12-02');
  const issues = (input: Record<string, string>) => {
    const r = schema.safeParse(input);
    return r.success ? [] : r.error.issues.map((i) => [i.path.join('.'), i.message]);
  };
  it('defaults to the last 30 days, today included', () => {
    expect(schema.parse({})).toEqual({ from: '2026-11-03', to: '2026-12-02', days: 30 });
    expect(schema.parse({ from: '2026-02-01' })).toEqual({ from: '2026-02-01', to: '2026-03-02', days: 30 });
    expect(schema.parse({ to: '2026-03-01' })).toEqual({ from: '2026-01-31', to: '2026-03-01', days: 30 });
  });
  it('takes one day and a whole year (366 days at most)', () => {
    expect(schema.parse({ from: '2026-05-05', to: '2026-05-05' }).days).toBe(1);
    expect(schema.parse({ from: '2025-12-02', to: '2026-12-02' }).days).toBe(366);
  });
  it('names the field and the reason for bad dates', () => {
    expect(issues({ from: '2026-02-30' })).toEqual([['from', expect.stringContaining('YYYY-MM-DD')]]);
    expect(issues({ from: '2026-12-01', to: 'yesterday' })).toEqual([['to', expect.stringContaining('YYYY-MM-DD')]]);
    expect(issues({ from: '2026-12-02', to: '2026-12-01' })).toEqual([
      ['from', expect.stringContaining('on or before')],
    ]);
    expect(issues({ from: '2025-12-01', to: '2026-12-02' })).toEqual([['to', expect.stringContaining('one year')]]);
  });
});
