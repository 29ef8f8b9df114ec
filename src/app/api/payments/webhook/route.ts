import { NextResponse } from 'next/server';
import type Stripe from 'stripe';
import { recordChargeRefunded, recordCheckoutCompleted } from '@/lib/db/queries/quotes';
import { errorResponse } from '@/lib/http/responses';
import { payments, webhookSecret } from '@/lib/payments';

export const dynamic = 'force-dynamic';

/**
 * The payment provider's events. The signature is checked over the raw body, exactly as sent; anything
 * unsigned or altered answers 400 and changes nothing. Effects are idempotent, so a redelivery is harmless.
 */
export async function POST(request: Request) {
  const raw = await request.text();
  const signature = request.headers.get('stripe-signature');
  if (!signature) return errorResponse(400, 'The Stripe-Signature header is missing.');
  let event: Stripe.Event;
  try {
    event = payments().webhooks.constructEvent(raw, signature, webhookSecret());
  } catch {
    return errorResponse(400, 'The webhook signature does not match the body.');
  }
  switch (event.type) {
    case 'checkout.session.completed':
      return NextResponse.json({ received: true, result: await recordCheckoutCompleted(event.data.object) });
    case 'charge.refunded':
      return NextResponse.json({ received: true, result: await recordChargeRefunded(event.data.object) });
    default:
      return NextResponse.json({ received: true, result: 'ignored' });
  }
}
