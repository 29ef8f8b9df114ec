import { springsCoverLift } from '@/lib/advisor';
import { evaluateNeedRules, type NeedRuleInput } from '@/lib/catalogue/need-rules';
import { NO_SPRING_KIT_COVERS, pickSpringKit, ratedMaxLiftIn, type SpringKit } from '@/lib/catalogue/spring-kits';

// The springs need picks the catalogue's kit rated for the cam's lift, by the advisor's own rule
// (springsCoverLift); a rule names a kit, and without a kit that covers the lift the draft carries a named warning.
const kit = (id: number, sku: string, maxLiftIn: number, priceCents: number): SpringKit => ({
  id,
  sku,
  name: `Test kit ${maxLiftIn}"`,
  priceCents,
  category: 'springs',
  maxLiftIn,
});
const low = kit(1, 'KIT-LOW', 0.57, 28_900);
const mid = kit(2, 'KIT-MID', 0.6, 34_900);
const high = kit(3, 'KIT-HIGH', 0.66, 46_900);
const KITS = [high, low, mid];

const springLabour = { id: 4, code: 'SPR-LAB', name: 'Spring install', hours: 2 };
const springRule: NeedRuleInput = {
  id: 12,
  kind: 'springs',
  vehicleClass: null,
  label: 'springs',
  active: true,
  items: [{ partId: mid.id, laborOperationId: springLabour.id, quantity: 1, part: mid, laborOperation: springLabour }],
};
const needsFor = (liftIn: number) => [{ kind: 'springs' as const, reason: 'past the springs', minLiftIn: liftIn }];
const partsOf = (liftIn: number, kits: readonly SpringKit[] | undefined) =>
  evaluateNeedRules([springRule], { needs: needsFor(liftIn), vehicleClass: 'truck', springKits: kits }).filter(
    (n) => n.type === 'part',
  );

describe('pickSpringKit', () => {
  it('takes the lowest-rated kit that covers the lift, by the advisor’s rule', () => {
    expect(pickSpringKit(KITS, 0.525)?.sku).toBe('KIT-LOW');
    expect(pickSpringKit(KITS, 0.57)?.sku).toBe('KIT-LOW'); // rated to the lift is enough, as for installed springs
    expect(springsCoverLift(0.57, 0.57)).toBe(true);
    expect(pickSpringKit(KITS, 0.571)?.sku).toBe('KIT-MID');
    expect(pickSpringKit(KITS, 0.612)?.sku).toBe('KIT-HIGH');
    expect(pickSpringKit(KITS, 0.7)).toBeNull();
  });

  it('breaks a tie in rating on price, then id', () => {
    const cheaper = kit(9, 'KIT-LOW-B', 0.57, 25_000);
    expect(pickSpringKit([...KITS, cheaper], 0.55)?.sku).toBe('KIT-LOW-B');
    const same = kit(0, 'KIT-LOW-0', 0.57, 28_900);
    expect(pickSpringKit([low, same], 0.55)?.sku).toBe('KIT-LOW-0');
  });

  it('reads a rating only from a spring part that states a positive number', () => {
    expect(ratedMaxLiftIn({ category: 'springs', spec: { maxLiftIn: 0.6 } })).toBe(0.6);
    expect(ratedMaxLiftIn({ category: 'springs', spec: { maxLiftIn: '0.600' } })).toBeNull();
    expect(ratedMaxLiftIn({ category: 'springs', spec: null })).toBeNull();
    expect(ratedMaxLiftIn({ category: 'pushrods', spec: { maxLiftIn: 0.6 } })).toBeNull();
  });
});

describe('the springs need in the rules', () => {
  it('gives a low-lift cam and a high-lift cam different kits from the same rule', () => {
    const lowCam = partsOf(0.525, KITS);
    const highCam = partsOf(0.63, KITS);
    expect(lowCam.map((n) => [n.partId, n.part?.sku, n.part?.priceCents])).toEqual([[low.id, 'KIT-LOW', 28_900]]);
    expect(highCam.map((n) => [n.partId, n.part?.sku, n.part?.priceCents])).toEqual([[high.id, 'KIT-HIGH', 46_900]]);
    expect([...lowCam, ...highCam].every((n) => n.warning === undefined)).toBe(true);
  });

  it('keeps the rule’s kit and names a warning when no kit covers the lift', () => {
    const [part] = partsOf(0.72, KITS);
    expect(part.part?.sku).toBe('KIT-MID');
    expect(part.warning?.code).toBe(NO_SPRING_KIT_COVERS);
    expect(part.warning?.message).toContain('0.720"');
    expect(part.warning?.message).toContain('none rated past 0.660"');
    // The labour of the same rule is not the kit: it carries no warning.
    const labour = evaluateNeedRules([springRule], {
      needs: needsFor(0.72),
      vehicleClass: 'truck',
      springKits: KITS,
    }).find((n) => n.type === 'labor');
    expect(labour?.warning).toBeUndefined();
  });

  it('uses the rule as written without a kit list, and leaves parts that are not rated kits alone', () => {
    expect(partsOf(0.525, undefined).map((n) => n.part?.sku)).toEqual(['KIT-MID']);
    const seats = { id: 40, sku: 'SEATS', name: 'Spring seats', priceCents: 4_000, category: 'springs' };
    const withSeats: NeedRuleInput = {
      ...springRule,
      items: [...springRule.items, { partId: seats.id, laborOperationId: null, quantity: 1, part: seats }],
    };
    const parts = evaluateNeedRules([withSeats], { needs: needsFor(0.525), vehicleClass: 'truck', springKits: KITS })
      .filter((n) => n.type === 'part')
      .map((n) => n.part?.sku);
    expect(parts).toEqual(['KIT-LOW', 'SEATS']);
  });
});
