import { z } from 'zod';
import { text } from './text';

// A cam card: what a supplier prints about a grind. Durations are crank degrees, lifts are at the valve.
// The limits are wide enough for every street and strip grind a pushrod V8 shop sells, and narrow
// enough that a typo (2120° instead of 212°, 5.5" instead of 0.550") is caught at the counter.
export const CAM_LIMITS = {
  duration050Deg: { min: 150, max: 300 },
  advertisedDeg: { min: 170, max: 380 },
  liftIn: { min: 0.25, max: 0.9 },
  lsaDeg: { min: 100, max: 124 },
  intakeCenterlineDeg: { min: 95, max: 128 },
  rockerRatio: { min: 1.3, max: 2.1, default: 1.7 },
  springMaxLiftIn: { min: 0.3, max: 1.0 },
  priceCents: { min: 0, max: 10_000_000 },
  idMaxLength: 64,
  nameMaxLength: 120,
} as const;

type Range = { min: number; max: number };

/** A finite number within [min, max], with a message that names the unit. */
export function boundedNumber(label: string, unit: string, range: Range) {
  return z
    .number({
      error: (iss) =>
        iss.input === undefined ? `${label} is required (${unit})` : `${label} must be a number (${unit})`,
    })
    .min(range.min, { error: `${label} must be at least ${range.min} ${unit}` })
    .max(range.max, { error: `${label} must be at most ${range.max} ${unit}` });
}

// Optional fields also accept null (the catalogue stores "not given" as NULL) and come out as undefined.
function optional<T extends z.ZodType>(schema: T) {
  return z.preprocess((v) => (v === null ? undefined : v), schema.optional());
}

const L = CAM_LIMITS;

export const CamIdSchema = z.union(
  [text('id').min(1).max(L.idMaxLength), z.number().int().min(0).max(Number.MAX_SAFE_INTEGER)],
  { error: `id must be a non-empty text (up to ${L.idMaxLength} characters) or a whole number` },
);

/** Required-or-wrong-type message for an object or a flag. */
export function presence(label: string, kind: string) {
  return (iss: { input?: unknown }) => (iss.input === undefined ? `${label} is required` : `${label} must be ${kind}`);
}

export const CamCardSchema = z
  .strictObject(
    {
      id: CamIdSchema,
      name: text('name', { error: presence('name', 'text') })
        .min(1, { error: 'name must not be empty' })
        .max(L.nameMaxLength, { error: `name must be at most ${L.nameMaxLength} characters` }),
      intakeDuration050: boundedNumber('intake duration at 0.050"', 'deg', L.duration050Deg),
      exhaustDuration050: boundedNumber('exhaust duration at 0.050"', 'deg', L.duration050Deg),
      intakeAdvertised: optional(boundedNumber('intake advertised duration', 'deg', L.advertisedDeg)),
      exhaustAdvertised: optional(boundedNumber('exhaust advertised duration', 'deg', L.advertisedDeg)),
      intakeLiftIn: boundedNumber('intake lift at the valve', 'in', L.liftIn),
      exhaustLiftIn: boundedNumber('exhaust lift at the valve', 'in', L.liftIn),
      lsa: boundedNumber('lobe separation angle', 'deg', L.lsaDeg),
      intakeCenterline: boundedNumber('installed intake centerline', 'deg', L.intakeCenterlineDeg),
      rockerRatio: boundedNumber('rocker ratio', ':1', L.rockerRatio)
        .nullish()
        .transform((v) => v ?? L.rockerRatio.default),
      deactivationCompatible: optional(z.boolean({ error: presence('deactivationCompatible', 'true or false') })),
      emissionsCertified: optional(z.boolean({ error: presence('emissionsCertified', 'true or false') })),
      springMaxLiftIn: optional(boundedNumber('spring max lift', 'in', L.springMaxLiftIn)),
      priceCents: optional(
        boundedNumber('price', 'cents', L.priceCents).int({ error: 'price must be a whole number of cents' }),
      ),
    },
    { error: presence('cam card', 'an object') },
  )
  // Advertised duration is measured at a smaller tappet lift than 0.050", so it is always the longer one.
  .refine((c) => c.intakeAdvertised === undefined || c.intakeAdvertised > c.intakeDuration050, {
    path: ['intakeAdvertised'],
    error: 'intake advertised duration must be longer than the duration at 0.050"',
  })
  .refine((c) => c.exhaustAdvertised === undefined || c.exhaustAdvertised > c.exhaustDuration050, {
    path: ['exhaustAdvertised'],
    error: 'exhaust advertised duration must be longer than the duration at 0.050"',
  });

/** A validated cam card (defaults applied: rockerRatio 1.7). */
export type CamCard = z.output<typeof CamCardSchema>;
/** What a caller may send before validation. */
export type CamCardInput = z.input<typeof CamCardSchema>;

export const CamCatalogueSchema = z
  .array(CamCardSchema, { error: 'the cams file must be a JSON array of cam cards' })
  .max(20_000);
