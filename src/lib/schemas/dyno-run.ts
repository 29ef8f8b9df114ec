import { z } from 'zod';
import { text } from './text';
import { AIR_NEEDED_BY, CORRECTION_STANDARD_NAMES, STANDARD_LABELS } from '@/lib/dyno/correction';
import { DYNO_TYPES } from '@/lib/dyno/dyno-type';

// A dyno run as the technician records it: the air on the day, then either the peak figures read off
// the dyno screen or the pull itself as rpm/torque points (power is then computed, peaks derived).
// Limits are wide enough for any street or strip V8 on a chassis or engine dyno, narrow enough to catch typos.
export const DYNO_LIMITS = {
  airTempC: { min: -20, max: 60 },
  baroKpa: { min: 70, max: 110 },
  humidityPct: { min: 0, max: 100 },
  rpm: { min: 500, max: 10000 },
  torqueLbFt: { min: 1, max: 2000 },
  hp: { min: 1, max: 3000 },
  curvePoints: { min: 3, max: 400 },
  notesMaxLength: 2000,
  /** The torque implied at the power peak (hp · 5252 / rpm) may exceed the stated peak torque by this much, for rounding. */
  peakTolerancePct: 1,
} as const;

const L = DYNO_LIMITS;

function bounded(label: string, unit: string, { min, max }: { min: number; max: number }, whole = false) {
  let n = z
    .number({
      error: (iss) =>
        iss.input === undefined ? `${label} is required (${unit})` : `${label} must be a number (${unit})`,
    })
    .min(min, { error: `${label} must be at least ${min} ${unit}` })
    .max(max, { error: `${label} must be at most ${max} ${unit}` });
  if (whole) n = n.int({ error: `${label} must be a whole number of ${unit}` });
  return n;
}

export const AIR_TEXT = {
  airTempC: { label: 'air temperature', unit: '°C' },
  baroKpa: { label: 'barometric pressure', unit: 'kPa' },
  humidityPct: { label: 'relative humidity', unit: '%' },
} as const;

const id = (label: string) =>
  z
    .number({ error: `${label} must be a record id (whole number)` })
    .int({ error: `${label} must be a whole number` })
    .positive({ error: `${label} must be a record id` });

export const CurvePointSchema = z.strictObject({
  rpm: bounded('rpm', 'rpm', L.rpm, true),
  torqueLbFt: bounded('torque', 'lb·ft', L.torqueLbFt),
});

export const PeakFiguresSchema = z
  .strictObject({
    hp: bounded('peak power', 'hp', L.hp),
    hpRpm: bounded('rpm at peak power', 'rpm', L.rpm, true),
    torqueLbFt: bounded('peak torque', 'lb·ft', L.torqueLbFt),
    torqueRpm: bounded('rpm at peak torque', 'rpm', L.rpm, true),
  })
  .superRefine((p, ctx) => {
    // Definition of horsepower: the torque at the power peak is hp · 5252 / rpm, and no torque exceeds the peak torque.
    const torqueAtPowerPeak = (p.hp * 5252) / p.hpRpm;
    if (torqueAtPowerPeak > p.torqueLbFt * (1 + L.peakTolerancePct / 100)) {
      ctx.addIssue({
        code: 'custom',
        path: ['hp'],
        message: `${p.hp} hp at ${p.hpRpm} rpm means ${torqueAtPowerPeak.toFixed(1)} lb·ft there (hp · 5252 / rpm), more than the peak torque of ${p.torqueLbFt} lb·ft`,
      });
    }
  });

export const DynoRunSchema = z
  .strictObject(
    {
      buildId: id('buildId'),
      quoteId: id('quoteId').nullish(),
      camId: id('camId').nullish(),
      phase: z.enum(['before', 'after'], { error: 'phase must be before or after' }),
      // Optional for callers that predate it: a run without it was made on the rollers, as every run was then.
      dynoType: z.enum(DYNO_TYPES, { error: `dynoType must be one of: ${DYNO_TYPES.join(', ')}` }).default('chassis'),
      runAt: z.iso
        .datetime({ offset: true, error: 'runAt must be a date and time (ISO 8601, e.g. 2026-12-02T14:30:00Z)' })
        .nullish(),
      correctionStandard: z
        .enum(CORRECTION_STANDARD_NAMES, {
          error: `correctionStandard must be one of: ${CORRECTION_STANDARD_NAMES.join(', ')}`,
        })
        .default('sae-j1349'),
      // Optional here; required below only when the chosen standard's formula uses the reading.
      airTempC: bounded(AIR_TEXT.airTempC.label, AIR_TEXT.airTempC.unit, L.airTempC).nullish(),
      baroKpa: bounded(AIR_TEXT.baroKpa.label, AIR_TEXT.baroKpa.unit, L.baroKpa).nullish(),
      humidityPct: bounded(AIR_TEXT.humidityPct.label, AIR_TEXT.humidityPct.unit, L.humidityPct).nullish(),
      peak: PeakFiguresSchema.nullish(),
      curve: z
        .array(CurvePointSchema, { error: 'curve must be a list of { rpm, torqueLbFt } points' })
        .min(L.curvePoints.min, { error: `curve needs at least ${L.curvePoints.min} points` })
        .max(L.curvePoints.max, { error: `curve may hold at most ${L.curvePoints.max} points` })
        .superRefine((points, ctx) => {
          for (let i = 1; i < points.length; i++) {
            if (points[i].rpm <= points[i - 1].rpm) {
              ctx.addIssue({
                code: 'custom',
                path: [i, 'rpm'],
                message: `rpm must rise from point to point (${points[i].rpm} after ${points[i - 1].rpm})`,
              });
              return;
            }
          }
        })
        .nullish(),
      notes: text('notes', { multiline: true, error: 'notes must be text' })
        .max(L.notesMaxLength, { error: `notes must be at most ${L.notesMaxLength} characters` })
        .nullish(),
    },
    { error: 'the dyno run must be an object' },
  )
  .superRefine(
    (run, ctx) => {
      // Runs even when other fields failed (when: below), so a missing reading is named with every other problem.
      if (typeof run !== 'object' || run === null || !Object.hasOwn(AIR_NEEDED_BY, run.correctionStandard)) return;
      for (const field of AIR_NEEDED_BY[run.correctionStandard]) {
        if (run[field] === undefined || run[field] === null) {
          ctx.addIssue({
            code: 'custom',
            path: [field],
            message: `${AIR_TEXT[field].label} is required for ${STANDARD_LABELS[run.correctionStandard]} (${AIR_TEXT[field].unit})`,
          });
        }
      }
    },
    { when: () => true },
  )
  .superRefine((run, ctx) => {
    if (!run.peak && !run.curve)
      ctx.addIssue({
        code: 'custom',
        path: ['curve'],
        message: 'give either the peak figures (peak) or the pull as rpm/torque points (curve)',
      });
    if (run.peak && run.curve)
      ctx.addIssue({
        code: 'custom',
        path: ['peak'],
        message: 'give the peak figures or a curve, not both (peaks are derived from the curve)',
      });
  });

export type DynoRunInput = z.input<typeof DynoRunSchema>;
export type DynoRunValues = z.output<typeof DynoRunSchema>;

export const DynoRunListQuerySchema = z.strictObject({
  buildId: z.coerce
    .number({ error: 'buildId must be a record id' })
    .int({ error: 'buildId must be a whole number' })
    .positive({ error: 'buildId is required (a build id)' }),
});
