import type { FormikErrors } from 'formik';
import type { CorrectionStandard } from '@/lib/dyno/correction';
import type { DynoType } from '@/lib/dyno/dyno-type';
import { parseCurveCsv } from '@/lib/dyno/curve-csv';
import type { AirUnits } from '@/lib/dyno/units';
import { airInSi, boxNumber as num } from '@/lib/forms/dyno-air-checks';
import { dynoRunChecks } from '@/lib/forms/dyno-checks';

// The dyno form's values and the step from them to the API's payload. Number inputs hand formik a
// number, or '' when the box is empty, so every numeric field is `number | ''` and is never trimmed.

type Num = number | '';
export type Values = {
  phase: 'before' | 'after';
  dynoType: DynoType;
  runAt: string;
  correctionStandard: CorrectionStandard;
  /** In the units of the shop's setting (°F or °C, inHg or kPa); converted to °C and kPa only in the payload. */
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

export function payloadOf(values: Values, ids: { buildId: number; quoteId: number }, units: AirUnits) {
  const csv = values.entry === 'curve' ? parseCurveCsv(values.curveCsv) : { points: [], lines: [], errors: [] };
  const payload: Record<string, unknown> = {
    ...ids,
    phase: values.phase,
    dynoType: values.dynoType,
    correctionStandard: values.correctionStandard,
    ...airInSi(values, units),
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

/** The server's checks, in yup from the schema's limits (lib/forms/dyno-checks.ts), bar the air readings (lib/forms/dyno-air-checks.ts). */
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
