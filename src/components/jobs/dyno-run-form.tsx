'use client';

import { ErrorMessage, Field, Form, Formik, type FormikErrors } from 'formik';
import { CORRECTION_TEXT } from '@/lib/dyno/correction';
import { parseCurveCsv } from '@/lib/dyno/curve-csv';
import { sendJson } from '@/lib/forms/zod-formik';
import { DYNO_LIMITS as L, DynoRunSchema } from '@/lib/schemas/dyno-run';
import { buttonClass } from '@/components/catalogue/ui';

// Recording one dyno pull. Values stay text while typed; the payload is checked with the same zod
// schema the route uses, so the limits and messages are the ones the server would answer with.

type Values = {
  phase: 'before' | 'after';
  runAt: string;
  correctionStandard: 'sae-j1349' | 'sae-j607' | 'din-70020' | 'none';
  airTempC: string; baroKpa: string; humidityPct: string;
  entry: 'curve' | 'peak';
  curveCsv: string;
  hp: string; hpRpm: string; torqueLbFt: string; torqueRpm: string;
  notes: string;
};

const initial: Values = {
  phase: 'before', runAt: '', correctionStandard: 'sae-j1349', airTempC: '', baroKpa: '', humidityPct: '',
  entry: 'curve', curveCsv: '', hp: '', hpRpm: '', torqueLbFt: '', torqueRpm: '', notes: '',
};

const num = (v: string) => (v.trim() === '' ? undefined : Number(v));

function payloadOf(values: Values, buildId: number, quoteId: number): { payload: Record<string, unknown>; csvErrors: string[] } {
  const csv = values.entry === 'curve' ? parseCurveCsv(values.curveCsv) : { points: [], errors: [] };
  const payload: Record<string, unknown> = {
    buildId, quoteId, phase: values.phase, correctionStandard: values.correctionStandard,
    airTempC: num(values.airTempC), baroKpa: num(values.baroKpa), humidityPct: num(values.humidityPct),
    runAt: values.runAt ? new Date(values.runAt).toISOString() : undefined,
    notes: values.notes.trim() || undefined,
  };
  if (values.entry === 'curve') payload.curve = csv.points;
  else payload.peak = { hp: num(values.hp), hpRpm: num(values.hpRpm), torqueLbFt: num(values.torqueLbFt), torqueRpm: num(values.torqueRpm) };
  return { payload, csvErrors: csv.errors };
}

/** Server and schema field names → the form's own. */
function formField(field: string): keyof Values | null {
  if (field.startsWith('peak.')) return (field.slice(5) as keyof Values) || 'hp';
  if (field === 'peak') return 'hp';
  if (field.startsWith('curve')) return 'curveCsv';
  if (field === 'runAt') return 'runAt';
  return field in initial ? (field as keyof Values) : null;
}

function toFormErrors(list: { field: string; message: string }[]): FormikErrors<Values> {
  const out: Record<string, string> = {};
  for (const { field, message } of list) {
    const name = formField(field) ?? 'notes';
    out[name] ??= field.startsWith('curve.') ? `${field.replace('curve.', 'point ')}: ${message}` : message;
  }
  return out as FormikErrors<Values>;
}

function NumberField({ name, label, unit, min, max, step = 'any' }: { name: keyof Values; label: string; unit: string; min: number; max: number; step?: string }) {
  return (
    <label className="flex flex-col gap-1 text-sm">
      <span className="font-semibold">{label}</span>
      <span className="flex items-center gap-1">
        <Field name={name} type="number" inputMode="decimal" min={min} max={max} step={step} className="spec w-28 rounded border border-steel-300 bg-paper-raised px-2 py-1" />
        <span className="text-ink-muted">{unit}</span>
      </span>
      <span className="text-xs text-ink-muted">{min}–{max} {unit}</span>
      <ErrorMessage name={name} component="span" className="text-xs text-fault-700" />
    </label>
  );
}

