import { rankCams } from '@/lib/advisor';
import {
  evaluateNeedRules,
  rulesFor,
  unmappedKinds,
  type NeedContext,
  type NeedRuleInput,
} from '@/lib/catalogue/need-rules';
import { bigCam, cam, stockTruckCam, variant } from '../advisor/fixtures';

// The rules only price the needs the advisor names; they never decide whether a cam has one.
const springs = { id: 2, sku: 'SPR-TEST', name: 'Test spring kit', priceCents: 34900 };
const converter = { id: 25, sku: 'TC-TEST', name: 'Test converter', priceCents: 82900 };
const tune = { id: 27, sku: 'TUNE-TEST', name: 'Test tune', priceCents: 49500, category: 'tune' };
const springLabour = { id: 4, code: 'SPR-LAB', name: 'Spring install', hours: 2 };
const truckSwap = { id: 1, code: 'SWAP-T', name: 'Cam swap, truck', hours: 8 };
const carSwap = { id: 2, code: 'SWAP-C', name: 'Cam swap, car', hours: 9.5 };

function rule(overrides: Partial<NeedRuleInput> & Pick<NeedRuleInput, 'kind'>): NeedRuleInput {
  return { id: 1, vehicleClass: null, label: 'test rule', active: true, items: [], ...overrides };
}

const labour = (op: typeof truckSwap) => ({
  partId: null,
  laborOperationId: op.id,
  quantity: 1,
  part: null,
  laborOperation: op,
});
const installAny = rule({ id: 10, kind: 'install', label: 'any', items: [labour(truckSwap)] });
const installCar = rule({ id: 11, kind: 'install', vehicleClass: 'car', label: 'car', items: [labour(carSwap)] });
const springRule = rule({
  id: 12,
  kind: 'springs',
  items: [
    { partId: springs.id, laborOperationId: springLabour.id, quantity: 1, part: springs, laborOperation: springLabour },
  ],
});
const converterRule = rule({
  id: 13,
  kind: 'converter',
  items: [{ partId: converter.id, laborOperationId: null, quantity: 1, part: converter }],
});
const RULES = [installAny, installCar, springRule, converterRule];

const context = (
  kinds: NeedContext['needs'][number]['kind'][],
  vehicleClass: NeedContext['vehicleClass'] = 'truck',
): NeedContext => ({
  needs: kinds.map((kind) => ({ kind, reason: `because of ${kind}` })),
  vehicleClass,
});

describe('evaluateNeedRules', () => {
  it('adds what the rule for each named need says, with the advisor’s reason', () => {
    const needs = evaluateNeedRules(RULES, context(['install', 'springs']));
    expect(needs.map((n) => [n.type, n.partId, n.laborOperationId])).toEqual([
      ['labor', null, truckSwap.id],
      ['part', springs.id, null],
      ['labor', null, springLabour.id],
    ]);
    expect(needs[1].reason).toBe('because of springs');
    expect(needs[1].rule).toEqual({ id: 12, kind: 'springs', label: 'test rule', vehicleClass: null });
  });

  it('adds nothing for a kind the advisor did not name', () => {
    expect(evaluateNeedRules(RULES, context(['install'])).map((n) => n.rule.kind)).toEqual(['install']);
    expect(evaluateNeedRules(RULES, context([]))).toEqual([]);
  });

  it('a rule for one vehicle class replaces the every-vehicle rules of that kind for that class only', () => {
    const labourOf = (vc: NeedContext['vehicleClass']) =>
      evaluateNeedRules(RULES, context(['install'], vc)).map((n) => n.laborOperation?.code);
    expect(labourOf('car')).toEqual(['SWAP-C']);
    for (const vc of ['truck', 'suv', 'van'] as const) expect(labourOf(vc)).toEqual(['SWAP-T']);
    expect(rulesFor(RULES, 'install', 'car').map((r) => r.id)).toEqual([11]);
  });

  it('skips inactive rules and lists a part asked for twice once, with the larger quantity', () => {
    const first = rule({
      id: 1,
      kind: 'tune',
      items: [{ partId: tune.id, laborOperationId: null, quantity: 1, part: tune }],
    });
    const second = rule({
      id: 2,
      kind: 'install',
      label: 'second',
      items: [{ partId: tune.id, laborOperationId: null, quantity: 2, part: tune }],
    });
    const off = rule({
      id: 3,
      kind: 'tune',
      active: false,
      items: [{ partId: springs.id, laborOperationId: null, quantity: 1, part: springs }],
    });
    const needs = evaluateNeedRules([first, second, off], context(['install', 'tune']));
    expect(needs).toHaveLength(1);
    expect(needs[0]).toMatchObject({ partId: tune.id, quantity: 2, rule: { id: 1 } });
  });

  it('names the kinds a vehicle class has no rule for', () => {
    expect(unmappedKinds(RULES, 'van')).toEqual(['pushrods', 'lifters', 'deactivation-delete', 'tune']);
    expect(unmappedKinds([installCar], 'truck')).toContain('install');
    expect(unmappedKinds([installCar], 'car')).not.toContain('install');
  });
});

