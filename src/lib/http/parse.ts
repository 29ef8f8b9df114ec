import type { z } from 'zod';
import { formatZodIssues } from '@/lib/schemas/errors';
import { invalidFields, readJsonBody } from './responses';

// Query strings and JSON bodies through zod, for the route kit: a failure throws the 4xx that names
// the fields, so a handler only ever sees valid input.

export function readQuery<S extends z.ZodType>(request: Request, schema: S): z.output<S> {
  const parsed = schema.safeParse(Object.fromEntries(new URL(request.url).searchParams.entries()));
  if (!parsed.success) throw invalidFields(parsed.error);
  return parsed.data;
}

export async function readBody<S extends z.ZodType>(
  request: Request,
  schema: S,
  limitBytes?: number,
): Promise<z.output<S>> {
  const parsed = schema.safeParse(await readJsonBody(request, limitBytes));
  if (!parsed.success) throw invalidFields(parsed.error);
  return parsed.data;
}

/**
 * A PATCH body: `version` (and any control fields) plus the fields to change. The changes are laid over
 * the stored values and the whole record is validated again, so cross-field rules still hold.
 */
export async function readPatch<C extends z.ZodObject, S extends z.ZodType>(
  request: Request,
  control: C,
  schema: S,
  current: Record<string, unknown>,
): Promise<{ control: z.output<C>; values: z.output<S> }> {
  const raw = await readJsonBody(request);
  if (typeof raw !== 'object' || raw === null || Array.isArray(raw))
    throw invalidFields([{ field: '(body)', message: 'the body must be a JSON object' }]);
  const body = raw as Record<string, unknown>;
  const controlKeys = Object.keys(control.shape);
  const controlParsed = control.safeParse(
    Object.fromEntries(controlKeys.filter((k) => k in body).map((k) => [k, body[k]])),
  );
  const changes = Object.fromEntries(Object.entries(body).filter(([k]) => !controlKeys.includes(k)));
  const valuesParsed = schema.safeParse({ ...current, ...changes });
  if (!controlParsed.success || !valuesParsed.success) {
    throw invalidFields([
      ...(controlParsed.success ? [] : formatZodIssues(controlParsed.error)),
      ...(valuesParsed.success ? [] : formatZodIssues(valuesParsed.error)),
    ]);
  }
  return { control: controlParsed.data, values: valuesParsed.data };
}
