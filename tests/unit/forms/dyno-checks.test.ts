import { dynoRunChecks } from '@/lib/forms/dyno-checks';
import { DYNO_LIMITS, DynoRunSchema } from '@/lib/schemas/dyno-run';
import { expectSameVerdict, zodErrors } from '../../support/zod-errors';

// The dyno form's yup checks (all but the air, which dyno-air-checks.ts checks in the shop's units) against
// the zod schema POST /api/dyno-runs uses: the same payloads, the same fields flagged in the same words.

const base = { buildId: 1, quoteId: 2, phase: 'before', dynoType: 'chassis', correctionStandard: 'none' };
const pull = [
  { rpm: 3000, torqueLbFt: 360 },
  { rpm: 3500, torqueLbFt: 375 },
  { rpm: 4000, torqueLbFt: 380 },
];
const peak = { hp: 330, hpRpm: 5000, torqueLbFt: 380, torqueRpm: 4000 };

const cases: [string, Record<string, unknown>, string[]][] = [
  ['a pull whose rpm falls', { ...base, curve: [...pull, { rpm: 3900, torqueLbFt: 370 }] }, ['curve.3.rpm']],
  ['a pull of two points', { ...base, curve: pull.slice(0, 2) }, ['curve']],
  [
    'a point past the torque limit and a half rpm',
    { ...base, curve: [pull[0], { rpm: 3500.5, torqueLbFt: 2500 }, pull[2]] },
    ['curve.1.rpm', 'curve.1.torqueLbFt'],
  ],
  ['peak power the peak torque cannot make', { ...base, peak: { ...peak, hp: 500 } }, ['peak.hp']],
  ['a peak rpm that is not a number', { ...base, peak: { ...peak, torqueRpm: Number('x') } }, ['peak.torqueRpm']],
  ['neither a pull nor peaks', { ...base }, ['curve']],
  ['both a pull and peaks', { ...base, curve: pull, peak }, ['peak']],
  ['notes past their length', { ...base, curve: pull, notes: 'n'.repeat(DYNO_LIMITS.notesMaxLength + 1) }, ['notes']],
];

describe('dyno-run checks: yup in the browser, zod on the server', () => {
  it('passes a sensible pull and sensible peaks both ways', () => {
    for (const payload of [
      { ...base, curve: pull },
      { ...base, peak },
    ]) {
      expect(zodErrors(DynoRunSchema, payload)).toEqual({});
      expect(dynoRunChecks(payload)).toEqual({});
    }
  });

  it.each(cases)('%s: the same fields, in the same words', (_name, payload, flagged) => {
    expectSameVerdict(DynoRunSchema, dynoRunChecks, payload, flagged);
  });
});
