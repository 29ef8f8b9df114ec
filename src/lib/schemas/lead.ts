import { z } from 'zod';
import { text } from './text';
import { VEHICLE_CLASSES } from './build-profile';
import { presence } from './cam-card';
import { LEAD_LIMITS } from '@/lib/leads/limits';

// The at-home questionnaire (/ask): every answer is a choice from a short list, so the customer
// never has to know a figure. src/lib/leads/profile.ts turns the answers into a conservative build.
// The limits live in a zod-free module so the questionnaire's browser bundle can use them without zod.
export { LEAD_LIMITS };

export const ENGINE_CHOICES = ['4.8', '5.3', '5.7', '6.0', '6.2', 'unsure'] as const;
/** The build profile's vehicle classes, asked in plain words (src/lib/leads/questions.ts). */
export const VEHICLE_CHOICES = VEHICLE_CLASSES;
export const USE_CHOICES = ['daily', 'towing', 'street', 'strip'] as const;
export const IDLE_CHOICES = ['smooth', 'noticeable', 'aggressive'] as const;
export const EMISSIONS_CHOICES = ['yes', 'no', 'unsure'] as const;
export const TRANSMISSION_CHOICES = ['automatic', 'manual'] as const;
export const DRIVELINE_CHOICES = ['stock', 'converter', 'gears', 'both', 'unsure'] as const;
export const EXHAUST_CHOICES = ['stock', 'headers', 'open'] as const;
export const BUDGET_CHOICES = ['under-1500', '1500-3000', '3000-5000', 'over-5000', 'unsure'] as const;
export const LEAD_STATUSES = ['new', 'contacted', 'quoted', 'closed'] as const;
export type LeadStatus = (typeof LEAD_STATUSES)[number];

function choice<T extends readonly [string, ...string[]]>(label: string, values: T) {
  return z.enum(values, { error: presence(label, `one of: ${values.join(', ')}`) });
}

const optionalText = (label: string, max: number) =>
  text(label, { error: presence(label, 'text') })
    .max(max, { error: `${label} must be at most ${max} characters` })
    .optional()
    .transform((v) => (v ? v : undefined));

export const LeadAnswersSchema = z
  .strictObject(
    {
      engine: choice('engine', ENGINE_CHOICES),
      // Optional so answers saved before the question existed still read; the questionnaire always asks it.
      vehicle: choice('vehicle', VEHICLE_CHOICES).optional(),
      use: choice('use', USE_CHOICES),
      idle: choice('idle', IDLE_CHOICES),
      emissions: choice('emissions', EMISSIONS_CHOICES),
      transmission: choice('transmission', TRANSMISSION_CHOICES),
      driveline: choice('driveline', DRIVELINE_CHOICES),
      exhaust: choice('exhaust', EXHAUST_CHOICES),
      budget: choice('budget', BUDGET_CHOICES),
      name: text('name', { error: presence('name', 'text') })
        .min(1, { error: 'name must not be empty' })
        .max(LEAD_LIMITS.nameMaxLength, { error: `name must be at most ${LEAD_LIMITS.nameMaxLength} characters` }),
      email: optionalText('email', LEAD_LIMITS.emailMaxLength).refine(
        (v) => v === undefined || z.email().safeParse(v).success,
        {
          error: 'email must be an e-mail address like name@example.com',
        },
      ),
      phone: optionalText('phone', LEAD_LIMITS.phoneMaxLength).refine(
        (v) =>
          v === undefined || (/^[0-9+()\-.\s]+$/.test(v) && v.replace(/\D/g, '').length >= LEAD_LIMITS.phoneMinDigits),
        { error: `phone must be digits (at least ${LEAD_LIMITS.phoneMinDigits}), spaces, +, -, ( or )` },
      ),
      consent: z.literal(true, { error: 'consent must be given: the shop may only contact you if you say so' }),
      // The honeypot (hidden from people on /ask): anything in it marks the post as a robot's.
      website: optionalText('website', LEAD_LIMITS.honeypotMaxLength).optional(),
    },
    { error: presence('answers', 'an object') },
  )
  .refine((a) => a.email !== undefined || a.phone !== undefined, {
    path: ['email'],
    error: 'give an e-mail address or a phone number so the shop can reach you',
  });

export type LeadAnswers = z.output<typeof LeadAnswersSchema>;

export const LeadPatchSchema = z.strictObject(
  {
    version: z
      .number({ error: presence('version', 'a whole number') })
      .int({ error: 'version must be a whole number' })
      .min(1, { error: 'version must be at least 1' }),
    status: choice('status', LEAD_STATUSES),
  },
  { error: presence('body', 'an object') },
);

export const LeadListQuerySchema = z.strictObject({
  status: choice('status', LEAD_STATUSES).optional(),
  page: z.coerce
    .number({ error: 'page must be a whole number' })
    .int({ error: 'page must be a whole number' })
    .min(1, { error: 'page must be at least 1' })
    .default(1),
  pageSize: z.coerce
    .number({ error: 'pageSize must be a whole number' })
    .int({ error: 'pageSize must be a whole number' })
    .min(1, { error: 'pageSize must be at least 1' })
    .max(LEAD_LIMITS.pageSizeMax, { error: `pageSize must be at most ${LEAD_LIMITS.pageSizeMax}` })
    .default(25),
});
