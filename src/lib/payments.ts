import 'server-only';
import Stripe from 'stripe';
import { requireEnv } from './env';

// The one payments client. STRIPE_API_HOST/PORT/PROTOCOL point the official SDK at the local fake
// (docker-local/payments-fake); leave them unset to talk to the real service.
let client: Stripe | undefined;

export function payments(): Stripe {
  if (!client) {
    const protocol = process.env.STRIPE_API_PROTOCOL === 'http' ? 'http' : 'https';
    client = new Stripe(requireEnv('STRIPE_SECRET_KEY'), {
      ...(process.env.STRIPE_API_HOST ? { host: process.env.STRIPE_API_HOST } : {}),
      ...(process.env.STRIPE_API_PORT ? { port: Number(process.env.STRIPE_API_PORT) } : {}),
      protocol,
      maxNetworkRetries: 1,
      timeout: 10_000,
    });
  }
  return client;
}

export function webhookSecret(): string {
  return requireEnv('STRIPE_WEBHOOK_SECRET');
}
