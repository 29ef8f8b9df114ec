import { NextResponse } from 'next/server';
import { route } from '@/lib/http/route';
import { presentQuote } from '@/lib/quotes/present';
import { requestBalance } from '@/lib/quotes/balance-collection';
import { BalanceRequestSchema } from '@/lib/schemas/quote-payment';

/** Managers and counter staff: e-mail the customer the balance due and a private link to pay it online. */
export const POST = route(
  { permission: 'quotes.take-payment', ids: { id: 'quote' }, body: BalanceRequestSchema },
  async ({ user, ids, body }) => NextResponse.json(presentQuote(await requestBalance(ids.id, body, user), user)),
);
