import { NextResponse } from 'next/server';
import { route } from '@/lib/http/route';
import { presentQuote } from '@/lib/quotes/present';
import { reviseQuote } from '@/lib/quotes/transitions';
import { QuoteReviseSchema } from '@/lib/schemas/quote';

/** { version }: a new draft revision (-R2, -R3, ...) of an unpaid quote; answers 201 with the new draft. */
export const POST = route(
  { permission: 'quotes.write', ids: { id: 'quote' }, body: QuoteReviseSchema },
  async ({ user, ids, body }) =>
    NextResponse.json(presentQuote(await reviseQuote(ids.id, body, user), user), { status: 201 }),
);
