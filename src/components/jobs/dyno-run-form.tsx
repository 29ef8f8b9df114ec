'use client';

import { ErrorMessage, Field, Form, Formik, type FormikHelpers } from 'formik';
import { useMemo } from 'react';
import { Button } from '@/components/ui/button';
import { submitOnCtrlEnter } from '@/components/ui/keys';
import { AIR_NEEDED_BY, CORRECTION_TEXT, STANDARD_LABELS } from '@/lib/dyno/correction';
import { DYNO_TYPES, DYNO_TYPE_WORDS } from '@/lib/dyno/dyno-type';
import { AIR_UNITS_WORDS, type AirUnits } from '@/lib/dyno/units';
import { sendJson } from '@/lib/api-client';
import { DYNO_LIMITS as L } from '@/lib/schemas/dyno-run';
import { AIR_FIELDS, airFieldText, airSchema } from '@/lib/forms/dyno-air-checks';
import { CurveInput } from './dyno-curve-input';
import { FieldProblem, NumberBox } from './dyno-fields';
import { initialValues, payloadOf, schemaErrors, toFormErrors, type Values } from './dyno-run-values';

// Recording one dyno pull. The air is typed in the units of the shop's setting (°F and inHg, or °C and kPa; a
// manager changes it on the settings page) and sent in °C and kPa; the rest is checked
// with yup built from the schema's limits, in the server's words (lib/forms/dyno-checks.ts); the route uses zod.

const ENTRY_CHOICES = [
  ['curve', 'The pull: rpm, torque'],
  ['peak', 'Peak figures only'],
] as const;
const selectClass = 'rounded border border-steel-300 bg-paper-raised px-2 py-1';

