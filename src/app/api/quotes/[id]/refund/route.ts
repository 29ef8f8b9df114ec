import { NextResponse } from 'next/server';
import { requireRole } from '@/lib/auth/guard';
import { idFrom, parseBody, type IdParams } from '@/lib/http/kit';
import { presentQuote, refundQuote } from '@/lib/db/queries/quotes';
import { errorResponse } from '@/lib/http/responses';
import { QuoteRefundSchema } from '@/lib/schemas/quote';

export const dynamic = 'force-dynamic';

/**
 * Managers only: { amountCents, reason?, afterFullRefund? }, at most what is paid and not yet refunded.
 * A full refund cancels the job ('cancel', the default) or reopens the quote for a new payment ('reopen').
 */
export async function POST(request: Request, context: IdParams) {
  const user = await requireRole(request, 'manager');
  if (user instanceof Response) return user;
  const id = await idFrom(context, 'quote');
  if (id instanceof Response) return id;
  const body = await parseBody(request, QuoteRefundSchema);
  if (!body.ok) return body.response;
  const outcome = await refundQuote(id, body.value.amountCents, body.value.reason, user, body.value.afterFullRefund);
  if (!outcome.ok) return errorResponse(outcome.status, outcome.message, outcome.errors ? { errors: outcome.errors } : {});
  return NextResponse.json(presentQuote(outcome.record, user));
}
