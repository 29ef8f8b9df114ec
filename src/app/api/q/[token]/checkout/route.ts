import { NextResponse } from 'next/server';
import { startCheckout } from '@/lib/db/queries/deposits';
import { errorResponse } from '@/lib/http/responses';

export const dynamic = 'force-dynamic';

type TokenParams = { params: Promise<{ token: string }> };

/**
 * The customer's "Accept and pay the deposit" (no account: the private token is the key). A plain form
 * post gets a 303 to the payment page; a JSON caller gets { url, reused }. Any token that is not a live
 * link: 404. A quote that cannot be paid: 409 with its state; a form post is sent back to the page,
 * which says why.
 */
export async function POST(request: Request, context: TokenParams) {
  const { token } = await context.params;
  const outcome = await startCheckout(token);
  const wantsJson = (request.headers.get('accept') ?? '').includes('application/json');
  if (!outcome.ok) {
    if (wantsJson) return errorResponse(outcome.status, outcome.message, outcome.state ? { state: outcome.state } : {});
    return new NextResponse(`${outcome.message}\n`, { status: outcome.status, headers: { 'content-type': 'text/plain; charset=utf-8' } });
  }
  if (wantsJson) return NextResponse.json({ url: outcome.url, reused: outcome.reused });
  return NextResponse.redirect(outcome.url, 303);
}
