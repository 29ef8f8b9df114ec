import { z } from 'zod';
import { text } from './text';
import { boundedNumber, CAM_LIMITS, CamCardSchema, presence } from './cam-card';

// A cam as the shop keeps it: the supplier's card (the advisor's CamCardSchema fields, reused as they
// are, so the catalogue can never hold a card the advisor would refuse) plus what the shop needs to sell it.
// Shared by the server (route handlers, the CSV import) and the formik form in the browser.
export const CATALOGUE_CAM_LIMITS = {
  ...CAM_LIMITS,
  skuMaxLength: 40,
  costCents: CAM_LIMITS.priceCents,
  stockOnHand: { min: 0, max: 100_000 },
  baselineForLiters: { min: 2, max: 9.9 },
  notesMaxLength: 4000,
} as const;

const L = CATALOGUE_CAM_LIMITS;
const card = CamCardSchema.shape;

/** A shop SKU: letters, digits and . _ - / (no spaces), as printed on the shelf label. */
export function skuSchema(label = 'SKU', maxLength = L.skuMaxLength) {
  return text(label, { error: presence(label, 'text') })
    .min(1, { error: `${label} must not be empty` })
    .max(maxLength, { error: `${label} must be at most ${maxLength} characters` })
    .refine((v) => v === '' || /^[A-Za-z0-9][A-Za-z0-9._/-]*$/.test(v), {
      error: `${label} may hold only letters, digits and . _ - / (no spaces)`,
    });
}

export function flag(label: string, fallback: boolean) {
  return z
    .boolean({ error: `${label} must be true or false` })
    .nullish()
    .transform((v) => v ?? fallback);
}

export function wholeCents(label: string, range: { min: number; max: number } = L.priceCents) {
  return boundedNumber(label, 'cents', range).int({ error: `${label} must be a whole number of cents` });
}

export function wholeCount(label: string, unit: string, range: { min: number; max: number }) {
  return boundedNumber(label, unit, range).int({ error: `${label} must be a whole number` });
}

export function optionalText(label: string, maxLength: number) {
  return text(label, { multiline: true, error: `${label} must be text` })
    .max(maxLength, { error: `${label} must be at most ${maxLength} characters` })
    .nullish()
    .transform((v) => (v === null || v === undefined || v.trim() === '' ? null : v.trim()));
}

export const supplierIdSchema = z
  .number({ error: 'supplier must be chosen from the list (a supplier id)' })
  .int({ error: 'supplier must be a supplier id' })
  .positive({ error: 'supplier must be a supplier id' })
  .nullish()
  .transform((v) => v ?? null);

export const CatalogueCamSchema = z
  .strictObject(
    {
      sku: skuSchema(),
      name: card.name,
      supplierId: supplierIdSchema,
      intakeDuration050: card.intakeDuration050,
      exhaustDuration050: card.exhaustDuration050,
      intakeAdvertised: card.intakeAdvertised,
      exhaustAdvertised: card.exhaustAdvertised,
      intakeLiftIn: card.intakeLiftIn,
      exhaustLiftIn: card.exhaustLiftIn,
      lsa: card.lsa,
      intakeCenterline: card.intakeCenterline,
      rockerRatio: card.rockerRatio,
      springMaxLiftIn: card.springMaxLiftIn,
      deactivationCompatible: flag('deactivation compatible', false),
      emissionsCertified: flag('certified for emissions', false),
      isFactoryBaseline: flag('factory baseline', false),
      baselineForLiters: boundedNumber('baseline for displacement', 'L', L.baselineForLiters)
        .nullish()
        .transform((v) => v ?? null),
      priceCents: wholeCents('price'),
      costCents: wholeCents('cost', L.costCents)
        .nullish()
        .transform((v) => v ?? 0),
      stockOnHand: wholeCount('stock on hand', 'units', L.stockOnHand)
        .nullish()
        .transform((v) => v ?? 0),
      active: flag('active', true),
      notes: optionalText('notes', L.notesMaxLength),
    },
    { error: presence('cam', 'an object') },
  )
  // The same two checks the advisor's card schema makes: advertised duration is measured at a smaller
  // tappet lift than 0.050", so it is always the longer figure.
  .refine((c) => c.intakeAdvertised === undefined || c.intakeAdvertised > c.intakeDuration050, {
    path: ['intakeAdvertised'],
    error: 'intake advertised duration must be longer than the duration at 0.050"',
  })
  .refine((c) => c.exhaustAdvertised === undefined || c.exhaustAdvertised > c.exhaustDuration050, {
    path: ['exhaustAdvertised'],
    error: 'exhaust advertised duration must be longer than the duration at 0.050"',
  })
  .refine((c) => !c.isFactoryBaseline || c.baselineForLiters !== null, {
    path: ['baselineForLiters'],
    error: 'a factory baseline card needs the displacement it is the baseline for (L)',
  });

