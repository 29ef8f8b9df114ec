import { signOffChecks } from '@/lib/forms/sign-off-checks';
import { JOB_LIMITS, SignOffSchema } from '@/lib/schemas/job';

// The sign-off form's yup checks against the zod schema POST /api/jobs/[id]/sign-off uses: the same bodies,
// the same fields flagged in the same words.

function zodErrors(payload: unknown): Record<string, string> {
  const result = SignOffSchema.safeParse(payload);
  const out: Record<string, string> = {};
  if (!result.success) for (const issue of result.error.issues) out[issue.path.map(String).join('.')] ??= issue.message;
  return out;
}

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
    expect(zodErrors(good)).toEqual({});
    expect(signOffChecks(good)).toEqual({});
  });

  it.each(cases)('%s: the same fields, in the same words', (_name, payload, flagged) => {
    const server = zodErrors(payload);
    expect(Object.keys(server).sort()).toEqual([...flagged].sort());
    expect(signOffChecks(payload)).toEqual(server);
  });
});
