import { z } from 'zod';
import { text } from './text';
import { presence } from './cam-card';
import { pageParams, VersionSchema } from './catalogue-cam';

// A shop customer as the counter records them. The limits match the customers table's columns.
export const CUSTOMER_LIMITS = {
  nameMaxLength: 120,
  emailMaxLength: 254,
  phoneMaxLength: 40,
  notesMaxLength: 2000,
} as const;

const L = CUSTOMER_LIMITS;

/** Optional text: blank (or null) is stored as NULL. */
function optionalText(label: string, maxLength: number, multiline = false) {
  return z.preprocess(
    (v) => (typeof v === 'string' && v.trim() === '' ? null : v),
    text(label, { multiline, error: `${label} must be text` })
      .max(maxLength, { error: `${label} must be at most ${maxLength} characters` })
      .nullish()
      .transform((v) => v ?? null),
  );
}

export const CustomerSchema = z.strictObject(
  {
    name: text('name', { error: presence('name', 'text') })
      .min(1, { error: 'name must not be empty' })
      .max(L.nameMaxLength, { error: `name must be at most ${L.nameMaxLength} characters` }),
    email: z.preprocess(
      (v) => (typeof v === 'string' && v.trim() === '' ? null : v),
      text('e-mail', { error: 'e-mail must be text' })
        .max(L.emailMaxLength, { error: `e-mail must be at most ${L.emailMaxLength} characters` })
        .pipe(z.email({ error: 'e-mail must look like name@example.com' }))
        .nullish()
        .transform((v) => v ?? null),
    ),
    phone: optionalText('phone', L.phoneMaxLength).refine((v) => v === null || /^[0-9+()./ -]+$/.test(v), {
      error: 'phone may hold only digits, spaces and + ( ) . / -',
    }),
    notes: optionalText('notes', L.notesMaxLength, true),
  },
  { error: presence('customer', 'an object') },
);

export type CustomerValues = z.output<typeof CustomerSchema>;
export type CustomerInput = z.input<typeof CustomerSchema>;
export const CUSTOMER_FIELDS = Object.keys(CustomerSchema.shape) as (keyof CustomerValues)[];

/** A PATCH carries the version the form loaded (optimistic locking) plus the fields to change. */
export const CustomerPatchControlSchema = z.object({ version: VersionSchema });

/** Query string of GET /api/customers: a search over name, e-mail and phone, paged. */
export const CustomerListQuerySchema = z.strictObject({
  q: pageParams.q,
  page: pageParams.page,
  pageSize: pageParams.pageSize,
});
export type CustomerListQuery = z.output<typeof CustomerListQuerySchema>;