export function DynoRunForm({ buildId, quoteId, onSaved }: { buildId: number; quoteId: number; onSaved: () => void }) {
  return (
    <Formik<Values>
      initialValues={initial}
      validate={(values) => {
        const { payload, csvErrors } = payloadOf(values, buildId, quoteId);
        const result = DynoRunSchema.safeParse(payload);
        const errors = result.success ? {} : toFormErrors(result.error.issues.map((i) => ({ field: i.path.map(String).join('.'), message: i.message })));
        if (csvErrors.length) (errors as Record<string, string>).curveCsv = csvErrors[0];
        return errors;
      }}
      onSubmit={async (values, helpers) => {
        const answer = await sendJson('/api/dyno-runs', 'POST', payloadOf(values, buildId, quoteId).payload);
        if (answer.status === 201) {
          helpers.resetForm({ values: { ...initial, phase: values.phase, correctionStandard: values.correctionStandard, airTempC: values.airTempC, baroKpa: values.baroKpa, humidityPct: values.humidityPct, entry: values.entry } });
          helpers.setStatus({ tone: 'ok', text: 'Run recorded.' });
          onSaved();
        } else if (answer.status === 422) {
          helpers.setErrors(toFormErrors(answer.body.errors ?? []));
          helpers.setStatus({ tone: 'fault', text: answer.body.message ?? 'Some fields need attention.' });
        } else {
          helpers.setStatus({ tone: 'fault', text: answer.body.message ?? `The run was not saved (${answer.status}).` });
        }
      }}
    >
      {({ values, isSubmitting, status }) => (
        <Form className="flex flex-col gap-3" noValidate aria-labelledby="record-title">
          <h3 id="record-title" className="font-semibold">Record a dyno run</h3>
          <div className="flex flex-wrap gap-4">
            <label className="flex flex-col gap-1 text-sm">
              <span className="font-semibold">Pull</span>
              <Field as="select" name="phase" className="rounded border border-steel-300 bg-paper-raised px-2 py-1">
                <option value="before">Before (cam coming out)</option>
                <option value="after">After (cam going in)</option>
              </Field>
            </label>
            <label className="flex flex-col gap-1 text-sm">
              <span className="font-semibold">When</span>
              <Field name="runAt" type="datetime-local" className="spec rounded border border-steel-300 bg-paper-raised px-2 py-1" />
              <span className="text-xs text-ink-muted">empty = now</span>
              <ErrorMessage name="runAt" component="span" className="text-xs text-fault-700" />
            </label>
            <label className="flex flex-col gap-1 text-sm">
              <span className="font-semibold">Correction to standard air</span>
              <Field as="select" name="correctionStandard" className="rounded border border-steel-300 bg-paper-raised px-2 py-1">
                <option value="sae-j1349">SAE J1349</option>
                <option value="sae-j607">SAE J607</option>
                <option value="din-70020">DIN 70020</option>
                <option value="none">None (observed)</option>
              </Field>
              <span className="max-w-xs text-xs text-ink-muted">{CORRECTION_TEXT[values.correctionStandard].formula}</span>
            </label>
          </div>
          <fieldset className="flex flex-wrap gap-4">
            <legend className="mb-1 text-sm font-semibold">Air in the dyno cell</legend>
            <NumberField name="airTempC" label="Air temperature" unit="°C" {...L.airTempC} />
            <NumberField name="baroKpa" label="Barometric pressure" unit="kPa" {...L.baroKpa} />
            <NumberField name="humidityPct" label="Relative humidity" unit="%" {...L.humidityPct} />
          </fieldset>
          <fieldset className="flex flex-col gap-2">
            <legend className="mb-1 text-sm font-semibold">Figures (observed, before correction)</legend>
            <div className="flex gap-4 text-sm" role="radiogroup">
              <label className="flex items-center gap-1"><Field type="radio" name="entry" value="curve" /> The pull: rpm, torque</label>
              <label className="flex items-center gap-1"><Field type="radio" name="entry" value="peak" /> Peak figures only</label>
            </div>
            {values.entry === 'curve' ? (
              <label className="flex flex-col gap-1 text-sm">
                <span>Paste one line per point: rpm, torque (lb·ft). Power is worked out as lb·ft × rpm ÷ 5252.</span>
                <Field as="textarea" name="curveCsv" rows={8} placeholder={'rpm,torque\n3000,352.4\n3500,371.0'} className="spec rounded border border-steel-300 bg-paper-raised px-2 py-1" />
                <span className="text-xs text-ink-muted">{L.curvePoints.min}–{L.curvePoints.max} points, rpm rising, {L.rpm.min}–{L.rpm.max} rpm, {L.torqueLbFt.min}–{L.torqueLbFt.max} lb·ft</span>
                <ErrorMessage name="curveCsv" component="span" className="text-xs text-fault-700" />
              </label>
            ) : (
              <div className="flex flex-wrap gap-4">
                <NumberField name="hp" label="Peak power" unit="hp" {...L.hp} />
                <NumberField name="hpRpm" label="at" unit="rpm" step="1" {...L.rpm} />
                <NumberField name="torqueLbFt" label="Peak torque" unit="lb·ft" {...L.torqueLbFt} />
                <NumberField name="torqueRpm" label="at" unit="rpm" step="1" {...L.rpm} />
              </div>
            )}
          </fieldset>
          <label className="flex flex-col gap-1 text-sm">
            <span className="font-semibold">Notes</span>
            <Field as="textarea" name="notes" rows={2} maxLength={L.notesMaxLength} className="rounded border border-steel-300 bg-paper-raised px-2 py-1" />
            <ErrorMessage name="notes" component="span" className="text-xs text-fault-700" />
          </label>
          <div className="flex items-center gap-3">
            <button type="submit" className={buttonClass.primary} disabled={isSubmitting}>{isSubmitting ? 'Saving…' : 'Record run'}</button>
            {status ? <p role="status" className={`text-sm ${status.tone === 'ok' ? 'text-ok-700' : 'text-fault-700'}`}>{status.text}</p> : null}
          </div>
        </Form>
      )}
    </Formik>
  );
}
