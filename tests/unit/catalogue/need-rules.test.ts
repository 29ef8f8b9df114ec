import { evaluateNeedRules, type NeedContext, type NeedRuleInput } from '@/lib/catalogue/need-rules';

const springs = { id: 2, sku: 'SPR-TEST', name: 'Test spring kit', priceCents: 34900 };
const deleteKit = { id: 9, sku: 'DD-TEST', name: 'Test delete kit', priceCents: 64900 };
const converter = { id: 25, sku: 'TC-TEST', name: 'Test converter', priceCents: 82900 };
const tune = { id: 27, sku: 'TUNE-TEST', name: 'Test tune', priceCents: 49500 };
const springLabour = { id: 4, code: 'SPR-LAB', name: 'Spring install', hours: 2 };
const tuneLabour = { id: 7, code: 'TUNE-LAB', name: 'Tune session', hours: 3 };

function rule(overrides: Partial<NeedRuleInput> & Pick<NeedRuleInput, 'kind'>): NeedRuleInput {
  return { id: 1, threshold: null, label: 'test rule', active: true, items: [], ...overrides };
}

const mild: NeedContext = {
  cam: { intakeLiftIn: 0.5, exhaustLiftIn: 0.51, deactivationCompatible: true },
  build: { cylinderDeactivation: 'none', stallRpm: 2000 },
  crossoverRpm: 2400,
};

describe('evaluateNeedRules', () => {
  describe('lift-over', () => {
    const liftRule = rule({
      kind: 'lift-over',
      threshold: 0.57,
      items: [{ partId: springs.id, laborOperationId: springLabour.id, quantity: 1, part: springs, laborOperation: springLabour }],
    });

    it('adds the part and the labour when either lift is over the threshold, naming the lift', () => {
      const needs = evaluateNeedRules([liftRule], { ...mild, cam: { ...mild.cam, intakeLiftIn: 0.56, exhaustLiftIn: 0.6 } });
      expect(needs.map((n) => [n.type, n.partId, n.laborOperationId])).toEqual([
        ['part', springs.id, null],
        ['labor', null, springLabour.id],
      ]);
      expect(needs[0].reason).toContain('exhaust lift');
      expect(needs[0].reason).toContain('0.600"');
      expect(needs[0].reason).toContain('0.570"');
      expect(needs[0].rule).toEqual({ id: 1, kind: 'lift-over', label: 'test rule' });
    });

    it('does not fire at or under the threshold', () => {
      expect(evaluateNeedRules([liftRule], { ...mild, cam: { ...mild.cam, intakeLiftIn: 0.57, exhaustLiftIn: 0.57 } })).toEqual([]);
      expect(evaluateNeedRules([liftRule], mild)).toEqual([]);
    });
  });

  describe('deactivation-active', () => {
    const ddRule = rule({ kind: 'deactivation-active', items: [{ partId: deleteKit.id, laborOperationId: null, quantity: 1, part: deleteKit }] });
    const active = { ...mild, build: { ...mild.build, cylinderDeactivation: 'active' } };

    it('fires for active deactivation with a cam that is not compatible', () => {
      const needs = evaluateNeedRules([ddRule], { ...active, cam: { ...mild.cam, deactivationCompatible: false } });
      expect(needs).toHaveLength(1);
      expect(needs[0].part?.sku).toBe('DD-TEST');
      expect(needs[0].reason).toMatch(/deactivation/);
    });

    it('does not fire for a compatible cam, or when deactivation is absent or already deleted', () => {
      expect(evaluateNeedRules([ddRule], active)).toEqual([]);
      for (const state of ['none', 'deleted']) {
        expect(evaluateNeedRules([ddRule], { ...mild, cam: { ...mild.cam, deactivationCompatible: false }, build: { ...mild.build, cylinderDeactivation: state } })).toEqual([]);
      }
    });
  });

  describe('crossover-over-stall', () => {
    const tcRule = rule({ kind: 'crossover-over-stall', threshold: 600, items: [{ partId: converter.id, laborOperationId: null, quantity: 1, part: converter }] });

    it('fires when the crossover is at least the threshold above the stall', () => {
      const needs = evaluateNeedRules([tcRule], { ...mild, crossoverRpm: 2600 });
      expect(needs.map((n) => n.partId)).toEqual([converter.id]);
      expect(needs[0].reason).toContain('2,600 rpm');
      expect(needs[0].reason).toContain('2,000 rpm stall');
    });

    it('does not fire below the threshold, without a crossover, or without a converter', () => {
      expect(evaluateNeedRules([tcRule], { ...mild, crossoverRpm: 2599 })).toEqual([]);
      expect(evaluateNeedRules([tcRule], { ...mild, crossoverRpm: null })).toEqual([]);
      expect(evaluateNeedRules([tcRule], { ...mild, crossoverRpm: 5000, build: { ...mild.build, stallRpm: 0 } })).toEqual([]);
    });
  });

  describe('always', () => {
    it('fires for every cam and build', () => {
      const always = rule({ kind: 'always', items: [{ partId: tune.id, laborOperationId: tuneLabour.id, quantity: 1, part: tune, laborOperation: tuneLabour }] });
      const needs = evaluateNeedRules([always], mild);
      expect(needs.map((n) => n.type)).toEqual(['part', 'labor']);
      expect(needs[1].laborOperation?.code).toBe('TUNE-LAB');
      expect(needs[0].reason).toBe('Every cam swap needs this.');
    });
  });

  it('skips inactive rules and lists a part asked for twice once, with the larger quantity', () => {
    const first = rule({ id: 1, kind: 'always', items: [{ partId: tune.id, laborOperationId: null, quantity: 1, part: tune }] });
    const second = rule({ id: 2, kind: 'always', label: 'second', items: [{ partId: tune.id, laborOperationId: null, quantity: 2, part: tune }] });
    const off = rule({ id: 3, kind: 'always', active: false, items: [{ partId: springs.id, laborOperationId: null, quantity: 1, part: springs }] });
    const needs = evaluateNeedRules([first, second, off], mild);
    expect(needs).toHaveLength(1);
    expect(needs[0]).toMatchObject({ partId: tune.id, quantity: 2, rule: { id: 1 } });
  });
});
