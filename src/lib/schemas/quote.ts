import { z } from 'zod';
import { text } from './text';
import { QUOTE_LINE_KIND_LIST } from '@/lib/quotes/pricing';
import { VersionSchema } from './catalogue-cam';
import { QUOTE_STATE_LIST as QUOTE_STATUSES } from '@/lib/quotes/lifecycle';

export const QUOTE_LIMITS = {
  descriptionMaxLength: 255,
  quantity: { min: 0.01, max: 9999.99 },
  unitPriceCents: { min: 0, max: 100_000_000 },
  lines: 60,
  refundCents: { min: 1, max: 100_000_000 },
} as const;

const id = (label: string) =>
  z
    .number({ error: `${label} must be a whole number` })
    .int({ error: `${label} must be a whole number` })
    .positive({ error: `${label} must be a whole number` });

const twoDecimals = (n: number) => Math.abs(Math.round(n * 100) - n * 100) < 1e-6;

/**
 * One quote line as staff type it. A line that names a part or labour operation may leave out the
 * description and price (and, for labour, the quantity): the server fills them in from the catalogue
 * and the shop's labour rate.
 */
export const QuoteLineInputSchema = z.strictObject({
  kind: z.enum(QUOTE_LINE_KIND_LIST, { error: `kind must be one of: ${QUOTE_LINE_KIND_LIST.join(', ')}` }),
  description: text('description', { error: 'description must be text' })
    .min(1, { error: 'description must not be empty' })
    .max(QUOTE_LIMITS.descriptionMaxLength, {
      error: `description must be at most ${QUOTE_LIMITS.descriptionMaxLength} characters`,
    })
    .optional(),
  quantity: z
    .number({ error: 'quantity must be a number' })
    .min(QUOTE_LIMITS.quantity.min, { error: `quantity must be at least ${QUOTE_LIMITS.quantity.min}` })
    .max(QUOTE_LIMITS.quantity.max, { error: `quantity must be at most ${QUOTE_LIMITS.quantity.max}` })
    .refine(twoDecimals, { error: 'quantity may have at most two decimals' })
    .optional(),
  unitPriceCents: z
    .number({ error: 'unitPriceCents must be a whole number of cents' })
    .int({ error: 'unitPriceCents must be a whole number of cents' })
    .min(QUOTE_LIMITS.unitPriceCents.min, { error: 'unitPriceCents must not be negative' })
    .max(QUOTE_LIMITS.unitPriceCents.max, {
      error: `unitPriceCents must be at most ${QUOTE_LIMITS.unitPriceCents.max}`,
    })
    .optional(),
  /** Taken off this line before tax; how much counter staff may give is checked on the server (src/lib/quotes/authority.ts). */
  discountCents: z
    .number({ error: 'discountCents must be a whole number of cents' })
    .int({ error: 'discountCents must be a whole number of cents' })
    .min(0, { error: 'discountCents must not be negative' })
    .max(QUOTE_LIMITS.unitPriceCents.max, { error: `discountCents must be at most ${QUOTE_LIMITS.unitPriceCents.max}` })
    .optional(),
  camId: id('camId').nullish(),
  partId: id('partId').nullish(),
  laborOperationId: id('laborOperationId').nullish(),
});
export type QuoteLineInput = z.output<typeof QuoteLineInputSchema>;

const lines = z
  .array(QuoteLineInputSchema, { error: 'lines must be a list' })
  .max(QUOTE_LIMITS.lines, { error: `at most ${QUOTE_LIMITS.lines} lines` });

export const QuoteCreateSchema = z.strictObject({
  buildId: id('buildId'),
  camId: id('camId'),
  extraLines: lines.optional(),
});

export const QuotePatchSchema = z.strictObject({
  version: VersionSchema,
  lines: lines.min(1, { error: 'a quote needs at least one line' }).optional(),
  validUntil: z.iso.date({ error: 'validUntil must be a date (YYYY-MM-DD)' }).nullable().optional(),
});

/** A refund of one payment: the quote's version as loaded (a double click refunds once), which payment (default: the deposit). */
export const QuoteRefundSchema = z.strictObject({
  version: VersionSchema,
  paymentId: id('paymentId').optional(),
  afterFullRefund: z
    .enum(['cancel', 'reopen'], {
      error: "afterFullRefund must be 'cancel' (the job is cancelled) or 'reopen' (the quote can be paid again)",
    })
    .optional(),
  amountCents: z
    .number({
      error: (iss) =>
        iss.input === undefined ? 'amountCents is required' : 'amountCents must be a whole number of cents',
    })
    .int({ error: 'amountCents must be a whole number of cents' })
    .min(QUOTE_LIMITS.refundCents.min, { error: 'amountCents must be at least 1' })
    .max(QUOTE_LIMITS.refundCents.max, { error: `amountCents must be at most ${QUOTE_LIMITS.refundCents.max}` }),
  reason: text('reason', { error: 'reason must be text' })
    .max(255, { error: 'reason must be at most 255 characters' })
    .optional(),
});

/** A staff move through the lifecycle; which moves are legal is decided by src/lib/quotes/lifecycle.ts (409). */
export const QuoteTransitionSchema = z.strictObject({
  to: z.enum(QUOTE_STATUSES, { error: `to must be one of: ${QUOTE_STATUSES.join(', ')}` }),
  version: VersionSchema,
  reason: text('reason', { error: 'reason must be text' })
    .max(255, { error: 'reason must be at most 255 characters' })
    .optional(),
});

export const QuoteReviseSchema = z.strictObject({ version: VersionSchema });

/** { version }: the manager approves the discount of the quote as they saw it (a newer save answers 409). */
export const QuoteApproveDiscountSchema = z.strictObject({ version: VersionSchema });
