import { z } from 'zod';
import { text } from './text';
import { NEED_KIND_LIST } from '@/lib/advisor/needs';
import { VEHICLE_CLASSES, type VehicleClass } from './build-profile';
import { presence } from './cam-card';
import { flag } from './catalogue-cam';

// A rule says what one kind of need adds in this shop, for one vehicle class or for every class. It
// never says WHEN a cam has that need: the advisor decides (src/lib/advisor/needs.ts), so the shortlist's
// "needs springs" and the quote's spring kit come from one threshold.
export const NEED_RULE_KIND_OPTIONS = NEED_KIND_LIST;
export type NeedRuleKindOption = (typeof NEED_RULE_KIND_OPTIONS)[number];

export const NEED_RULE_LIMITS = {
  quantity: { min: 0.01, max: 99 },
  items: 12,
  labelMaxLength: 160,
} as const;

/** How each kind reads to the manager. */
export const NEED_RULE_KIND_TEXT: Record<NeedRuleKindOption, { title: string }> = {
  install: { title: 'Fitting the cam (every cam swap)' },
  springs: { title: 'Springs: the cam lifts past the installed springs’ limit' },
  pushrods: { title: 'Pushrods: high lift, or the cam is specified with other rockers' },
  lifters: { title: 'Lifters: high lift on a stock hydraulic valvetrain' },
  'deactivation-delete': { title: 'Deactivation delete: active cylinder deactivation and a cam not made for it' },
  converter: { title: 'Converter: the cam pulls well above the converter’s stall' },
  tune: { title: 'Tune (every cam swap)' },
};

/** The vehicle-class choice of a rule: one class, or every class without a rule of its own. */
export const RULE_VEHICLE_CLASS_TEXT: Record<VehicleClass | 'any', string> = {
  any: 'Every vehicle',
  truck: 'Trucks',
  suv: 'SUVs',
  van: 'Vans',
  car: 'Cars',
};

const id = (label: string) =>
  z
    .number({ error: `${label} must be an id from the list` })
    .int({ error: `${label} must be an id from the list` })
    .positive({ error: `${label} must be an id from the list` })
    .nullish()
    .transform((v) => v ?? null);

export const NeedRuleItemSchema = z
  .strictObject({
    partId: id('part'),
    laborOperationId: id('labour operation'),
    quantity: z
      .number({ error: 'quantity must be a number' })
      .min(NEED_RULE_LIMITS.quantity.min, { error: `quantity must be at least ${NEED_RULE_LIMITS.quantity.min}` })
      .max(NEED_RULE_LIMITS.quantity.max, { error: `quantity must be at most ${NEED_RULE_LIMITS.quantity.max}` })
      .nullish()
      .transform((v) => v ?? 1),
  })
  .refine((i) => i.partId !== null || i.laborOperationId !== null, {
    path: ['partId'],
    error: 'each item needs a part, a labour operation or both',
  });

export const NeedRuleSchema = z.strictObject(
  {
    kind: z.enum(NEED_RULE_KIND_OPTIONS, { error: presence('kind', `one of: ${NEED_RULE_KIND_OPTIONS.join(', ')}`) }),
    // null or absent: every vehicle class that has no rule of its own for this kind.
    vehicleClass: z
      .enum(VEHICLE_CLASSES, {
        error: `vehicleClass must be one of: ${VEHICLE_CLASSES.join(', ')} (or null for every vehicle)`,
      })
      .nullish()
      .transform((v) => v ?? null),
    // Schema 1 rules carried their own lift or rpm threshold; that decision is the advisor's now.
    threshold: z
      .null({
        error:
          'rules take no threshold: the advisor decides when a cam needs springs (past the installed springs’ limit), a converter or the rest',
      })
      .optional(),
    label: text('label', { error: presence('label', 'text') })
      .min(1, { error: 'label must not be empty' })
      .max(NEED_RULE_LIMITS.labelMaxLength, {
        error: `label must be at most ${NEED_RULE_LIMITS.labelMaxLength} characters`,
      }),
    active: flag('active', true),
    items: z
      .array(NeedRuleItemSchema, { error: 'items must be a list of parts and labour' })
      .min(1, { error: 'a rule must add at least one part or labour operation' })
      .max(NEED_RULE_LIMITS.items, { error: `a rule may add at most ${NEED_RULE_LIMITS.items} items` }),
  },
  { error: presence('rule', 'an object') },
);
export type NeedRuleValues = z.output<typeof NeedRuleSchema>;
export type NeedRuleFormInput = z.input<typeof NeedRuleSchema>;

export const NeedRulePatchControlSchema = z.object({
  version: z
    .number({ error: 'version is required (the version you loaded)' })
    .int()
    .positive({ error: 'version must be a whole number' }),
});