export type CatalogueCam = z.output<typeof CatalogueCamSchema>;
export type CatalogueCamInput = z.input<typeof CatalogueCamSchema>;
export const CATALOGUE_CAM_FIELDS = Object.keys(CatalogueCamSchema.shape) as (keyof CatalogueCam)[];

/** A PATCH: the record's version (optimistic locking) plus any fields to change, and archive on/off. */
export const VersionSchema = z
  .number({
    error: (iss) =>
      iss.input === undefined ? 'version is required (the version you loaded)' : 'version must be a whole number',
  })
  .int({ error: 'version must be a whole number' })
  .positive({ error: 'version must be a whole number' });

export const CamPatchControlSchema = z.object({
  version: VersionSchema,
  archived: z.boolean({ error: 'archived must be true or false' }).optional(),
});

/** Query string of GET /api/cams. */
export const CAM_SORTS = [
  'sku',
  'name',
  'supplier',
  'intakeDuration050',
  'exhaustDuration050',
  'intakeLiftIn',
  'lsa',
  'priceCents',
  'stockOnHand',
  'updatedAt',
] as const;
export type CamSort = (typeof CAM_SORTS)[number];

const numberParam = (label: string) =>
  text(label)
    .optional()
    .transform((v, ctx) => {
      if (v === undefined || v === '') return undefined;
      const n = Number(v);
      if (!Number.isFinite(n)) {
        ctx.addIssue({ code: 'custom', message: `${label} must be a number` });
        return z.NEVER;
      }
      return n;
    });

const boolParam = (label: string) =>
  z
    .enum(['true', 'false', 'all', ''], { error: `${label} must be true, false or all` })
    .optional()
    .transform((v) => (v === 'true' ? true : v === 'false' ? false : undefined));

export const pageParams = {
  page: numberParam('page')
    .pipe(
      z.number().int({ error: 'page must be a whole number' }).min(1, { error: 'page must be at least 1' }).optional(),
    )
    .transform((v) => v ?? 1),
  pageSize: numberParam('pageSize')
    .pipe(
      z
        .number()
        .int({ error: 'pageSize must be a whole number' })
        .min(1, { error: 'pageSize must be at least 1' })
        .max(200, { error: 'pageSize must be at most 200' })
        .optional(),
    )
    .transform((v) => v ?? 25),
  dir: z
    .enum(['asc', 'desc'], { error: 'dir must be asc or desc' })
    .optional()
    .transform((v) => v ?? 'asc'),
  q: text('q')
    .max(100, { error: 'q must be at most 100 characters' })
    .optional()
    .transform((v) => (v ? v : undefined)),
};

export const CamListQuerySchema = z.strictObject({
  ...pageParams,
  sort: z
    .enum(CAM_SORTS, { error: `sort must be one of: ${CAM_SORTS.join(', ')}` })
    .optional()
    .transform((v) => v ?? 'intakeDuration050'),
  supplier: numberParam('supplier').pipe(z.number().int({ error: 'supplier must be a supplier id' }).optional()),
  durationMin: numberParam('durationMin'),
  durationMax: numberParam('durationMax'),
  lsa: numberParam('lsa'),
  lsaMin: numberParam('lsaMin'),
  lsaMax: numberParam('lsaMax'),
  active: boolParam('active'),
  inStock: boolParam('inStock'),
  archived: z
    .enum(['true', 'false', 'all', 'only', ''], { error: 'archived must be true, false, all or only' })
    .optional()
    .transform((v) => (v === 'true' || v === 'only' ? 'only' : v === 'all' ? 'all' : 'exclude')),
  baseline: boolParam('baseline'),
});
export type CamListQuery = z.output<typeof CamListQuerySchema>;
