import { NextResponse } from 'next/server';
import { requireRole } from '@/lib/auth/guard';
import { parseBody } from '@/lib/catalogue/http';
import { createQuoteFromBuild, listQuotes, presentQuote } from '@/lib/db/queries/quotes';
import { QUOTE_STATUSES, type QuoteStatus } from '@/lib/db/models/quote';
import { validationFailed } from '@/lib/http/responses';
import { QuoteCreateSchema } from '@/lib/schemas/quote';
import { quoteOutcomeResponse } from './outcome';

export const dynamic = 'force-dynamic';

/** Every staff member reads the list (it carries no costs); ?status= narrows it. */
export async function GET(request: Request) {
  const user = await requireRole(request);
  if (user instanceof Response) return user;
  const status = new URL(request.url).searchParams.get('status');
  if (status !== null && !(QUOTE_STATUSES as readonly string[]).includes(status)) {
    return validationFailed([{ field: 'status', message: `status must be one of: ${QUOTE_STATUSES.join(', ')}` }]);
  }
  return NextResponse.json({ items: await listQuotes({ status: (status as QuoteStatus | null) ?? undefined }) });
}

/** A draft from { buildId, camId, extraLines? }: managers and counter staff. */
export async function POST(request: Request) {
  const user = await requireRole(request, 'manager', 'counter');
  if (user instanceof Response) return user;
  const body = await parseBody(request, QuoteCreateSchema);
  if (!body.ok) return body.response;
  return quoteOutcomeResponse(await createQuoteFromBuild(body.value, user), { status: 201, present: (r) => presentQuote(r, user) });
}
