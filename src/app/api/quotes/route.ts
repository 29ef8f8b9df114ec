import { NextResponse } from 'next/server';
import { paged } from '@/lib/http/kit';
import { route } from '@/lib/http/route';
import { listQuotes } from '@/lib/db/queries/quote-list';
import { presentQuote } from '@/lib/quotes/present';
import { createQuoteFromBuild } from '@/lib/quotes/drafting';
import { QuoteCreateSchema } from '@/lib/schemas/quote';
import { QuoteListQuerySchema } from '@/lib/schemas/quote-list';

/**
 * Every staff member reads the list (it carries no costs), newest change first: ?status=, ?q= (number,
 * customer, vehicle), ?page= and ?pageSize= (default 50, at most 200). `items` as before, plus the paging.
 */
export const GET = route({ permission: 'quotes.read', query: QuoteListQuerySchema }, async ({ query }) => {
  const { items, total } = await listQuotes(query);
  return NextResponse.json(paged(items, total, query.page, query.pageSize));
});

/** A draft from { buildId, camId, extraLines? }; 403 naming each price only a manager may set. */
export const POST = route({ permission: 'quotes.write', body: QuoteCreateSchema }, async ({ user, body }) =>
  NextResponse.json(presentQuote(await createQuoteFromBuild(body, user), user), { status: 201 }),
);
