import { setIn } from 'formik';
import * as yup from 'yup';
import { centsToText } from '@/lib/format';

// formik's checks in the browser, built with yup (formik's own pairing) from the limits the zod schemas
// export (CATALOGUE_CAM_LIMITS, LABOR_LIMITS, SETTINGS_LIMITS, …), so each limit is written once. They say
// at once what is out of range as someone types; the route handler still validates the body with zod and its
// 422 lands on the same fields. Messages follow the zod schemas' wording: "<label> must be at most 99.99 h".

export type Range = { readonly min: number; readonly max: number };

/** A blank box is "not given" (undefined), not zero or NaN. */
const blankIsMissing = (value: unknown, original: unknown) =>
  typeof original === 'string' && original.trim() === '' ? undefined : value;

/** A number typed as text: a range in `unit`, optionally whole, optionally required. */
export function numberWithin(
  label: string,
  unit: string,
  range?: Range,
  options: { integer?: boolean; required?: boolean } = {},
) {
  let schema = yup.number().transform(blankIsMissing).typeError(`${label} must be a number (${unit})`);
  if (range)
    schema = schema
      .min(range.min, `${label} must be at least ${range.min} ${unit}`)
      .max(range.max, `${label} must be at most ${range.max} ${unit}`);
  if (options.integer) schema = schema.integer(`${label} must be a whole number`);
  return options.required ? schema.required(`${label} is required (${unit})`) : schema.optional();
}

/** Dollars and cents typed as text ("129.50"), checked against a range kept in cents. */
export function moneyWithin(
  label: string,
  range: Range | undefined,
  toCents: (text: string) => number | null,
  options: { required?: boolean } = {},
) {
  let schema = yup
    .string()
    .test('money', `${label} must be dollars and cents, e.g. 129.50`, (v) => !v?.trim() || toCents(v) !== null);
  if (range) {
    schema = schema.test(
      'range',
      `${label} must be between $${centsToText(range.min)} and $${centsToText(range.max)}`,
      (v) => {
        const cents = v?.trim() ? toCents(v) : null;
        return cents === null || (cents >= range.min && cents <= range.max);
      },
    );
  }
  return options.required ? schema.test('required', `${label} is required`, (v) => Boolean(v?.trim())) : schema;
}

/** A percent typed as text ("8.25"), checked against a range kept in basis points. */
export function percentWithin(
  label: string,
  range: Range | undefined,
  toBp: (text: string) => number | null,
  options: { required?: boolean } = {},
) {
  let schema = yup
    .string()
    .test(
      'percent',
      `${label} must be a percent with at most two decimals, e.g. 8.25`,
      (v) => !v?.trim() || toBp(v) !== null,
    );
  if (range) {
    schema = schema.test('range', `${label} must be between ${range.min / 100} % and ${range.max / 100} %`, (v) => {
      const bp = v?.trim() ? toBp(v) : null;
      return bp === null || (bp >= range.min && bp <= range.max);
    });
  }
  return options.required ? schema.test('required', `${label} is required`, (v) => Boolean(v?.trim())) : schema;
}

/** Text with a length limit; required means not blank. */
export function textUpTo(label: string, maxLength?: number, options: { required?: boolean } = {}) {
  let schema = yup.string();
  if (maxLength !== undefined) schema = schema.max(maxLength, `${label} must be at most ${maxLength} characters`);
  return options.required ? schema.test('required', `${label} must not be empty`, (v) => Boolean(v?.trim())) : schema;
}

/**
 * formik's `validate` from a yup object: every failing field keeps its first message, keyed by its path written
 * the way zod and our 422s write it (`items.0.quantity`, not yup's `items[0].quantity`).
 */
export function validateWithYup<T extends object>(schema: yup.ObjectSchema<yup.AnyObject>) {
  return (values: T): Record<string, string> => {
    try {
      schema.validateSync(values, { abortEarly: false });
      return {};
    } catch (error) {
      if (!(error instanceof yup.ValidationError)) throw error;
      const errors: Record<string, string> = {};
      for (const issue of error.inner.length ? error.inner : [error]) errors[dottedPath(issue.path)] ??= issue.message;
      return errors;
    }
  };
}

/**
 * Flat field errors ({ 'items.0.quantity': … }) in formik's nested shape, for forms whose fields sit in lists. A
 * list's own message ("a rule must add at least one …") takes the list's place, as formik's FieldArray expects.
 */
export function nestFieldErrors(flat: Record<string, string>): Record<string, unknown> {
  let out: Record<string, unknown> = {};
  const byDepth = Object.entries(flat).sort(([a], [b]) => b.split('.').length - a.split('.').length);
  for (const [path, message] of byDepth) out = setIn(out, path, message);
  return out;
}

const dottedPath = (path: string | undefined) => (path ?? '').replace(/\[(\d+)\]/g, '.$1').replace(/^\./, '');

/** One of a fixed list (a select's options); the wording of the schemas' presence() messages. */
export function oneOfList(label: string, values: readonly string[]) {
  return yup
    .string()
    .defined(`${label} is required`)
    .oneOf([...values], `${label} must be one of: ${values.join(', ')}`);
}

/**
 * A cross-field rule on an object, reported on one of its fields (as a zod refine with `path` does). `check`
 * sees the object as typed and answers true when it holds; a value that fails its own check is left to that.
 */
export function fieldRule<T extends yup.AnyObject>(
  name: string,
  field: string,
  message: string | ((value: T) => string),
  check: (value: T) => boolean,
) {
  return {
    name,
    test(value: T | undefined, context: yup.TestContext) {
      if (!value || check(value)) return true;
      return context.createError({
        path: context.path ? `${context.path}.${field}` : field,
        message: typeof message === 'function' ? message(value) : message,
      });
    },
  };
}

/** A finite number (what the payload carries once a box was read); NaN and blanks are the field's own problem. */
export const isFiniteNumber = (v: unknown): v is number => typeof v === 'number' && Number.isFinite(v);
