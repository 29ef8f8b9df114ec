import * as yup from 'yup';
import { DYNO_LIMITS as L } from '@/lib/schemas/dyno-run';
import { fieldRule, isFiniteNumber, validateWithYup } from './yup-limits';

// The dyno-run form's checks in the browser, bar the air readings (dyno-air-checks.ts checks
// those in the units the shop chose): yup over the JSON the form sends, from the limits lib/schemas/dyno-run.ts
// exports and in its words. POST /api/dyno-runs still validates the whole run with zod.

function bounded(label: string, unit: string, { min, max }: { min: number; max: number }, whole = false) {
  let n = yup
    .number()
    .typeError(`${label} must be a number (${unit})`)
    .required(`${label} is required (${unit})`)
    .min(min, `${label} must be at least ${min} ${unit}`)
    .max(max, `${label} must be at most ${max} ${unit}`);
  if (whole) n = n.integer(`${label} must be a whole number of ${unit}`);
  return n;
}

type Point = { rpm?: number; torqueLbFt?: number };

const curve = yup
  .array(yup.object({ rpm: bounded('rpm', 'rpm', L.rpm, true), torqueLbFt: bounded('torque', 'lb·ft', L.torqueLbFt) }))
  .min(L.curvePoints.min, `curve needs at least ${L.curvePoints.min} points`)
  .max(L.curvePoints.max, `curve may hold at most ${L.curvePoints.max} points`)
  .test('rpm-rises', '', function (points) {
    // Named on the first point that does not rise, as the schema does.
    const list = (points ?? []) as Point[];
    for (let i = 1; i < list.length; i++) {
      const [before, now] = [list[i - 1].rpm, list[i].rpm];
      if (isFiniteNumber(before) && isFiniteNumber(now) && now <= before)
        return this.createError({
          path: `${this.path}.${i}.rpm`,
          message: `rpm must rise from point to point (${now} after ${before})`,
        });
    }
    return true;
  });

type Peak = { hp?: number; hpRpm?: number; torqueLbFt?: number };
const peak = yup
  .object({
    hp: bounded('peak power', 'hp', L.hp),
    hpRpm: bounded('rpm at peak power', 'rpm', L.rpm, true),
    torqueLbFt: bounded('peak torque', 'lb·ft', L.torqueLbFt),
    torqueRpm: bounded('rpm at peak torque', 'rpm', L.rpm, true),
  })
  .default(undefined)
  // Definition of horsepower: the torque at the power peak is hp · 5252 / rpm, and no torque exceeds the peak torque.
  .test(
    fieldRule<Peak>(
      'torque-at-power-peak',
      'hp',
      (p) =>
        `${p.hp} hp at ${p.hpRpm} rpm means ${((p.hp! * 5252) / p.hpRpm!).toFixed(1)} lb·ft there (hp · 5252 / rpm), more than the peak torque of ${p.torqueLbFt} lb·ft`,
      (p) =>
        !isFiniteNumber(p.hp) ||
        !isFiniteNumber(p.hpRpm) ||
        !isFiniteNumber(p.torqueLbFt) ||
        p.hpRpm === 0 ||
        (p.hp * 5252) / p.hpRpm <= p.torqueLbFt * (1 + L.peakTolerancePct / 100),
    ),
  );

export const dynoRunChecks = validateWithYup<Record<string, unknown>>(
  yup
    .object({
      curve: curve.default(undefined),
      peak,
      notes: yup.string().max(L.notesMaxLength, `notes must be at most ${L.notesMaxLength} characters`),
    })
    .test(
      fieldRule<{ curve?: unknown; peak?: unknown }>(
        'curve-or-peak',
        'curve',
        'give either the peak figures (peak) or the pull as rpm/torque points (curve)',
        (r) => Boolean(r.curve || r.peak),
      ),
    )
    .test(
      fieldRule<{ curve?: unknown; peak?: unknown }>(
        'not-both',
        'peak',
        'give the peak figures or a curve, not both (peaks are derived from the curve)',
        (r) => !(r.curve && r.peak),
      ),
    ),
);
