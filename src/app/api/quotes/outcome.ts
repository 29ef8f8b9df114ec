import type { NextResponse } from 'next/server';
import { outcomeResponse } from '@/lib/http/kit';
import type { QuoteRecord, QuoteWriteOutcome } from '@/lib/db/queries/quotes';
import { errorResponse } from '@/lib/http/responses';

/** A quote write's answer: the shared 404/409/422 shapes, plus 403 naming each field only a manager may set. */
export function quoteOutcomeResponse(outcome: QuoteWriteOutcome, options: { status?: number; present: (r: QuoteRecord) => unknown }): NextResponse {
  if (!outcome.ok && outcome.reason === 'forbidden') {
    return errorResponse(403, 'Only a manager may set these prices, kinds or discounts.', { errors: outcome.errors });
  }
  return outcomeResponse(outcome, { ...options, label: 'quote' });
}
