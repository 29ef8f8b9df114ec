import { NextResponse } from 'next/server';
import type { z } from 'zod';
import { errorResponse, readJson, validationFailed } from '@/lib/http/responses';
import type { WriteOutcome } from '@/lib/catalogue/versioned-write';

// Write outcomes to status codes and the paged list shape, for every route handler. idFrom, parseQuery
// and parseBody are the older answer-returning forms, kept until the quotes, reports and users handlers
// move to the route kit (lib/http/route.ts), which throws instead.

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

export function paged<T>(items: T[], total: number, page: number, pageSize: number) {
  return { items, total, page, pageSize };
}
