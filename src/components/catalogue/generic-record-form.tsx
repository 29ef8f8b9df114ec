'use client';

import { Form, Formik, type FormikHelpers } from 'formik';
import { useState } from 'react';
import * as yup from 'yup';
import { useVersionedSave } from '@/lib/api-client';
import {
  bpFromPercentText,
  bpToPercentText,
  centsFromText,
  centsToText,
  formatMoney,
  percentFromBp,
} from '@/lib/format';
import {
  moneyWithin,
  numberWithin,
  percentWithin,
  textUpTo,
  validateWithYup,
  type Range,
} from '@/lib/forms/yup-limits';
import { Banner } from '@/components/ui/banner';
import { Button } from '@/components/ui/button';
import { ConflictBanner } from '@/components/ui/conflict-banner';
import { CheckboxField, NumberField, SelectField, TextAreaField, TextField } from '@/components/ui/formik-fields';

// One formik form for every catalogue record. Fields are described once (FieldDef), each with the limit the
// zod schema exports (range, maxLength); the browser checks those with yup as someone types, the server
// checks everything with zod and its 422 lands on the same fields, and a 409 shows what the other person
// changed before anything is saved again.

export type FieldDef = {
  name: string;
  label: string;
  kind: 'text' | 'textarea' | 'number' | 'integer' | 'money' | 'percent' | 'bool' | 'select';
  unit?: string;
  hint?: string;
  options?: { value: string; label: string }[];
  step?: string;
  wide?: boolean;
  /** Limits from the entity's schema (src/lib/schemas): checked in the browser, and again by the server. */
  range?: Range;
  maxLength?: number;
  required?: boolean;
  /** The name the schema's messages give the field, when the label says it differently ("deposit percent"). */
  term?: string;
};

export type FormValues = Record<string, string | boolean>;

export function valuesFromRecord(fields: FieldDef[], record: Record<string, unknown> | null): FormValues {
  const out: FormValues = {};
  for (const f of fields) {
    const v = record?.[f.name];
    if (f.kind === 'bool') out[f.name] = typeof v === 'boolean' ? v : false;
    else if (v === null || v === undefined) out[f.name] = '';
    else if (f.kind === 'money') out[f.name] = centsToText(Number(v));
    else if (f.kind === 'percent') out[f.name] = bpToPercentText(Number(v));
    else out[f.name] = String(v);
  }
  return out;
}

/** Form strings to the JSON the API takes: blanks are null, numbers are numbers, dollars are cents. */
export function payloadFromValues(fields: FieldDef[], values: FormValues): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const f of fields) {
    const v = values[f.name];
    if (f.kind === 'bool') {
      out[f.name] = Boolean(v);
      continue;
    }
    const text = String(v ?? '').trim();
    if (text === '') out[f.name] = null;
    else if (f.kind === 'number' || f.kind === 'integer')
      out[f.name] = Number.isFinite(Number(text)) ? Number(text) : text;
    else if (f.kind === 'money') {
      out[f.name] = centsFromText(text) ?? text;
    } else if (f.kind === 'percent') out[f.name] = bpFromPercentText(text) ?? text;
    else if (f.kind === 'select' && /^\d+$/.test(text) && f.name.endsWith('Id')) out[f.name] = Number(text);
    else out[f.name] = text;
  }
  return out;
}

/** "Tax rate" → "tax rate" for a message, but "SKU" stays "SKU". */
const inMessage = (label: string) => (/^[A-Z][a-z]/.test(label) ? label[0].toLowerCase() + label.slice(1) : label);

/** formik's validation for these fields, built with yup from the limits each FieldDef carries. */
export function yupValidator(fields: FieldDef[]) {
  const shape: Record<string, yup.AnySchema> = {};
  for (const f of fields) {
    const label = f.term ?? inMessage(f.label);
    if (f.kind === 'text' || f.kind === 'textarea')
      shape[f.name] = textUpTo(label, f.maxLength, { required: f.required });
    else if (f.kind === 'number' || f.kind === 'integer')
      shape[f.name] = numberWithin(label, f.unit ?? '', f.range, {
        integer: f.kind === 'integer',
        required: f.required,
      });
    else if (f.kind === 'money') shape[f.name] = moneyWithin(label, f.range, centsFromText, { required: f.required });
    else if (f.kind === 'percent')
      shape[f.name] = percentWithin(label, f.range, bpFromPercentText, { required: f.required });
  }
  return validateWithYup<FormValues>(yup.object(shape));
}

/** One FieldDef drawn with the shared field set; numbers and money read right-aligned in figures. */
function Field({ def }: { def: FieldDef }) {
  const wide = def.wide || def.kind === 'textarea' ? 'sm:col-span-2 lg:col-span-3' : '';
  if (def.kind === 'bool') return <CheckboxField name={def.name} label={def.label} hint={def.hint} className="pt-5" />;
  if (def.kind === 'textarea')
    return (
      <TextAreaField name={def.name} label={def.label} hint={def.hint} className={wide} maxLength={def.maxLength} />
    );
  if (def.kind === 'select')
    return (
      <SelectField
        name={def.name}
        label={def.label}
        hint={def.hint}
        className={wide}
        options={(def.options ?? []).map((o) => [o.value, o.label] as const)}
      />
    );
  if (def.kind === 'text')
    return <TextField name={def.name} label={def.label} hint={def.hint} className={wide} maxLength={def.maxLength} />;
  return (
    <NumberField
      name={def.name}
      label={def.label}
      unit={def.unit ?? ''}
      hint={def.hint ?? ''}
      decimals={def.kind !== 'integer'}
      className={wide}
    />
  );
}

