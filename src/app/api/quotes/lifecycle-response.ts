import { NextResponse } from 'next/server';
import type { SessionUser } from '@/lib/auth/guard';
import type { LifecycleOutcome } from '@/lib/db/queries/quote-lifecycle';
import { presentQuote } from '@/lib/db/queries/quotes';
import { errorResponse } from '@/lib/http/responses';

/** 200/201 with the quote; 404; 409 with where the quote stands (state) and the quote as it is now (current). */
export function lifecycleResponse(outcome: LifecycleOutcome, user: SessionUser, status = 200): NextResponse {
  if (outcome.ok) return NextResponse.json(presentQuote(outcome.record, user), { status });
  if (outcome.status === 404) return errorResponse(404, outcome.message);
  return errorResponse(409, outcome.message, { state: outcome.state, current: outcome.current ? presentQuote(outcome.current, user) : null });
}
