import { NextResponse } from 'next/server';
import { startCheckout } from '@/lib/db/queries/quotes';
import { errorResponse } from '@/lib/http/responses';

export const dynamic = 'force-dynamic';

type TokenParams = { params: Promise<{ token: string }> };

/**
 * The customer's "Accept and pay the deposit" (no account: the private token is the key). A plain form
 * post gets a 303 to the payment page; a JSON caller gets { url }. Any token that is not a live link: 404.
 */
export async function POST(request: Request, context: TokenParams) {
  const { token } = await context.params;
  const outcome = await startCheckout(token);
  const wantsJson = (request.headers.get('accept') ?? '').includes('application/json');
  if (!outcome.ok) {
    if (wantsJson) return errorResponse(outcome.status, outcome.message);
    return new NextResponse(`${outcome.message}\n`, { status: outcome.status, headers: { 'content-type': 'text/plain; charset=utf-8' } });
  }
  if (wantsJson) return NextResponse.json({ url: outcome.url });
  return NextResponse.redirect(outcome.url, 303);
}