function show(def: FieldDef | undefined, value: unknown): string {
  if (value === null || value === undefined || value === '') return '(blank)';
  if (def?.kind === 'money') return formatMoney(Number(value));
  if (def?.kind === 'percent') return percentFromBp(Number(value));
  if (typeof value === 'boolean') return value ? 'yes' : 'no';
  return `${String(value)}${def?.unit ? ` ${def.unit}` : ''}`;
}

export function RecordForm({
  fields,
  record,
  createUrl,
  updateUrl,
  submitLabel,
  onSaved,
  extraPayload,
}: {
  fields: FieldDef[];
  record: (Record<string, unknown> & { version?: number }) | null;
  createUrl?: string;
  updateUrl?: string;
  submitLabel: string;
  onSaved: (saved: Record<string, unknown>) => void;
  extraPayload?: Record<string, unknown>;
}) {
  const { base, conflict, save, settle } = useVersionedSave<Record<string, unknown> & { version?: number }>(record);
  // What was typed when their save came back, to show beside theirs.
  const [mine, setMine] = useState<FormValues | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const byName = new Map(fields.map((f) => [f.name, f]));

  async function submit(values: FormValues, helpers: FormikHelpers<FormValues>) {
    setProblem(null);
    const payload = { ...payloadFromValues(fields, values), ...extraPayload };
    const result =
      base && updateUrl ? await save('PATCH', updateUrl, payload) : await save('POST', createUrl!, payload);
    if (result.ok) {
      onSaved(result.body);
      return;
    }
    if (result.status === 409 && result.body.current) {
      setMine(values);
      return;
    }
    if (result.status === 422 && result.body.errors) {
      const unplaced: string[] = [];
      for (const e of result.body.errors) {
        const key = e.field.split('.')[0];
        if (byName.has(key)) helpers.setFieldError(key, e.message);
        else unplaced.push(`${e.field}: ${e.message}`);
      }
      helpers.setTouched(Object.fromEntries(fields.map((f) => [f.name, true])), false);
      setProblem(unplaced.length ? unplaced.join('; ') : 'Some fields need attention; see the messages beside them.');
      return;
    }
    setProblem(result.body.message ?? `The server answered ${result.status}; nothing was saved.`);
  }

  return (
    <Formik
      initialValues={valuesFromRecord(fields, record)}
      validate={yupValidator(fields)}
      onSubmit={submit}
      enableReinitialize={false}
    >
      {({ isSubmitting, setValues }) => {
        const differences = conflict
          ? fields
              .map((f) => ({
                def: f,
                theirs: conflict[f.name],
                before: base?.[f.name],
                mine: payloadFromValues([f], mine ?? {})[f.name],
              }))
              .filter((d) => JSON.stringify(d.theirs ?? null) !== JSON.stringify(d.before ?? null))
          : [];
        return (
          <Form noValidate className="flex flex-col gap-4">
            {conflict ? (
              <ConflictBanner
                title="Someone else saved this record while you were editing it. Nothing has been overwritten."
                onTheirs={() => {
                  const theirs = settle();
                  if (theirs) setValues(valuesFromRecord(fields, theirs));
                }}
                onMine={() => settle()}
                mineLabel="Keep my values (then save again)"
              >
                {differences.length ? (
                  <table className="mt-2 w-full text-sm tabular-nums">
                    <thead>
                      <tr className="text-left text-xs uppercase text-ink-muted">
                        <th className="py-1">Field</th>
                        <th>When you opened it</th>
                        <th>Saved by them</th>
                        <th>Yours</th>
                      </tr>
                    </thead>
                    <tbody>
                      {differences.map((d) => (
                        <tr key={d.def.name} className="border-t border-steel-100">
                          <td className="py-1 font-semibold">{d.def.label}</td>
                          <td className="spec">{show(d.def, d.before)}</td>
                          <td className="spec">{show(d.def, d.theirs)}</td>
                          <td className="spec">{show(d.def, d.mine)}</td>
                        </tr>
                      ))}
                    </tbody>
                  </table>
                ) : (
                  <p>Their save changed nothing you can see in this form.</p>
                )}
              </ConflictBanner>
            ) : null}
            {problem ? (
              <Banner tone="fault" title="Not saved">
                {problem}
              </Banner>
            ) : null}
            <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
              {fields.map((def) => (
                <Field key={def.name} def={def} />
              ))}
            </div>
            <div className="flex items-center gap-3">
              <Button type="submit" variant="primary" disabled={isSubmitting || Boolean(conflict)}>
                {isSubmitting ? 'Saving…' : submitLabel}
              </Button>
              {base?.version ? <span className="text-xs text-ink-muted">Version {String(base.version)}</span> : null}
            </div>
          </Form>
        );
      }}
    </Formik>
  );
}
