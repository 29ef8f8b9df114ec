import { NextResponse } from 'next/server';
import { route } from '@/lib/http/route';
import { presentQuote } from '@/lib/db/queries/quotes';
import { refundQuote } from '@/lib/quotes/refunds';
import { QuoteRefundSchema } from '@/lib/schemas/quote';

/**
 * Managers only: { amountCents, reason?, afterFullRefund? }, at most what is paid and not yet refunded.
 * A full refund cancels the job ('cancel', the default) or reopens the quote for a new payment ('reopen').
 */
export const POST = route(
  { permission: 'quotes.refund', ids: { id: 'quote' }, body: QuoteRefundSchema },
  async ({ user, ids, body }) =>
    NextResponse.json(
      presentQuote(await refundQuote(ids.id, body.amountCents, body.reason, user, body.afterFullRefund), user),
    ),
);
