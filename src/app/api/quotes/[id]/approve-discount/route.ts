import { NextResponse } from 'next/server';
import { route } from '@/lib/http/route';
import { presentQuote } from '@/lib/quotes/present';
import { approveDiscount } from '@/lib/quotes/approving';
import { QuoteApproveDiscountSchema } from '@/lib/schemas/quote';

/**
 * { version }: a manager approves a counter discount above the shop's limit, so the quote may be sent.
 * 409 when nothing waits for approval or the quote changed since the manager saw it.
 */
export const POST = route(
  { permission: 'quotes.approve-discount', ids: { id: 'quote' }, body: QuoteApproveDiscountSchema },
  async ({ user, ids, body }) => NextResponse.json(presentQuote(await approveDiscount(ids.id, body, user), user)),
);
