import { startBalanceCheckout } from '@/lib/db/queries/balance';
import { checkoutResponse } from '../../checkout-response';

export const dynamic = 'force-dynamic';

type TokenParams = { params: Promise<{ token: string }> };

/**
 * The customer's "Pay the balance": the deposit checkout's rules for the rest of the money. A form post
 * gets a 303 to the payment page; a JSON caller gets { url, reused }; a quote with nothing to pay online 409.
 */
export async function POST(request: Request, context: TokenParams) {
  const { token } = await context.params;
  return checkoutResponse(request, await startBalanceCheckout(token));
}
