import { NextResponse } from 'next/server';
import type { SessionUser } from '@/lib/auth/guard';
import type { BalanceOutcome } from '@/lib/db/queries/balance';
import { presentQuote } from '@/lib/db/queries/quotes';
import { errorResponse } from '@/lib/http/responses';

/** The quote after a balance write; 404; 409 with the quote as it is now; 422 naming the field; 502. */
export function balanceResponse(outcome: BalanceOutcome, user: SessionUser, status = 200): NextResponse {
  if (outcome.ok) return NextResponse.json(presentQuote(outcome.record, user), { status });
  return errorResponse(outcome.status, outcome.message, {
    ...(outcome.errors ? { errors: outcome.errors } : {}),
    ...(outcome.current ? { current: presentQuote(outcome.current, user) } : {}),
  });
}
