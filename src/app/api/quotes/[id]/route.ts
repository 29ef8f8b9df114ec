import { NextResponse } from 'next/server';
import { requireRole } from '@/lib/auth/guard';
import { idFrom, parseBody, type IdParams } from '@/lib/http/kit';
import { getQuote, presentQuote, updateQuote } from '@/lib/db/queries/quotes';
import { errorResponse } from '@/lib/http/responses';
import { QuotePatchSchema } from '@/lib/schemas/quote';
import { quoteOutcomeResponse } from '../outcome';

export const dynamic = 'force-dynamic';

export async function GET(request: Request, context: IdParams) {
  const user = await requireRole(request);
  if (user instanceof Response) return user;
  const id = await idFrom(context, 'quote');
  if (id instanceof Response) return id;
  const quote = await getQuote(id);
  if (!quote) return errorResponse(404, `No quote with id ${id}.`);
  return NextResponse.json(presentQuote(quote, user));
}

/** { version, lines?, validUntil? } while the quote is a draft; a stale version answers 409. */
export async function PATCH(request: Request, context: IdParams) {
  const user = await requireRole(request, 'manager', 'counter');
  if (user instanceof Response) return user;
  const id = await idFrom(context, 'quote');
  if (id instanceof Response) return id;
  const body = await parseBody(request, QuotePatchSchema);
  if (!body.ok) return body.response;
  return quoteOutcomeResponse(await updateQuote(id, body.value, user), { present: (r) => presentQuote(r, user) });
}
