import { NextResponse } from 'next/server';
import { route } from '@/lib/http/route';
import { presentQuote } from '@/lib/quotes/present';
import { transitionQuote } from '@/lib/quotes/transitions';
import { QuoteTransitionSchema } from '@/lib/schemas/quote';

/**
 * { to, version, reason? }: accepted, declined, expired, cancelled, closed (balance paid). A move the
 * lifecycle does not allow, or one that belongs to another flow (sending, paying, refunding, revising),
 * answers 409 with the current state and the moves allowed from it.
 */
export const POST = route(
  { permission: 'quotes.write', ids: { id: 'quote' }, body: QuoteTransitionSchema },
  async ({ user, ids, body }) => NextResponse.json(presentQuote(await transitionQuote(ids.id, body, user), user)),
);
