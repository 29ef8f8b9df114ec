import { startCheckout } from '@/lib/db/queries/deposits';
import { checkoutResponse } from '../../checkout-response';

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
  return checkoutResponse(request, await startCheckout(token));
}
