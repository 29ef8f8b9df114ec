import * as yup from 'yup';
import { AIR_NEEDED_BY, STANDARD_LABELS, type AirReading, type CorrectionStandard } from '@/lib/dyno/correction';
import { AIR_UNIT_TEXT, rangeIn, type AirUnits } from '@/lib/dyno/units';
import { AIR_TEXT, DYNO_LIMITS as L } from '@/lib/schemas/dyno-run';

// The air readings as typed, in the shop's units. yup checks them here because the messages must name
// the unit on screen (°F, inHg); the route's zod schema checks the same readings again in °C and kPa.
// Which readings are required follows the chosen standard's formula (AIR_NEEDED_BY).

export type AirFieldName = 'airTemp' | 'baro' | 'humidityPct';
export const AIR_FIELDS: { name: AirFieldName; si: keyof AirReading }[] = [
  { name: 'airTemp', si: 'airTempC' },
  { name: 'baro', si: 'baroKpa' },
  { name: 'humidityPct', si: 'humidityPct' },
];

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

export function airSchema(units: AirUnits) {
  return yup.object(Object.fromEntries(AIR_FIELDS.map(({ name, si }) => [name, reading(units, si)])));
}
