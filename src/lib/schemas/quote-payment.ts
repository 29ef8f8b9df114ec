import { z } from 'zod';
import { VersionSchema } from './catalogue-cam';

// The balance: money taken at the counter, and the request that e-mails the pay-the-balance link.

export const COUNTER_PAYMENT_LIMITS = { amountCents: { min: 1, max: 100_000_000 } } as const;
export const COUNTER_METHODS = ['cash', 'card-present'] as const;

/** POST /api/quotes/[id]/payments: at most the balance due (checked against the quote, 422 on amountCents). */
export const CounterPaymentSchema = z.strictObject({
  version: VersionSchema,
  amountCents: z
    .number({
      error: (iss) =>
        iss.input === undefined ? 'amountCents is required' : 'amountCents must be a whole number of cents',
    })
    .int({ error: 'amountCents must be a whole number of cents' })
    .min(COUNTER_PAYMENT_LIMITS.amountCents.min, { error: 'amountCents must be at least 1' })
    .max(COUNTER_PAYMENT_LIMITS.amountCents.max, {
      error: `amountCents must be at most ${COUNTER_PAYMENT_LIMITS.amountCents.max}`,
    }),
  method: z.enum(COUNTER_METHODS, {
    error: "method must be 'cash' or 'card-present' (a card on the shop's own terminal)",
  }),
});

/** POST /api/quotes/[id]/balance-request */
export const BalanceRequestSchema = z.strictObject({ version: VersionSchema });
