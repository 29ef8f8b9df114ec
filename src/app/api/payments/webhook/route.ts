import { NextResponse } from 'next/server';
import type Stripe from 'stripe';
import { BodyTooLarge, readLimitedBytes } from '@/lib/http/body-limit';
import { HttpError } from '@/lib/http/errors';
import { errorResponse } from '@/lib/http/responses';
import { route } from '@/lib/http/route';
import { payments, webhookSecret } from '@/lib/payments';
import { recordChargeRefunded, recordCheckoutCompleted } from '@/lib/quotes/payment-events';

const WEBHOOK_BODY_LIMIT_BYTES = 1024 * 1024;

/**
 * The payment provider's events. The signature is checked over the raw body, exactly as sent; anything
 * unsigned or altered answers 400 and changes nothing. Effects are idempotent, so a redelivery is harmless.
 * A refused session still answers 200: the provider would only repeat the same refusal for days.
 * Anything that could not be finished now answers 503, so the provider delivers the event again.
 * Public (the provider has no session) and server-to-server, so the cross-site check does not apply.
 */
export const POST = route({ permission: 'public', allowCrossSite: true }, async ({ request }) => {
  const signature = request.headers.get('stripe-signature');
  if (!signature) throw new HttpError(400, 'The Stripe-Signature header is missing.');
  // The provider's events are a few kilobytes; anything near the limit is not one of them.
  let raw: string;
  try {
    raw = new TextDecoder().decode(await readLimitedBytes(request, WEBHOOK_BODY_LIMIT_BYTES));
  } catch (error) {
    if (error instanceof BodyTooLarge) throw new HttpError(413, 'A webhook body is at most 1 MB.');
    throw new HttpError(400, 'The webhook body could not be read.');
  }
  let event: Stripe.Event;
  try {
    event = payments().webhooks.constructEvent(raw, signature, webhookSecret());
  } catch {
    throw new HttpError(400, 'The webhook signature does not match the body.');
  }
  try {
    switch (event.type) {
      case 'checkout.session.completed':
        return NextResponse.json({ received: true, ...(await recordCheckoutCompleted(event.data.object)) });
      case 'charge.refunded':
        return NextResponse.json({ received: true, ...(await recordChargeRefunded(event.data.object)) });
      default:
        return NextResponse.json({ received: true, result: 'ignored' });
    }
  } catch (error) {
    console.error(`[payments-webhook] ${event.type} ${event.id} not applied; asking for a redelivery`, error);
    return errorResponse(503, 'The event could not be applied just now; deliver it again.', {}, { 'Retry-After': '5' });
  }
});
