'use client';

import { Form, Formik, useField, type FormikErrors, type FormikHelpers } from 'formik';
import { useState } from 'react';
import type { z } from 'zod';
import { sendJson } from './api';
import { centsFromText, formatMoney } from '@/lib/format';
import { Banner } from '@/components/ui/banner';
import { Button } from '@/components/ui/button';

// One formik form for every catalogue record. Fields are described once (FieldDef); the browser checks
// them with the same zod schema the server uses, the server's 422 lands on the same fields, and a 409
// shows what the other person changed before anything is saved again.

export type FieldDef = {
  name: string;
  label: string;
  kind: 'text' | 'textarea' | 'number' | 'integer' | 'money' | 'bool' | 'select';
  unit?: string;
  hint?: string;
  options?: { value: string; label: string }[];
  step?: string;
  /** Shown but never sent (e.g. a computed figure). */
  wide?: boolean;
};

export type FormValues = Record<string, string | boolean>;

export function valuesFromRecord(fields: FieldDef[], record: Record<string, unknown> | null): FormValues {
  const out: FormValues = {};
  for (const f of fields) {
    const v = record?.[f.name];
    if (f.kind === 'bool') out[f.name] = typeof v === 'boolean' ? v : false;
    else if (v === null || v === undefined) out[f.name] = '';
    else if (f.kind === 'money') out[f.name] = (Number(v) / 100).toFixed(2);
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
    else if (f.kind === 'number' || f.kind === 'integer') out[f.name] = Number.isFinite(Number(text)) ? Number(text) : text;
    else if (f.kind === 'money') {
      out[f.name] = centsFromText(text) ?? text;
    } else if (f.kind === 'select' && /^\d+$/.test(text) && f.name.endsWith('Id')) out[f.name] = Number(text);
    else out[f.name] = text;
  }
  return out;
}

export function zodValidator(fields: FieldDef[], schema: z.ZodType) {
  return (values: FormValues): FormikErrors<FormValues> => {
    const parsed = schema.safeParse(payloadFromValues(fields, values));
    if (parsed.success) return {};
    const errors: FormikErrors<FormValues> = {};
    for (const issue of parsed.error.issues) {
      const key = String(issue.path[0] ?? '');
      if (key && !errors[key]) errors[key] = issue.message;
    }
    return errors;
  };
}

function Field({ def }: { def: FieldDef }) {
  const [field, meta, helpers] = useField<string | boolean>(def.name);
  const id = `f-${def.name}`;
  const error = meta.touched && meta.error ? meta.error : null;
  const describedBy = error ? `${id}-error` : def.hint ? `${id}-hint` : undefined;
  const inputClass = `w-full rounded border bg-paper-raised px-2 py-1.5 text-ink ${error ? 'border-fault-700' : 'border-steel-300'}`;
  if (def.kind === 'bool') {
    return (
      <div className="flex items-start gap-2 pt-5">
        <input id={id} type="checkbox" checked={Boolean(field.value)} onChange={(e) => helpers.setValue(e.target.checked)} onBlur={field.onBlur} name={def.name} className="mt-1 h-4 w-4" />
        <label htmlFor={id} className="text-sm">
          <span className="font-semibold">{def.label}</span>
          {def.hint ? <span className="block text-xs text-ink-muted">{def.hint}</span> : null}
        </label>
      </div>
    );
  }
  return (
    <div className={`flex flex-col gap-1 ${def.wide || def.kind === 'textarea' ? 'sm:col-span-2 lg:col-span-3' : ''}`}>
      <label htmlFor={id} className="text-sm font-semibold">
        {def.label}
        {def.unit ? <span className="font-normal text-ink-muted"> ({def.unit})</span> : null}
      </label>
      {def.kind === 'textarea' ? (
        <textarea id={id} rows={3} aria-invalid={error ? true : undefined} aria-describedby={describedBy} className={inputClass} {...field} value={String(field.value)} />
      ) : def.kind === 'select' ? (
        <select id={id} aria-invalid={error ? true : undefined} aria-describedby={describedBy} className={inputClass} {...field} value={String(field.value)}>
          {def.options?.map((o) => (
            <option key={o.value} value={o.value}>
              {o.label}
            </option>
          ))}
        </select>
      ) : (
        <input
          id={id}
          inputMode={def.kind === 'text' ? undefined : 'decimal'}
          aria-invalid={error ? true : undefined}
          aria-describedby={describedBy}
          className={`${inputClass} ${def.kind === 'text' ? '' : 'spec text-right'}`}
          {...field}
          value={String(field.value)}
        />
      )}
      {error ? (
        <p id={`${id}-error`} className="text-xs text-fault-700">
          Problem: {error}
        </p>
      ) : def.hint ? (
        <p id={`${id}-hint`} className="text-xs text-ink-muted">
          {def.hint}
        </p>
      ) : null}
    </div>
  );
}

