import { NextResponse } from 'next/server';
import { requireRole } from '@/lib/auth/guard';
import { paged, parseBody, parseQuery } from '@/lib/http/kit';
import { listQuotes } from '@/lib/db/queries/quote-list';
import { createQuoteFromBuild, presentQuote } from '@/lib/db/queries/quotes';
import { QuoteCreateSchema } from '@/lib/schemas/quote';
import { QuoteListQuerySchema } from '@/lib/schemas/quote-list';
import { quoteOutcomeResponse } from './outcome';

export const dynamic = 'force-dynamic';

/**
 * Every staff member reads the list (it carries no costs), newest change first: ?status=, ?q= (number,
 * customer, vehicle), ?page= and ?pageSize= (default 50, at most 200). `items` as before, plus the paging.
 */
export async function GET(request: Request) {
  const user = await requireRole(request);
  if (user instanceof Response) return user;
  const query = parseQuery(request, QuoteListQuerySchema);
  if (!query.ok) return query.response;
  const { items, total } = await listQuotes(query.value);
  return NextResponse.json(paged(items, total, query.value.page, query.value.pageSize));
}

/** A draft from { buildId, camId, extraLines? }: managers and counter staff. */
export async function POST(request: Request) {
  const user = await requireRole(request, 'manager', 'counter');
  if (user instanceof Response) return user;
  const body = await parseBody(request, QuoteCreateSchema);
  if (!body.ok) return body.response;
  return quoteOutcomeResponse(await createQuoteFromBuild(body.value, user), { status: 201, present: (r) => presentQuote(r, user) });
}
