'use client';

import { useField } from 'formik';
import { CheckboxControl, NumberControl, SelectControl, TextAreaControl, TextControl, type Options } from './field';

// The field set bound to formik by name: the value, blur (touched) and the message come from formik; the
// look, the label, the hint and aria-describedby from field.tsx. A problem shows once the field was touched.
// Ids follow the name ("profile.engine.boreIn" → "f-profile-engine-boreIn"), so a 422's field names one box.

export const fieldId = (name: string) => `f-${name.replace(/\./g, '-')}`;

type Bound = {
  name: string;
  label: string;
  hint?: string;
  className?: string;
  /** The schema's messages are fragments ("required"): say the field's name before them ("e-mail required"). */
  namedErrors?: boolean;
};

function useBound<T>(name: string, label: string, namedErrors?: boolean) {
  const [field, meta, helpers] = useField<T>(name);
  const error = meta.touched && meta.error ? (namedErrors ? `${label.toLowerCase()} ${meta.error}` : meta.error) : null;
  return { field, error, helpers, id: fieldId(name) };
}

export function TextField({
  name,
  label,
  hint,
  className,
  namedErrors,
  type = 'text',
  autoComplete = 'off',
  autoFocus,
  maxLength,
}: Bound & { type?: string; autoComplete?: string; autoFocus?: boolean; maxLength?: number }) {
  const { field, error, id } = useBound<string>(name, label, namedErrors);
  return (
    <TextControl
      id={id}
      label={label}
      hint={hint}
      error={error}
      className={className}
      type={type}
      autoComplete={autoComplete}
      autoFocus={autoFocus}
      maxLength={maxLength}
      {...field}
      value={String(field.value ?? '')}
    />
  );
}

/** A number with its unit; without a hint, the allowed range is the hint ("3.5–4.6 in"). */
export function NumberField({
  name,
  label,
  unit,
  range,
  hint,
  decimals = true,
  className,
}: Bound & { unit: string; range?: { min: number; max: number }; decimals?: boolean }) {
  const { field, error, id } = useBound<string>(name, label);
  const shown = hint ?? (range ? `${range.min}–${range.max} ${unit}` : undefined);
  return (
    <NumberControl
      id={id}
      label={label}
      hint={shown}
      error={error}
      unit={unit}
      decimals={decimals}
      className={className}
      {...field}
      value={String(field.value ?? '')}
    />
  );
}

/** A choice from a list; `onPick` replaces formik's own change handler where one choice fills others in. */
export function SelectField({
  name,
  label,
  options,
  hint,
  onPick,
  className,
}: Bound & { options: Options; onPick?: (value: string) => void }) {
  const { field, error, id } = useBound<string>(name, label);
  return (
    <SelectControl
      id={id}
      label={label}
      hint={hint}
      error={error}
      options={options}
      className={className}
      {...field}
      value={String(field.value ?? '')}
      onChange={onPick ? (e) => onPick(e.target.value) : field.onChange}
    />
  );
}

export function TextAreaField({ name, label, hint, className, maxLength }: Bound & { maxLength?: number }) {
  const { field, error, id } = useBound<string>(name, label);
  return (
    <TextAreaControl
      id={id}
      label={label}
      hint={hint}
      error={error}
      className={className}
      maxLength={maxLength}
      {...field}
      value={String(field.value ?? '')}
    />
  );
}

export function CheckboxField({ name, label, hint, className }: Bound) {
  const { field, error, helpers, id } = useBound<boolean>(name, label);
  return (
    <CheckboxControl
      id={id}
      name={name}
      label={label}
      hint={hint}
      error={error}
      className={className}
      checked={Boolean(field.value)}
      onChange={(e) => void helpers.setValue(e.target.checked)}
      onBlur={field.onBlur}
    />
  );
}