export function DynoRunForm({
  buildId,
  quoteId,
  units,
  onSaved,
}: {
  buildId: number;
  quoteId: number;
  units: AirUnits;
  onSaved: () => void;
}) {
  const ids = { buildId, quoteId };
  const validationSchema = useMemo(() => airSchema(units), [units]);

  async function submit(values: Values, helpers: FormikHelpers<Values>) {
    const { payload, csv } = payloadOf(values, ids, units);
    const answer = await sendJson('POST', '/api/dyno-runs', payload);
    if (answer.status === 201) {
      // The next pull is usually the same day and the same cell: keep the air and the choices.
      const keep = {
        phase: values.phase,
        dynoType: values.dynoType,
        correctionStandard: values.correctionStandard,
        airTemp: values.airTemp,
        baro: values.baro,
        humidityPct: values.humidityPct,
        entry: values.entry,
      };
      helpers.resetForm({ values: { ...initialValues, ...keep } });
      helpers.setStatus({ tone: 'ok', text: 'Run recorded.' });
      onSaved();
    } else if (answer.status === 422) {
      helpers.setErrors(toFormErrors(answer.body.errors ?? [], csv.lines));
      helpers.setStatus({ tone: 'fault', text: answer.body.message ?? 'Some fields need attention.' });
    } else {
      helpers.setStatus({ tone: 'fault', text: answer.body.message ?? `The run was not saved (${answer.status}).` });
    }
  }

  return (
    <Formik<Values>
      initialValues={initialValues}
      validationSchema={validationSchema}
      validate={(values) => schemaErrors(values, ids, units)}
      onSubmit={submit}
    >
      {({ values, isSubmitting, status, setFieldValue, submitForm }) => (
        <Form
          className="flex flex-col gap-3"
          noValidate
          aria-labelledby="record-title"
          onKeyDown={submitOnCtrlEnter(submitForm)}
        >
          <h3 id="record-title" className="font-semibold">
            Record a dyno run
          </h3>
          <p className="text-xs text-ink-muted">Ctrl+Enter saves from any box.</p>
          <div className="flex flex-wrap gap-4">
            <div className="flex flex-col gap-1 text-sm">
              <label htmlFor="dyno-phase" className="font-semibold">
                Pull
              </label>
              <Field as="select" id="dyno-phase" name="phase" className={selectClass}>
                <option value="before">Before (cam coming out)</option>
                <option value="after">After (cam going in)</option>
              </Field>
            </div>
            <div className="flex flex-col gap-1 text-sm">
              <label htmlFor="dyno-type" className="font-semibold">
                Dyno
              </label>
              <Field
                as="select"
                id="dyno-type"
                name="dynoType"
                aria-describedby="dyno-type-hint"
                className={selectClass}
              >
                {DYNO_TYPES.map((t) => (
                  <option key={t} value={t}>
                    {DYNO_TYPE_WORDS[t].long}
                  </option>
                ))}
              </Field>
              <span id="dyno-type-hint" className="max-w-xs text-xs text-ink-muted">
                Compared only with runs on the same kind of dyno.
              </span>
            </div>
            <div className="flex flex-col gap-1 text-sm">
              <label htmlFor="dyno-runAt" className="font-semibold">
                When
              </label>
              <Field
                id="dyno-runAt"
                name="runAt"
                type="datetime-local"
                aria-describedby="dyno-runAt-hint"
                className={`spec ${selectClass}`}
              />
              <span id="dyno-runAt-hint" className="text-xs text-ink-muted">
                empty = now
              </span>
              <ErrorMessage name="runAt">{(m) => <FieldProblem id="dyno-runAt-error" error={m} />}</ErrorMessage>
            </div>
            <div className="flex flex-col gap-1 text-sm">
              <label htmlFor="dyno-standard" className="font-semibold">
                Correction to standard air
              </label>
              <Field
                as="select"
                id="dyno-standard"
                name="correctionStandard"
                aria-describedby="dyno-standard-hint"
                className={selectClass}
              >
                <option value="sae-j1349">SAE J1349</option>
                <option value="sae-j607">SAE J607</option>
                <option value="din-70020">DIN 70020</option>
                <option value="none">None (observed)</option>
              </Field>
              <span id="dyno-standard-hint" className="max-w-xs text-xs text-ink-muted">
                {CORRECTION_TEXT[values.correctionStandard].formula}
              </span>
            </div>
          </div>
          <fieldset className="flex flex-wrap items-start gap-4">
            <legend className="mb-1 text-sm font-semibold">Air in the dyno cell</legend>
            <p className="basis-full text-xs text-ink-muted">
              In {AIR_UNITS_WORDS[units]}, the shop’s setting (a manager changes it under Prices and deposit); kept in
              °C and kPa.
            </p>
            {AIR_FIELDS.map(({ name, si }) => {
              const text = airFieldText(units, si);
              const needed = AIR_NEEDED_BY[values.correctionStandard].includes(si);
              const standard = STANDARD_LABELS[values.correctionStandard];
              return (
                <NumberBox
                  key={name}
                  name={name}
                  {...text}
                  label={text.label[0].toUpperCase() + text.label.slice(1)}
                  hint={
                    needed
                      ? `needed for ${standard}`
                      : values.correctionStandard === 'none'
                        ? 'optional without a correction'
                        : `optional, not used by ${standard}`
                  }
                />
              );
            })}
          </fieldset>
          <fieldset className="flex flex-col gap-2">
            <legend className="mb-1 text-sm font-semibold">Figures (observed, before correction)</legend>
            <div className="flex gap-4 text-sm" role="radiogroup" aria-label="How the figures are given">
              {ENTRY_CHOICES.map(([value, label]) => (
                <label key={value} className="flex items-center gap-1">
                  <input
                    type="radio"
                    name="entry"
                    value={value}
                    checked={values.entry === value}
                    onChange={() => void setFieldValue('entry', value)}
                  />{' '}
                  {label}
                </label>
              ))}
            </div>
            {values.entry === 'curve' ? (
              <CurveInput />
            ) : (
              <div className="flex flex-wrap gap-4">
                <NumberBox name="hp" label="Peak power" unit="hp" {...L.hp} />
                <NumberBox name="hpRpm" label="rpm at peak power" unit="rpm" step="1" {...L.rpm} />
                <NumberBox name="torqueLbFt" label="Peak torque" unit="lb·ft" {...L.torqueLbFt} />
                <NumberBox name="torqueRpm" label="rpm at peak torque" unit="rpm" step="1" {...L.rpm} />
              </div>
            )}
          </fieldset>
          <div className="flex flex-col gap-1 text-sm">
            <label htmlFor="dyno-notes" className="font-semibold">
              Notes
            </label>
            <Field
              as="textarea"
              id="dyno-notes"
              name="notes"
              rows={2}
              maxLength={L.notesMaxLength}
              className={selectClass}
            />
            <ErrorMessage name="notes">{(m) => <FieldProblem id="dyno-notes-error" error={m} />}</ErrorMessage>
          </div>
          <div className="flex items-center gap-3">
            <Button type="submit" variant="primary" disabled={isSubmitting}>
              {isSubmitting ? 'Saving…' : 'Record run'}
            </Button>
            {status ? (
              <p role="status" className={`text-sm ${status.tone === 'ok' ? 'text-ok-700' : 'text-fault-700'}`}>
                <span className="font-semibold">{status.tone === 'ok' ? 'Done:' : 'Problem:'}</span> {status.text}
              </p>
            ) : null}
          </div>
        </Form>
      )}
    </Formik>
  );
}
