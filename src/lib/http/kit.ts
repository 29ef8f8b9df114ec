import { NextResponse } from 'next/server';
import type { z } from 'zod';
import { errorResponse, readJson, validationFailed } from '@/lib/http/responses';
import { formatZodIssues as fieldErrorsOf } from '@/lib/schemas/errors';
import type { WriteOutcome } from '@/lib/catalogue/versioned-write';

// Small pieces every catalogue route handler shares: ids from the path, query strings through zod,
// PATCH merging with the version check, and outcomes to status codes.

export type IdParams = { params: Promise<{ id: string }> };

export async function idFrom(context: IdParams, label = 'record'): Promise<number | NextResponse> {
  const { id } = await context.params;
  const n = Number(id);
  if (!/^\d{1,10}$/.test(id) || !Number.isSafeInteger(n) || n < 1) return errorResponse(404, `No ${label} with id ${id}.`);
  return n;
}

export function parseQuery<S extends z.ZodType>(request: Request, schema: S): { ok: true; value: z.output<S> } | { ok: false; response: NextResponse } {
  const params = Object.fromEntries(new URL(request.url).searchParams.entries());
  const parsed = schema.safeParse(params);
  if (!parsed.success) return { ok: false, response: validationFailed(parsed.error) };
  return { ok: true, value: parsed.data };
}

export async function parseBody<S extends z.ZodType>(request: Request, schema: S): Promise<{ ok: true; value: z.output<S> } | { ok: false; response: NextResponse }> {
  const body = await readJson(request);
  if (!body.ok) return body;
  const parsed = schema.safeParse(body.value);
  if (!parsed.success) return { ok: false, response: validationFailed(parsed.error) };
  return { ok: true, value: parsed.data };
}

/**
 * A PATCH body: `version` (and any control fields) plus the fields to change. The changes are laid over
 * the stored values and the whole record is validated again, so cross-field rules still hold.
 */
export async function parsePatch<C extends z.ZodObject, S extends z.ZodType>(
  request: Request,
  control: C,
  schema: S,
  current: Record<string, unknown>,
): Promise<{ ok: true; control: z.output<C>; values: z.output<S> } | { ok: false; response: NextResponse }> {
  const body = await readJson(request);
  if (!body.ok) return body;
  if (typeof body.value !== 'object' || body.value === null || Array.isArray(body.value)) {
    return { ok: false, response: validationFailed([{ field: '(body)', message: 'the body must be a JSON object' }]) };
  }
  const raw = body.value as Record<string, unknown>;
  const controlKeys = Object.keys(control.shape);
  const controlParsed = control.safeParse(Object.fromEntries(controlKeys.filter((k) => k in raw).map((k) => [k, raw[k]])));
  const changes = Object.fromEntries(Object.entries(raw).filter(([k]) => !controlKeys.includes(k)));
  const valuesParsed = schema.safeParse({ ...current, ...changes });
  const errors = [...(controlParsed.success ? [] : fieldErrorsOf(controlParsed.error)), ...(valuesParsed.success ? [] : fieldErrorsOf(valuesParsed.error))];
  if (errors.length || !controlParsed.success || !valuesParsed.success) return { ok: false, response: validationFailed(errors) };
  return { ok: true, control: controlParsed.data, values: valuesParsed.data };
}

/** Turns a write outcome into the answer: 200/201 with the record, 404, 409 with the current record, 422. */
export function outcomeResponse<R>(outcome: WriteOutcome<R>, options: { status?: number; label: string; present?: (r: R) => unknown }): NextResponse {
  const present = options.present ?? ((r: R) => r);
  if (outcome.ok) return NextResponse.json(present(outcome.record), { status: options.status ?? 200 });
  switch (outcome.reason) {
    case 'not-found':
      return errorResponse(404, `That ${options.label} no longer exists.`);
    case 'conflict':
      return errorResponse(409, `Someone else saved this ${options.label} after you opened it. Nothing was overwritten; review their changes and save again.`, {
        current: outcome.current === null ? null : present(outcome.current as R),
      });
    case 'invalid':
      return validationFailed(outcome.errors);
    case 'refused':
      return errorResponse(outcome.status, outcome.message);
  }
}

// Cost hiding lives in lib/auth/costs.ts (the `costs.read` permission). Forwarded here only for the
// route handlers that still import it from the kit; new code imports '@/lib/auth/costs'.
export { canSeeCosts, withoutCosts } from '@/lib/auth/costs';

export function paged<T>(items: T[], total: number, page: number, pageSize: number) {
  return { items, total, page, pageSize };
}
