import * as yup from 'yup';
import { VEHICLE_CLASSES } from '@/lib/schemas/build-profile';
import { NEED_RULE_KIND_OPTIONS, NEED_RULE_LIMITS as L } from '@/lib/schemas/need-rule';
import { fieldRule, oneOfList, validateWithYup } from './yup-limits';

// The need-rule form's checks in the browser: yup over the JSON the form sends, from the limits
// lib/schemas/need-rule.ts exports and in its words. POST/PATCH /api/rules still validates with zod.

const itemId = (label: string) =>
  yup
    .number()
    .nullable()
    .typeError(`${label} must be an id from the list`)
    .integer(`${label} must be an id from the list`)
    .positive(`${label} must be an id from the list`);

const item = yup
  .object({
    partId: itemId('part'),
    laborOperationId: itemId('labour operation'),
    // The quantity carries no unit, so its messages have none (the schema's words).
    quantity: yup
      .number()
      .typeError('quantity must be a number')
      .min(L.quantity.min, `quantity must be at least ${L.quantity.min}`)
      .max(L.quantity.max, `quantity must be at most ${L.quantity.max}`)
      .nullable(),
  })
  .test(
    fieldRule<{ partId?: number | null; laborOperationId?: number | null }>(
      'part-or-labour',
      'partId',
      'each item needs a part, a labour operation or both',
      (i) => (i.partId ?? null) !== null || (i.laborOperationId ?? null) !== null,
    ),
  );

export const ruleChecks = validateWithYup<Record<string, unknown>>(
  yup.object({
    kind: oneOfList('kind', NEED_RULE_KIND_OPTIONS),
    vehicleClass: yup
      .string()
      .nullable()
      .oneOf(
        [...VEHICLE_CLASSES, null],
        `vehicleClass must be one of: ${VEHICLE_CLASSES.join(', ')} (or null for every vehicle)`,
      ),
    label: yup
      .string()
      .defined('label is required')
      .test('not-empty', 'label must not be empty', (v) => Boolean(v?.trim()))
      .max(L.labelMaxLength, `label must be at most ${L.labelMaxLength} characters`),
    active: yup.boolean(),
    items: yup
      .array(item)
      .defined('items must be a list of parts and labour')
      .min(1, 'a rule must add at least one part or labour operation')
      .max(L.items, `a rule may add at most ${L.items} items`),
  }),
);
