import type { FormikErrors } from 'formik';
import type { z } from 'zod';

// Lets a formik form validate with the same zod schema the route handler uses, so the limits and
// messages are written once (src/lib/schemas/*).
export function zodValidate<T extends object>(schema: z.ZodType): (values: T) => FormikErrors<T> {
  return (values: T) => {
    const result = schema.safeParse(values);
    if (result.success) return {};
    const errors: Record<string, string> = {};
    for (const issue of result.error.issues) {
      const field = issue.path.map(String).join('.') || '(body)';
      errors[field] ??= issue.message;
    }
    return errors as FormikErrors<T>;
  };
}

export type ApiAnswer = { status: number; body: { message?: string; errors?: { field: string; message: string }[]; [key: string]: unknown } };

/** Sends JSON to one of our route handlers and reads the answer, never throwing on a 4xx. */
export async function sendJson(url: string, method: 'POST' | 'PATCH', payload: unknown): Promise<ApiAnswer> {
  try {
    const response = await fetch(url, { method, headers: { 'Content-Type': 'application/json' }, body: JSON.stringify(payload), credentials: 'same-origin' });
    const body = await response.json().catch(() => ({}));
    return { status: response.status, body };
  } catch {
    return { status: 0, body: { message: 'No answer from the server. Check the connection and try again.' } };
  }
}

/** Field errors from a 422 answer in formik's shape. */
export function fieldErrors<T>(answer: ApiAnswer): FormikErrors<T> {
  const out: Record<string, string> = {};
  for (const error of answer.body.errors ?? []) out[error.field] ??= error.message;
  return out as FormikErrors<T>;
}
