import type { FormikErrors } from 'formik';
import type { CorrectionStandard } from '@/lib/dyno/correction';
import type { DynoType } from '@/lib/dyno/dyno-type';
import { parseCurveCsv } from '@/lib/dyno/curve-csv';
import { baroIn, baroToKpa, roundTo, tempIn, tempToCelsius, type AirUnits } from '@/lib/dyno/units';
import { dynoRunChecks } from '@/lib/forms/dyno-checks';

// The dyno form's values and the step from them to the API's payload. Number inputs hand formik a
// number, or '' when the box is empty, so every numeric field is `number | ''` and is never trimmed.

type Num = number | '';
export type Values = {
  phase: 'before' | 'after';
  dynoType: DynoType;
  runAt: string;
  correctionStandard: CorrectionStandard;
  /** In the shop's units (°F or °C, inHg or kPa); converted to °C and kPa only in the payload. */
  airTemp: Num;
  baro: Num;
  humidityPct: Num;
  entry: 'curve' | 'peak';
  curveCsv: string;
  hp: Num;
  hpRpm: Num;
  torqueLbFt: Num;
  torqueRpm: Num;
  notes: string;
};

export const initialValues: Values = {
  phase: 'before',
  dynoType: 'chassis',
  runAt: '',
  correctionStandard: 'sae-j1349',
  airTemp: '',
  baro: '',
  humidityPct: '',
  entry: 'curve',
  curveCsv: '',
  hp: '',
  hpRpm: '',
  torqueLbFt: '',
  torqueRpm: '',
  notes: '',
};

/** A box's value as a number for the payload; text is tolerated should a browser ever hand formik some. */
export function num(value: unknown): number | undefined {
  if (typeof value === 'number') return Number.isNaN(value) ? undefined : value;
  if (typeof value === 'string' && value.trim() !== '') return Number(value);
  return undefined;
}

export function payloadOf(values: Values, ids: { buildId: number; quoteId: number }, units: AirUnits) {
  const csv = values.entry === 'curve' ? parseCurveCsv(values.curveCsv) : { points: [], lines: [], errors: [] };
  const temp = num(values.airTemp);
  const baro = num(values.baro);
  const payload: Record<string, unknown> = {
    ...ids,
    phase: values.phase,
    dynoType: values.dynoType,
    correctionStandard: values.correctionStandard,
    airTempC: temp === undefined ? undefined : tempToCelsius(units, temp),
    baroKpa: baro === undefined ? undefined : baroToKpa(units, baro),
    humidityPct: num(values.humidityPct),
    runAt: values.runAt ? new Date(values.runAt).toISOString() : undefined,
    notes: values.notes.trim() || undefined,
  };
  if (values.entry === 'curve') payload.curve = csv.points;
  else
    payload.peak = {
      hp: num(values.hp),
      hpRpm: num(values.hpRpm),
      torqueLbFt: num(values.torqueLbFt),
      torqueRpm: num(values.torqueRpm),
    };
  return { payload, csv };
}

const SI_TO_FORM: Record<string, keyof Values> = { airTempC: 'airTemp', baroKpa: 'baro', humidityPct: 'humidityPct' };

/** An API or schema field name → the form's box, with curve points named by the CSV line they came from. */
export function toFormErrors(
  list: { field: string; message: string }[],
  csvLines: number[] = [],
): FormikErrors<Values> {
  const out: Partial<Record<keyof Values, string>> = {};
  for (const { field, message } of list) {
    const [head, index] = field.split('.');
    let name: keyof Values = 'notes';
    let text = message;
    if (head === 'peak') name = (index as keyof Values) || 'hp';
    else if (head === 'curve') {
      name = 'curveCsv';
      if (index !== undefined) text = `line ${csvLines[Number(index)] ?? Number(index) + 1}: ${message}`;
    } else if (SI_TO_FORM[head]) name = SI_TO_FORM[head];
    else if (head in initialValues) name = head as keyof Values;
    out[name] ??= text;
  }
  return out as FormikErrors<Values>;
}

/** The server's checks, in yup from the schema's limits (lib/forms/dyno-checks.ts), bar the air readings (dyno-air-schema.ts). */
export function schemaErrors(
  values: Values,
  ids: { buildId: number; quoteId: number },
  units: AirUnits,
): FormikErrors<Values> {
  const { payload, csv } = payloadOf(values, ids, units);
  const issues = Object.entries(dynoRunChecks(payload)).map(([field, message]) => ({ field, message }));
  const errors = toFormErrors(issues, csv.lines);
  if (csv.errors.length)
    errors.curveCsv =
      csv.errors.slice(0, 3).join('; ') + (csv.errors.length > 3 ? ` (and ${csv.errors.length - 3} more lines)` : '');
  return errors;
}

/** The typed air readings in the other units, so switching the toggle never changes what was measured. */
export function convertAir(values: Values, from: AirUnits, to: AirUnits): Values {
  if (from === to) return values;
  const t = num(values.airTemp);
  const b = num(values.baro);
  return {
    ...values,
    airTemp: t === undefined ? '' : roundTo(tempIn(to, tempToCelsius(from, t)), 1),
    baro: b === undefined ? '' : roundTo(baroIn(to, baroToKpa(from, b)), to === 'imperial' ? 2 : 1),
  };
}
