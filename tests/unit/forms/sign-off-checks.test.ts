import { signOffChecks } from '@/lib/forms/sign-off-checks';
import { JOB_LIMITS, SignOffSchema } from '@/lib/schemas/job';
import { expectSameVerdict, zodErrors } from '../../support/zod-errors';

// The sign-off form's yup checks against the zod schema POST /api/jobs/[id]/sign-off uses: the same bodies,
// the same fields flagged in the same words.

const good = {
  ptvIntakeIn: 0.09,
  ptvExhaustIn: 0.115,
  springInstalledHeightIn: 1.8,
  springSeatPressureLb: 135,
  coilBindMarginIn: 0.085,
  pushrodLengthIn: 7.4,
  lifterPreloadIn: 0.06,
  tuneFile: 'shop tune rev 2',
};

const cases: [string, Record<string, unknown>, string[]][] = [
  ['a reading typed as a word', { ...good, coilBindMarginIn: 'x' }, ['coilBindMarginIn']],
  ['a reading left blank', { ...good, pushrodLengthIn: undefined }, ['pushrodLengthIn']],
  [
    'readings past their limits',
    { ...good, springSeatPressureLb: 600, springInstalledHeightIn: 0.5 },
    ['springSeatPressureLb', 'springInstalledHeightIn'],
  ],
  ['no tune file', { ...good, tuneFile: '   ' }, ['tuneFile']],
  ['notes past their length', { ...good, notes: 'n'.repeat(JOB_LIMITS.notesMaxLength + 1) }, ['notes']],
];

describe('sign-off checks: yup in the browser, zod on the server', () => {
  it('passes a sensible sign-off both ways', () => {
    expect(zodErrors(SignOffSchema, good)).toEqual({});
    expect(signOffChecks(good)).toEqual({});
  });

  it.each(cases)('%s: the same fields, in the same words', (_name, payload, flagged) => {
    expectSameVerdict(SignOffSchema, signOffChecks, payload, flagged);
  });

  it('names each field in words the technician reads on the form, never its code', () => {
    const everything = {
      ...good,
      ptvIntakeIn: 'x',
      ptvExhaustIn: 0.9,
      springInstalledHeightIn: 0.5,
      springSeatPressureLb: 600,
      coilBindMarginIn: -1,
      pushrodLengthIn: undefined,
      lifterPreloadIn: 1,
      tuneFile: '',
      deactivationDeleteDone: 'yes',
    };
    const messages = zodErrors(SignOffSchema, everything);
    expect(messages).toMatchObject({
      ptvIntakeIn: 'piston-to-valve, intake must be a number (in)',
      coilBindMarginIn: 'coil-bind margin must be at least 0 in',
      pushrodLengthIn: 'pushrod length is required',
      tuneFile: 'tune file and version must name the tune loaded',
      deactivationDeleteDone: 'the cylinder-deactivation delete answer must be true or false',
    });
    // No camelCase field code (ptvIntakeIn, tuneFile, …) in any message.
    expect(Object.values(messages).filter((m) => /\b[a-z]+[A-Z]\w*/.test(m))).toEqual([]);
    expect(Object.keys(messages)).toHaveLength(9);
  });
});
