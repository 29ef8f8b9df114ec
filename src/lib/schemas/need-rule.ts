import { z } from 'zod';
import { text } from './text';
import { CAM_LIMITS, presence } from './cam-card';
import { flag } from './catalogue-cam';

export const NEED_RULE_KIND_OPTIONS = ['lift-over', 'deactivation-active', 'crossover-over-stall', 'always'] as const;

export const NEED_RULE_LIMITS = {
  liftIn: CAM_LIMITS.liftIn,
  crossoverGapRpm: { min: 0, max: 4000 },
  quantity: { min: 0.01, max: 99 },
  items: 12,
  labelMaxLength: 160,
} as const;

/** How each kind reads to the manager; the threshold unit when it has one. */
export const NEED_RULE_KIND_TEXT: Record<(typeof NEED_RULE_KIND_OPTIONS)[number], { title: string; threshold: null | { label: string; unit: string } }> = {
  'lift-over': { title: 'When lift at the valve exceeds N in', threshold: { label: 'lift', unit: 'in' } },
  'deactivation-active': { title: 'When cylinder deactivation is active and the cam is not compatible', threshold: null },
  'crossover-over-stall': { title: 'When the crossover is N rpm or more above the converter stall', threshold: { label: 'rpm above stall', unit: 'rpm' } },
  always: { title: 'Always, on every cam swap', threshold: null },
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
  .refine((i) => i.partId !== null || i.laborOperationId !== null, { path: ['partId'], error: 'each item needs a part, a labour operation or both' });

export const NeedRuleSchema = z
  .strictObject(
    {
      kind: z.enum(NEED_RULE_KIND_OPTIONS, { error: presence('kind', `one of: ${NEED_RULE_KIND_OPTIONS.join(', ')}`) }),
      threshold: z.number({ error: 'threshold must be a number' }).finite().nullish().transform((v) => v ?? null),
      label: text('label', { error: presence('label', 'text') })
        .min(1, { error: 'label must not be empty' })
        .max(NEED_RULE_LIMITS.labelMaxLength, { error: `label must be at most ${NEED_RULE_LIMITS.labelMaxLength} characters` }),
      active: flag('active', true),
      items: z
        .array(NeedRuleItemSchema, { error: 'items must be a list of parts and labour' })
        .min(1, { error: 'a rule must add at least one part or labour operation' })
        .max(NEED_RULE_LIMITS.items, { error: `a rule may add at most ${NEED_RULE_LIMITS.items} items` }),
    },
    { error: presence('rule', 'an object') },
  )
  .superRefine((rule, ctx) => {
    const { liftIn, crossoverGapRpm } = NEED_RULE_LIMITS;
    if (rule.kind === 'lift-over') {
      if (rule.threshold === null) ctx.addIssue({ code: 'custom', path: ['threshold'], message: 'a lift rule needs the lift at the valve it starts at (in)' });
      else if (rule.threshold < liftIn.min || rule.threshold > liftIn.max) {
        ctx.addIssue({ code: 'custom', path: ['threshold'], message: `lift must be between ${liftIn.min} and ${liftIn.max} in` });
      }
    } else if (rule.kind === 'crossover-over-stall') {
      if (rule.threshold === null) ctx.addIssue({ code: 'custom', path: ['threshold'], message: 'a crossover rule needs the rpm above stall it starts at' });
      else if (!Number.isInteger(rule.threshold) || rule.threshold < crossoverGapRpm.min || rule.threshold > crossoverGapRpm.max) {
        ctx.addIssue({ code: 'custom', path: ['threshold'], message: `rpm above stall must be a whole number between ${crossoverGapRpm.min} and ${crossoverGapRpm.max}` });
      }
    } else if (rule.threshold !== null) {
      ctx.addIssue({ code: 'custom', path: ['threshold'], message: `a rule of kind ${rule.kind} takes no threshold` });
    }
  });
export type NeedRuleValues = z.output<typeof NeedRuleSchema>;
export type NeedRuleFormInput = z.input<typeof NeedRuleSchema>;

export const NeedRulePatchControlSchema = z.object({
  version: z.number({ error: 'version is required (the version you loaded)' }).int().positive({ error: 'version must be a whole number' }),
});
