import { NextResponse } from 'next/server';
import { errorResponse, validationFailed } from '@/lib/http/responses';
import type { WriteOutcome } from '@/lib/db/write';

// Write outcomes to status codes and the paged list shape, for every route handler (the route kit,
// lib/http/route.ts, reads ids, queries and bodies).

/** Turns a write outcome into the answer: 200/201 with the record, 404, 409 with the current record, 422. */
export function outcomeResponse<R>(
  outcome: WriteOutcome<R>,
  options: { status?: number; label: string; present?: (r: R) => unknown },
): NextResponse {
  const present = options.present ?? ((r: R) => r);
  if (outcome.ok) return NextResponse.json(present(outcome.record), { status: options.status ?? 200 });
  switch (outcome.reason) {
    case 'not-found':
      return errorResponse(404, `That ${options.label} no longer exists.`);
    case 'conflict':
      return errorResponse(
        409,
        `Someone else saved this ${options.label} after you opened it. Nothing was overwritten; review their changes and save again.`,
        {
          current: outcome.current === null ? null : present(outcome.current as R),
        },
      );
    case 'invalid':
      return validationFailed(outcome.errors);
    case 'refused':
      return errorResponse(outcome.status, outcome.message);
  }
}

export function paged<T>(items: T[], total: number, page: number, pageSize: number) {
  return { items, total, page, pageSize };
}
