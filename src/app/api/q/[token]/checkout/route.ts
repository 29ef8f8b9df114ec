import { route } from '@/lib/http/route';
import { startCheckout } from '@/lib/quotes/checkout';
import { checkoutResponse } from '../../checkout-response';

/**
 * The customer's "Accept and pay the deposit" (no account: the private token is the key). A plain form
 * post gets a 303 to the payment page; a JSON caller gets { url, reused }. Any token that is not a live
 * link: 404. A quote that cannot be paid: 409 with its state; a form post is sent back to the page,
 * which says why.
 */
// allowCrossSite: the customer's page sends no referrer (its address holds the private token), so its
// own form posts arrive with `Origin: null`; the token is the key, and a checkout only leads to paying.
export const POST = route({ permission: 'public', allowCrossSite: true }, ({ request, params }) =>
  checkoutResponse(request, () => startCheckout(params.token)),
);
