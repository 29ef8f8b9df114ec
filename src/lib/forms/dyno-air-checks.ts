import * as yup from 'yup';
import { AIR_NEEDED_BY, STANDARD_LABELS, type AirReading, type CorrectionStandard } from '@/lib/dyno/correction';
import { AIR_UNIT_TEXT, baroToKpa, rangeIn, tempToCelsius, type AirUnits } from '@/lib/dyno/units';
import { AIR_TEXT, DYNO_LIMITS as L } from '@/lib/schemas/dyno-run';
import { validateWithYup } from './yup-limits';

// The dyno form's air readings as typed, in the units the shop chose on the settings page (°F and inHg, or
// °C and kPa). yup checks them here because the messages must name the unit on screen; the route's zod schema
// (lib/schemas/dyno-run.ts) checks the same readings again in °C and kPa once airInSi has converted them. In
// °C and kPa both say the same words (tests/unit/forms/dyno-air-checks.test.ts). Which readings are required
// follows the chosen standard's formula (AIR_NEEDED_BY).

export type AirFieldName = 'airTemp' | 'baro' | 'humidityPct';
export const AIR_FIELDS: { name: AirFieldName; si: keyof AirReading }[] = [
  { name: 'airTemp', si: 'airTempC' },
  { name: 'baro', si: 'baroKpa' },
  { name: 'humidityPct', si: 'humidityPct' },
];

/** The typed readings: a number box hands formik a number, or '' when it is empty. */
export type AirValues = {
  correctionStandard: CorrectionStandard;
  airTemp: number | '';
  baro: number | '';
  humidityPct: number | '';
};

export function airFieldText(
  units: AirUnits,
  si: keyof AirReading,
): { label: string; unit: string; min: number; max: number; step: string } {
  const u = AIR_UNIT_TEXT[units];
  if (si === 'airTempC')
    return {
      label: AIR_TEXT.airTempC.label,
      unit: u.temp,
      ...rangeIn(units, 'temp', L.airTempC),
      step: units === 'imperial' ? '1' : '0.1',
    };
  if (si === 'baroKpa')
    return {
      label: AIR_TEXT.baroKpa.label,
      unit: u.baro,
      ...rangeIn(units, 'baro', L.baroKpa),
      step: units === 'imperial' ? '0.01' : '0.1',
    };
  return { label: AIR_TEXT.humidityPct.label, unit: AIR_TEXT.humidityPct.unit, ...L.humidityPct, step: '1' };
}

function reading(units: AirUnits, si: keyof AirReading) {
  const { label, unit, min, max } = airFieldText(units, si);
  return yup
    .number()
    .transform((value, original) => (original === '' || original === null ? undefined : value))
    .typeError(`${label} must be a number (${unit})`)
    .min(min, `${label} must be at least ${min} ${unit}`)
    .max(max, `${label} must be at most ${max} ${unit}`)
    .when('correctionStandard', ([standard], schema) =>
      AIR_NEEDED_BY[standard as CorrectionStandard]?.includes(si)
        ? schema.required(`${label} is required for ${STANDARD_LABELS[standard as CorrectionStandard]} (${unit})`)
        : schema.optional(),
    );
}

/** formik's validationSchema for the air boxes, in the shop's units. */
export function airSchema(units: AirUnits) {
  return yup.object(Object.fromEntries(AIR_FIELDS.map(({ name, si }) => [name, reading(units, si)])));
}

/** The same checks as a function: box name → its first message (what the unit tests hold against zod). */
export function dynoAirChecks(units: AirUnits): (values: Record<string, unknown>) => Record<string, string> {
  return validateWithYup<Record<string, unknown>>(airSchema(units));
}

/** A box's value as a number for the payload; text is tolerated should a browser ever hand formik some. */
export function boxNumber(value: unknown): number | undefined {
  if (typeof value === 'number') return Number.isNaN(value) ? undefined : value;
  if (typeof value === 'string' && value.trim() !== '') return Number(value);
  return undefined;
}

/** The typed readings in °C and kPa, as POST /api/dyno-runs takes and the database keeps them. */
export function airInSi(
  values: Pick<AirValues, 'airTemp' | 'baro' | 'humidityPct'>,
  units: AirUnits,
): { airTempC?: number; baroKpa?: number; humidityPct?: number } {
  const temp = boxNumber(values.airTemp);
  const baro = boxNumber(values.baro);
  return {
    airTempC: temp === undefined ? undefined : tempToCelsius(units, temp),
    baroKpa: baro === undefined ? undefined : baroToKpa(units, baro),
    humidityPct: boxNumber(values.humidityPct),
  };
}
