'use client';

import { useField } from 'formik';

// Small form pieces for the staff screens: label above, message below, the state in words.
export function TextField({ name, label, type = 'text', autoComplete, hint, autoFocus, maxLength }: {
  name: string; label: string; type?: string; autoComplete?: string; hint?: string; autoFocus?: boolean; maxLength?: number;
}) {
  const [field, meta] = useField<string>(name);
  const showError = meta.touched && meta.error;
  const id = `field-${name}`;
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="text-sm font-semibold text-ink">{label}</label>
      <input
        id={id}
        type={type}
        autoComplete={autoComplete}
        autoFocus={autoFocus}
        maxLength={maxLength}
        aria-invalid={showError ? true : undefined}
        aria-describedby={showError ? `${id}-error` : hint ? `${id}-hint` : undefined}
        className={`rounded border bg-paper-raised px-3 py-2 text-ink ${showError ? 'border-fault-700' : 'border-steel-300'}`}
        {...field}
      />
      {hint && !showError ? <p id={`${id}-hint`} className="text-xs text-ink-muted">{hint}</p> : null}
      {showError ? <p id={`${id}-error`} className="text-xs text-fault-700">Problem: {label.toLowerCase()} {meta.error}</p> : null}
    </div>
  );
}

export function SubmitButton({ busy, children }: { busy: boolean; children: React.ReactNode }) {
  return (
    <button type="submit" disabled={busy} className="rounded bg-ember-500 px-4 py-2 font-semibold text-paper-raised hover:bg-ember-600 disabled:opacity-60">
      {busy ? 'Working…' : children}
    </button>
  );
}
