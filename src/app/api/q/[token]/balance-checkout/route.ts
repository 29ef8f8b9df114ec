import { route } from '@/lib/http/route';
import { startBalanceCheckout } from '@/lib/quotes/checkout';
import { checkoutResponse } from '../../checkout-response';

/**
 * The customer's "Pay the balance": the deposit checkout's rules for the rest of the money. A form post
 * gets a 303 to the payment page; a JSON caller gets { url, reused }; a quote with nothing to pay online 409.
 */
// allowCrossSite: the customer's page sends no referrer (its address holds the private token), so its
// own form posts arrive with `Origin: null`; the token is the key, and a checkout only leads to paying.
export const POST = route({ permission: 'public', allowCrossSite: true }, ({ request, params }) =>
  checkoutResponse(request, () => startBalanceCheckout(params.token)),
);
