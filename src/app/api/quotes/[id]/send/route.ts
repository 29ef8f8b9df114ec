import { NextResponse } from 'next/server';
import { route } from '@/lib/http/route';
import { presentQuote } from '@/lib/quotes/present';
import { sendQuote } from '@/lib/quotes/sending';

/** E-mails the customer a fresh private link; status → sent. A refused e-mail changes nothing (502). */
export const POST = route({ permission: 'quotes.send', ids: { id: 'quote' } }, async ({ user, ids }) =>
  NextResponse.json(presentQuote(await sendQuote(ids.id, user), user)),
);