function show(def: FieldDef | undefined, value: unknown): string {
  if (value === null || value === undefined || value === '') return '(blank)';
  if (def?.kind === 'money') return formatMoney(Number(value));
  if (typeof value === 'boolean') return value ? 'yes' : 'no';
  return `${String(value)}${def?.unit ? ` ${def.unit}` : ''}`;
}

type Conflict = { current: Record<string, unknown>; mine: FormValues };

export function RecordForm({
  fields,
  schema,
  record,
  createUrl,
  updateUrl,
  submitLabel,
  onSaved,
  extraPayload,
}: {
  fields: FieldDef[];
  schema: z.ZodType;
  record: (Record<string, unknown> & { version?: number }) | null;
  createUrl?: string;
  updateUrl?: string;
  submitLabel: string;
  onSaved: (saved: Record<string, unknown>) => void;
  extraPayload?: Record<string, unknown>;
}) {
  const [base, setBase] = useState(record);
  const [conflict, setConflict] = useState<Conflict | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const byName = new Map(fields.map((f) => [f.name, f]));

  async function submit(values: FormValues, helpers: FormikHelpers<FormValues>) {
    setProblem(null);
    const payload = { ...payloadFromValues(fields, values), ...extraPayload };
    const result = base && updateUrl ? await sendJson<Record<string, unknown>>('PATCH', updateUrl, { ...payload, version: base.version }) : await sendJson<Record<string, unknown>>('POST', createUrl!, payload);
    if (result.status === 200 || result.status === 201) {
      setConflict(null);
      setBase(result.body as typeof base);
      onSaved(result.body);
      return;
    }
    if (result.status === 409 && result.body.current) {
      setConflict({ current: result.body.current as Record<string, unknown>, mine: values });
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
    <Formik initialValues={valuesFromRecord(fields, record)} validate={zodValidator(fields, schema)} onSubmit={submit} enableReinitialize={false}>
      {({ isSubmitting, setValues }) => {
        const differences = conflict
          ? fields
              .map((f) => ({ def: f, theirs: conflict.current[f.name], before: base?.[f.name], mine: payloadFromValues([f], conflict.mine)[f.name] }))
              .filter((d) => JSON.stringify(d.theirs ?? null) !== JSON.stringify(d.before ?? null))
          : [];
        return (
          <Form noValidate className="flex flex-col gap-4">
            {conflict ? (
              <Banner tone="caution" title="Someone else saved this record while you were editing it. Nothing has been overwritten.">
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
                <div className="mt-3 flex flex-wrap gap-2">
                  <Button
                    type="button" variant="quiet"
                    onClick={() => {
                      setBase(conflict.current as typeof base);
                      setValues(valuesFromRecord(fields, conflict.current));
                      setConflict(null);
                    }}
                  >
                    Load their version
                  </Button>
                  <Button
                    type="button" variant="quiet"
                    onClick={() => {
                      setBase(conflict.current as typeof base);
                      setConflict(null);
                    }}
                  >
                    Keep my values (then save again)
                  </Button>
                </div>
              </Banner>
            ) : null}
            {problem ? <Banner tone="fault" title="Not saved">{problem}</Banner> : null}
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
