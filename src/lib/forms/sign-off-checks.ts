import * as yup from 'yup';
import { JOB_LIMITS, SIGN_OFF_READING_LIMITS, SIGN_OFF_WORDS } from '@/lib/schemas/job';
import { validateWithYup } from './yup-limits';

// The sign-off form's checks in the browser: yup over the JSON the form sends, from the limits lib/schemas/job.ts
// exports and in its words (each reading named in words, as the route's 422 names it). A reading the form
// could not read as a number travels as the text typed, so "must be a number" is said here as there.
// POST /api/jobs/[id]/sign-off still validates with zod, and decides whether the deactivation answer is needed.

function reading(name: keyof typeof SIGN_OFF_READING_LIMITS) {
  const { label, unit, min, max } = SIGN_OFF_READING_LIMITS[name];
  return yup
    .mixed<number | string>()
    .test(
      'number',
      `${label} must be a number (${unit})`,
      (v) => v === undefined || (typeof v === 'number' && Number.isFinite(v)),
    )
    .defined(`${label} is required`)
    .test('min', `${label} must be at least ${min} ${unit}`, (v) => typeof v !== 'number' || v >= min)
    .test('max', `${label} must be at most ${max} ${unit}`, (v) => typeof v !== 'number' || v <= max);
}

const readings = Object.fromEntries(
  (Object.keys(SIGN_OFF_READING_LIMITS) as (keyof typeof SIGN_OFF_READING_LIMITS)[]).map((name) => [
    name,
    reading(name),
  ]),
);

export const signOffChecks = validateWithYup<Record<string, unknown>>(
  yup.object({
    ...readings,
    tuneFile: yup
      .string()
      .defined(`${SIGN_OFF_WORDS.tuneFile} is required`)
      .test('named', `${SIGN_OFF_WORDS.tuneFile} must name the tune loaded`, (v) => Boolean(v?.trim()))
      .max(
        JOB_LIMITS.tuneFileMaxLength,
        `${SIGN_OFF_WORDS.tuneFile} must be at most ${JOB_LIMITS.tuneFileMaxLength} characters`,
      ),
    notes: yup.string().max(JOB_LIMITS.notesMaxLength, `notes must be at most ${JOB_LIMITS.notesMaxLength} characters`),
  }),
);
