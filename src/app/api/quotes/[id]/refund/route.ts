import { NextResponse } from 'next/server';
import { route } from '@/lib/http/route';
import { presentQuote } from '@/lib/quotes/present';
import { refundQuote } from '@/lib/quotes/refunds';
import { QuoteRefundSchema } from '@/lib/schemas/quote';

/**
 * Managers only: { version, amountCents, paymentId?, reason?, afterFullRefund? }. Refunds one paid payment
 * (the deposit when paymentId is left out, or a balance payment), at most what is left on it; the version
 * makes a double click or a second post refund once (409 for the other). When no money is held any more the
 * job is cancelled ('cancel', the default) or the quote reopened for a new payment ('reopen').
 */
export const POST = route(
  { permission: 'quotes.refund', ids: { id: 'quote' }, body: QuoteRefundSchema },
  async ({ user, ids, body }) => NextResponse.json(presentQuote(await refundQuote(ids.id, body, user), user)),
);
