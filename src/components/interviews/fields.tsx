'use client';

import { useField } from 'formik';

// Inputs for the interview: label above, unit beside every number, the limit as a hint, the problem
// in words below. Numbers are text inputs with a decimal keypad so a half-typed value is never lost.

const inputClass = (bad: boolean) =>
  `w-full min-w-0 rounded border bg-paper-raised px-3 py-2 text-ink ${bad ? 'border-fault-700' : 'border-steel-300'} focus:outline-2 focus:outline-gauge-500`;

function useFieldState(name: string) {
  const [field, meta] = useField<string>(name);
  const bad = Boolean(meta.touched && meta.error);
  const id = `f-${name.replace(/\./g, '-')}`;
  return { field, meta, bad, id };
}

function Message({ id, bad, error, hint }: { id: string; bad: boolean; error?: string; hint?: string }) {
  if (bad) return <p id={`${id}-msg`} className="text-xs text-fault-700">Problem: {error}</p>;
  if (hint) return <p id={`${id}-msg`} className="text-xs text-ink-muted">{hint}</p>;
  return null;
}

export function NumberField({ name, label, unit, range, hint, decimals = true }: {
  name: string; label: string; unit: string; range?: { min: number; max: number }; hint?: string; decimals?: boolean;
}) {
  const { field, meta, bad, id } = useFieldState(name);
  const shown = hint ?? (range ? `${range.min}–${range.max} ${unit}` : undefined);
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="text-sm font-semibold text-ink">{label}</label>
      <div className="flex items-center gap-2">
        <input
          id={id}
          type="text"
          inputMode={decimals ? 'decimal' : 'numeric'}
          autoComplete="off"
          aria-invalid={bad || undefined}
          aria-describedby={shown || bad ? `${id}-msg` : undefined}
          className={`${inputClass(bad)} spec`}
          {...field}
        />
        <span className="shrink-0 text-sm text-ink-soft" aria-hidden="true">{unit}</span>
      </div>
      <Message id={id} bad={bad} error={meta.error} hint={shown} />
    </div>
  );
}

export function TextInput({ name, label, hint, type = 'text', autoComplete = 'off', autoFocus, maxLength, wide }: {
  name: string; label: string; hint?: string; type?: string; autoComplete?: string; autoFocus?: boolean; maxLength?: number; wide?: boolean;
}) {
  const { field, meta, bad, id } = useFieldState(name);
  return (
    <div className={`flex flex-col gap-1 ${wide ? 'sm:col-span-2' : ''}`}>
      <label htmlFor={id} className="text-sm font-semibold text-ink">{label}</label>
      <input
        id={id}
        type={type}
        autoComplete={autoComplete}
        autoFocus={autoFocus}
        maxLength={maxLength}
        aria-invalid={bad || undefined}
        aria-describedby={hint || bad ? `${id}-msg` : undefined}
        className={inputClass(bad)}
        {...field}
      />
      <Message id={id} bad={bad} error={meta.error} hint={hint} />
    </div>
  );
}

export function Choice({ name, label, options, hint, onPick }: {
  name: string; label: string; options: readonly (readonly [string, string])[]; hint?: string; onPick?: (value: string) => void;
}) {
  const { field, meta, bad, id } = useFieldState(name);
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="text-sm font-semibold text-ink">{label}</label>
      <select
        id={id}
        aria-invalid={bad || undefined}
        aria-describedby={hint || bad ? `${id}-msg` : undefined}
        className={inputClass(bad)}
        {...field}
        onChange={onPick ? (e) => onPick(e.target.value) : field.onChange}
      >
        {options.map(([value, text]) => <option key={value} value={value}>{text}</option>)}
      </select>
      <Message id={id} bad={bad} error={meta.error} hint={hint} />
    </div>
  );
}

export function Section({ title, lead, children, step }: { title: string; lead?: string; children: React.ReactNode; step: number }) {
  return (
    <fieldset className="rounded-lg border border-steel-300 bg-paper-raised p-4">
      <legend className="px-1 text-base font-semibold">
        <span className="spec mr-2 text-ink-muted">{step}.</span>{title}
      </legend>
      {lead ? <p className="mb-3 text-sm text-ink-soft">{lead}</p> : null}
      <div className="grid grid-cols-1 gap-3 sm:grid-cols-2 lg:grid-cols-4">{children}</div>
    </fieldset>
  );
}
