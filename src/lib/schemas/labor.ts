import { z } from 'zod';
import { text } from './text';
import { presence } from './cam-card';
import { flag, pageParams, skuSchema, VersionSchema } from './catalogue-cam';

export const LABOR_LIMITS = { hours: { min: 0.1, max: 99.99 }, nameMaxLength: 160, enginesMaxLength: 255 } as const;

// Which engines an operation applies to: "all", or a comma list of short words the shop uses
// (truck, car, 5.3, 6.2 …). Kept as plain words so the quote builder can match them to a build.
export const ENGINES_PATTERN = /^[a-z0-9.+-]+(\s*,\s*[a-z0-9.+-]+)*$/;

export const LaborSchema = z.strictObject(
  {
    code: skuSchema('code'),
    name: text('name', { error: presence('name', 'text') })
      .min(1, { error: 'name must not be empty' })
      .max(LABOR_LIMITS.nameMaxLength, { error: `name must be at most ${LABOR_LIMITS.nameMaxLength} characters` }),
    hours: z
      .number({ error: (iss) => (iss.input === undefined ? 'hours is required (h)' : 'hours must be a number (h)') })
      .min(LABOR_LIMITS.hours.min, { error: `hours must be at least ${LABOR_LIMITS.hours.min} h` })
      .max(LABOR_LIMITS.hours.max, { error: `hours must be at most ${LABOR_LIMITS.hours.max} h` })
      .refine((h) => Math.abs(h * 100 - Math.round(h * 100)) < 1e-6, { error: 'hours may have at most two decimals' }),
    engines: text('engines', { error: 'engines must be text' })
      .toLowerCase()
      .max(LABOR_LIMITS.enginesMaxLength, {
        error: `engines must be at most ${LABOR_LIMITS.enginesMaxLength} characters`,
      })
      .nullish()
      .transform((v) => (v ? v : 'all'))
      .refine((v) => ENGINES_PATTERN.test(v), {
        error: 'engines must be "all" or a comma list of short words (truck, car, 5.3)',
      })
      .transform((v) => v.split(/\s*,\s*/).join(', ')),
    active: flag('active', true),
  },
  { error: presence('labour operation', 'an object') },
);
export type LaborInput = z.input<typeof LaborSchema>;
export type LaborValues = z.output<typeof LaborSchema>;
export const LABOR_FIELDS = Object.keys(LaborSchema.shape) as (keyof LaborValues)[];

export const LaborPatchControlSchema = z.object({ version: VersionSchema });

export const LABOR_SORTS = ['code', 'name', 'hours', 'updatedAt'] as const;
export const LaborListQuerySchema = z.strictObject({
  ...pageParams,
  sort: z
    .enum(LABOR_SORTS, { error: `sort must be one of: ${LABOR_SORTS.join(', ')}` })
    .optional()
    .transform((v) => v ?? 'code'),
  active: z
    .enum(['true', 'false', 'all', ''], { error: 'active must be true, false or all' })
    .optional()
    .transform((v) => (v === 'true' ? true : v === 'false' ? false : undefined)),
});
export type LaborListQuery = z.output<typeof LaborListQuerySchema>;
