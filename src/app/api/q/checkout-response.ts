import { NextResponse } from 'next/server';
import { HttpError } from '@/lib/http/errors';
import type { CheckoutStarted } from '@/lib/quotes/types';

/**
 * A customer's checkout (deposit or balance): a plain form post gets a 303 to the payment page, a JSON
 * caller { url, reused }. A refusal keeps its status: JSON callers get the route kit's answer (with the
 * quote's state), a form post plain words (the page itself says why when reloaded).
 */
export async function checkoutResponse(request: Request, start: () => Promise<CheckoutStarted>): Promise<NextResponse> {
  const wantsJson = (request.headers.get('accept') ?? '').includes('application/json');
  let started: CheckoutStarted;
  try {
    started = await start();
  } catch (error) {
    if (wantsJson || !(error instanceof HttpError)) throw error;
    return new NextResponse(`${error.message}\n`, {
      status: error.status,
      headers: { 'content-type': 'text/plain; charset=utf-8' },
    });
  }
  if (wantsJson) return NextResponse.json({ url: started.url, reused: started.reused });
  return NextResponse.redirect(started.url, 303);
}
