import { z } from 'zod';
import { text } from './text';
import {
  CATALOGUE_CAM_LIMITS,
  flag,
  optionalText,
  pageParams,
  skuSchema,
  supplierIdSchema,
  VersionSchema,
  wholeCents,
  wholeCount,
} from './catalogue-cam';
import { presence } from './cam-card';

export const PART_CATEGORY_LIST = [
  'springs',
  'pushrods',
  'lifters',
  'deactivation-delete',
  'timing',
  'gaskets',
  'converter',
  'tune',
  'hardware',
  'other',
] as const;

export const PART_LIMITS = { nameMaxLength: 160, specKeys: 20, specKeyMaxLength: 40, specTextMaxLength: 200 } as const;

// Free-form spec values a supplier prints (max lift, seat pressure, stall speed): short text, numbers or flags.
const specValue = z.union(
  [z.number().finite(), text('spec value', { trim: false }).max(PART_LIMITS.specTextMaxLength), z.boolean()],
  {
    error: `each spec value must be a number, true/false or text up to ${PART_LIMITS.specTextMaxLength} characters`,
  },
);

export const PartSchema = z.strictObject(
  {
    sku: skuSchema(),
    name: text('name', { error: presence('name', 'text') })
      .min(1, { error: 'name must not be empty' })
      .max(PART_LIMITS.nameMaxLength, { error: `name must be at most ${PART_LIMITS.nameMaxLength} characters` }),
    category: z.enum(PART_CATEGORY_LIST, { error: presence('category', `one of: ${PART_CATEGORY_LIST.join(', ')}`) }),
    supplierId: supplierIdSchema,
    priceCents: wholeCents('price'),
    costCents: wholeCents('cost')
      .nullish()
      .transform((v) => v ?? 0),
    stockOnHand: wholeCount('stock on hand', 'units', CATALOGUE_CAM_LIMITS.stockOnHand)
      .nullish()
      .transform((v) => v ?? 0),
    spec: z
      .record(
        text('spec name', { trim: false })
          .min(1)
          .max(PART_LIMITS.specKeyMaxLength, {
            error: `spec names must be at most ${PART_LIMITS.specKeyMaxLength} characters`,
          }),
        specValue,
        {
          error: 'spec must be an object of name → value',
        },
      )
      .refine((r) => Object.keys(r).length <= PART_LIMITS.specKeys, {
        error: `spec may hold at most ${PART_LIMITS.specKeys} entries`,
      })
      .nullish()
      .transform((v) => (v && Object.keys(v).length ? v : null)),
    active: flag('active', true),
    notes: optionalText('notes', CATALOGUE_CAM_LIMITS.notesMaxLength),
  },
  { error: presence('part', 'an object') },
);
export type PartInput = z.input<typeof PartSchema>;
export type PartValues = z.output<typeof PartSchema>;
export const PART_FIELDS = Object.keys(PartSchema.shape) as (keyof PartValues)[];

export const PartPatchControlSchema = z.object({ version: VersionSchema });

export const PART_SORTS = ['sku', 'name', 'category', 'priceCents', 'stockOnHand', 'updatedAt'] as const;

export const PartListQuerySchema = z.strictObject({
  ...pageParams,
  sort: z
    .enum(PART_SORTS, { error: `sort must be one of: ${PART_SORTS.join(', ')}` })
    .optional()
    .transform((v) => v ?? 'sku'),
  category: z
    .enum(PART_CATEGORY_LIST, { error: `category must be one of: ${PART_CATEGORY_LIST.join(', ')}` })
    .optional(),
  active: z
    .enum(['true', 'false', 'all', ''], { error: 'active must be true, false or all' })
    .optional()
    .transform((v) => (v === 'true' ? true : v === 'false' ? false : undefined)),
  inStock: z
    .enum(['true', 'false', 'all', ''], { error: 'inStock must be true, false or all' })
    .optional()
    .transform((v) => (v === 'true' ? true : v === 'false' ? false : undefined)),
});
export type PartListQuery = z.output<typeof PartListQuerySchema>;
