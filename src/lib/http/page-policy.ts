// The Content-Security-Policy of every page, built at request time by src/proxy.ts because one part
// depends on where the app is deployed: the customer's "pay the deposit" form posts to the app, which
// answers 303 to the payment provider's hosted page, and form-action also governs that redirect.
// Pure: no Next or Node imports, so the proxy and unit tests can use it.

type Env = Record<string, string | undefined>;

// The real provider's hosted checkout (the SDK's documented host). Override with PAYMENTS_CHECKOUT_ORIGIN.
const HOSTED_CHECKOUT_ORIGIN = 'https://checkout.stripe.com';

function originOf(value: string): string | null {
  try {
    const url = new URL(value);
    return url.protocol === 'https:' || url.protocol === 'http:' ? url.origin : null;
  } catch {
    return null;
  }
}

/**
 * Where the deposit form may lead: PAYMENTS_CHECKOUT_ORIGIN when set; the local payments fake when
 * STRIPE_API_HOST points the SDK at it (it serves its pay page from the same address); else the real
 * provider's hosted checkout.
 */
export function paymentsCheckoutOrigin(env: Env = process.env): string {
  const configured = env.PAYMENTS_CHECKOUT_ORIGIN ? originOf(env.PAYMENTS_CHECKOUT_ORIGIN) : null;
  if (configured) return configured;
  if (env.STRIPE_API_HOST) {
    const protocol = env.STRIPE_API_PROTOCOL === 'http' ? 'http' : 'https';
    const port = env.STRIPE_API_PORT ? `:${env.STRIPE_API_PORT}` : '';
    const fake = originOf(`${protocol}://${env.STRIPE_API_HOST}${port}`);
    if (fake) return fake;
  }
  return HOSTED_CHECKOUT_ORIGIN;
}

/** 'unsafe-inline' for styles and scripts is what the App Router needs without a nonce pipeline. */
export function pageContentSecurityPolicy(env: Env = process.env): string {
  return [
    "default-src 'self'",
    "script-src 'self' 'unsafe-inline'",
    "style-src 'self' 'unsafe-inline'",
    "img-src 'self' data: blob:",
    "font-src 'self'",
    "connect-src 'self'",
    "frame-ancestors 'none'",
    `form-action 'self' ${paymentsCheckoutOrigin(env)}`,
    "base-uri 'self'",
    "object-src 'none'",
  ].join('; ');
}