describe('one spring threshold: the advisor’s', () => {
  // Installed springs good to 0.500" (the factory-style card); no rule threshold anywhere.
  const truck = variant({ baselineCam: { ...stockTruckCam, springMaxLiftIn: 0.5 } });
  const cam525 = cam({ ...bigCam, id: 'lift-525', intakeLiftIn: 0.525, exhaustLiftIn: 0.525 });
  const cam495 = cam({ ...bigCam, id: 'lift-495', intakeLiftIn: 0.495, exhaustLiftIn: 0.495 });

  it('a 0.525" cam past 0.500" springs: the advisor says it needs springs and the rules add the kit and its labour', () => {
    const ranking = rankCams(truck, [cam525], { includeCurves: false }).rankings[0];
    expect(ranking.reasons.find((r) => r.subscore === 'fit')?.text).toMatch(
      /past your installed springs' 0\.500" limit — it needs springs/,
    );
    const items = evaluateNeedRules([installAny, springRule], { needs: ranking.needs, vehicleClass: 'truck' });
    expect(items.map((i) => i.part?.sku ?? i.laborOperation?.code)).toEqual(['SWAP-T', 'SPR-TEST', 'SPR-LAB']);
  });

  it('a 0.495" cam within the springs gets no spring kit, whatever the old 0.570" rule would have said', () => {
    const ranking = rankCams(truck, [cam495], { includeCurves: false }).rankings[0];
    expect(ranking.needs.map((n) => n.kind)).not.toContain('springs');
    expect(
      evaluateNeedRules([installAny, springRule], { needs: ranking.needs, vehicleClass: 'truck' }).map(
        (i) => i.rule.kind,
      ),
    ).toEqual(['install']);
  });

  it('every ranking names install and tune; pushrods from 0.580", lifters from 0.600" on a stock valvetrain (common practice, from memory)', () => {
    const kinds = (lift: number, valvetrain?: 'stock-hydraulic' | 'solid-roller') =>
      rankCams(
        variant({ engine: valvetrain ? { valvetrain } : {}, baselineCam: { ...stockTruckCam, springMaxLiftIn: 0.5 } }),
        [cam({ ...bigCam, intakeLiftIn: lift, exhaustLiftIn: lift })],
        { includeCurves: false },
      ).rankings[0].needs.map((n) => n.kind);
    expect(kinds(0.525)).toEqual(expect.arrayContaining(['install', 'springs', 'tune']));
    expect(kinds(0.575)).not.toContain('pushrods');
    expect(kinds(0.58)).toContain('pushrods');
    expect(kinds(0.595)).not.toContain('lifters');
    expect(kinds(0.6)).toContain('lifters');
    expect(kinds(0.6, 'solid-roller')).not.toContain('lifters');
  });

  it('a cam specified with other rockers than the engine has needs pushrods (geometry)', () => {
    const needs = rankCams(truck, [cam({ ...cam495, rockerRatio: 1.8 })], { includeCurves: false }).rankings[0].needs;
    expect(needs.find((n) => n.kind === 'pushrods')?.reason).toMatch(/1\.8:1 rockers against 1\.7:1/);
  });
});
