'use client';

import { useField } from 'formik';

// Boxes for the dyno form: the label above, the unit beside the number, the range or the reason below,
// and a problem in words (never colour alone). Explicit ids so labels, hints and errors are linked.

export function FieldProblem({ id, error }: { id: string; error?: string }) {
  return error ? (
    <span id={id} className="text-xs text-fault-700">
      <span className="font-semibold">Problem:</span> {error}
    </span>
  ) : null;
}

export function NumberBox({
  name,
  label,
  unit,
  min,
  max,
  step = 'any',
  hint,
}: {
  name: string;
  label: string;
  unit: string;
  min: number;
  max: number;
  step?: string;
  hint?: string;
}) {
  const [field, meta] = useField<number | ''>(name);
  const id = `dyno-${name}`;
  const error = meta.touched ? meta.error : undefined;
  return (
    <div className="flex flex-col gap-1 text-sm">
      <label htmlFor={id} className="font-semibold">
        {label}
      </label>
      <span className="flex items-center gap-1">
        <input
          {...field}
          value={field.value ?? ''}
          id={id}
          type="number"
          inputMode="decimal"
          min={min}
          max={max}
          step={step}
          aria-invalid={error ? true : undefined}
          aria-describedby={`${id}-hint${error ? ` ${id}-error` : ''}`}
          className={`spec w-28 rounded border bg-paper-raised px-2 py-1 ${error ? 'border-fault-700' : 'border-steel-300'}`}
        />
        <span className="text-ink-muted">{unit}</span>
      </span>
      <span id={`${id}-hint`} className="text-xs text-ink-muted">
        {min}–{max} {unit}
        {hint ? ` · ${hint}` : ''}
      </span>
      <FieldProblem id={`${id}-error`} error={error} />
    </div>
  );
}
