import { NextResponse } from 'next/server';
import { route } from '@/lib/http/route';
import { getQuote } from '@/lib/db/queries/quotes';
import { presentQuote } from '@/lib/quotes/present';
import { updateQuote } from '@/lib/quotes/drafting';
import { noQuoteWithId } from '@/lib/quotes/refusals';
import { QuotePatchSchema } from '@/lib/schemas/quote';

export const GET = route({ permission: 'quotes.read', ids: { id: 'quote' } }, async ({ user, ids }) => {
  const quote = await getQuote(ids.id);
  if (!quote) throw noQuoteWithId(ids.id);
  return NextResponse.json(presentQuote(quote, user));
});

/** { version, lines?, validUntil? } while the quote is a draft; a stale version answers 409. */
export const PATCH = route(
  { permission: 'quotes.write', ids: { id: 'quote' }, body: QuotePatchSchema },
  async ({ user, ids, body }) => NextResponse.json(presentQuote(await updateQuote(ids.id, body, user), user)),
);
