import { NextResponse } from 'next/server';
import { route } from '@/lib/http/route';
import { presentQuote } from '@/lib/quotes/present';
import { recordCounterPayment } from '@/lib/quotes/balance-collection';
import { CounterPaymentSchema } from '@/lib/schemas/quote-payment';

/**
 * Managers and counter staff: money taken at the counter towards the balance, { version, amountCents,
 * method: 'cash' | 'card-present' }. 201 with the quote (closed when nothing is left to pay).
 */
export const POST = route(
  { permission: 'quotes.take-payment', ids: { id: 'quote' }, body: CounterPaymentSchema },
  async ({ user, ids, body }) =>
    NextResponse.json(presentQuote(await recordCounterPayment(ids.id, body, user), user), { status: 201 }),
);
