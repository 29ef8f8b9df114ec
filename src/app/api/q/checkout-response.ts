import { NextResponse } from 'next/server';
import type { CheckoutOutcome } from '@/lib/db/queries/deposits';
import { errorResponse } from '@/lib/http/responses';

/**
 * A customer's checkout (deposit or balance): a plain form post gets a 303 to the payment page, a JSON
 * caller { url, reused }. A refusal is the outcome's status with its words: JSON with the quote's state,
 * or plain text for a form post (the page itself says why when reloaded).
 */
export function checkoutResponse(request: Request, outcome: CheckoutOutcome): NextResponse {
  const wantsJson = (request.headers.get('accept') ?? '').includes('application/json');
  if (!outcome.ok) {
    if (wantsJson) return errorResponse(outcome.status, outcome.message, outcome.state ? { state: outcome.state } : {});
    return new NextResponse(`${outcome.message}\n`, { status: outcome.status, headers: { 'content-type': 'text/plain; charset=utf-8' } });
  }
  if (wantsJson) return NextResponse.json({ url: outcome.url, reused: outcome.reused });
  return NextResponse.redirect(outcome.url, 303);
}
