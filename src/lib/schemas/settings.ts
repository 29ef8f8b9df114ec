import { z } from 'zod';
import { text } from './text';
import { boundedNumber, presence } from './cam-card';
import { VersionSchema, wholeCents } from './catalogue-cam';
import { AIR_UNITS } from '@/lib/dyno/units';

// The shop's prices and policy: labour rate (cents per hour), tax rate (basis points, 1 % = 100 bp)
// and the deposit (a percent of the quote total, kept between a minimum and a maximum).
export const SETTINGS_LIMITS = {
  nameMaxLength: 120,
  laborRateCents: { min: 0, max: 100_000 },
  taxRateBp: { min: 0, max: 3_000 },
  depositPercentBp: { min: 0, max: 10_000 },
  depositCents: { min: 0, max: 10_000_000 },
  policyMaxLength: 4000,
  leadStaleDays: { min: 1, max: 60 },
} as const;

const S = SETTINGS_LIMITS;
const setting = (label: string, max: number, options: { required?: boolean; multiline?: boolean } = {}) =>
  text(label, { multiline: options.multiline, error: presence(label, 'text') })
    .max(max, { error: `${label} must be at most ${max} characters` })
    .refine((v) => !options.required || v.length > 0, { error: `${label} must not be empty` });

export const ShopSettingsSchema = z
  .strictObject(
    {
      name: setting('shop name', S.nameMaxLength, { required: true }),
      address: setting('address', 255, { multiline: true }),
      phone: setting('phone', 40),
      email: z.union(
        [z.literal(''), text('email').pipe(z.email({ error: 'email must be an e-mail address' }).max(254))],
        { error: 'email must be an e-mail address' },
      ),
      laborRateCents: wholeCents('labour rate', S.laborRateCents),
      taxRateBp: boundedNumber('tax rate', 'bp', S.taxRateBp).int({
        error: 'tax rate must be a whole number of basis points',
      }),
      depositPercentBp: boundedNumber('deposit percent', 'bp', S.depositPercentBp).int({
        error: 'deposit percent must be a whole number of basis points',
      }),
      depositMinCents: wholeCents('deposit minimum', S.depositCents),
      depositMaxCents: wholeCents('deposit maximum', S.depositCents),
      // Optional so a form that does not show it yet keeps the stored value (issue 12 item 8).
      maxCounterDiscountBp: boundedNumber('counter discount limit', 'bp', S.depositPercentBp)
        .int({ error: 'counter discount limit must be a whole number of basis points' })
        .optional(),
      depositPolicyText: setting('deposit policy', S.policyMaxLength, { required: true, multiline: true }),
      // Optional for callers that predate it; left out, the stored value stays.
      leadStaleDays: boundedNumber('days before a lead is flagged', 'days', S.leadStaleDays)
        .int({ error: 'days before a lead is flagged must be a whole number of days' })
        .optional(),
      // How the dyno form asks for the air; runs are stored in °C and kPa whatever this says. Optional like the above.
      dynoAirUnits: z.enum(AIR_UNITS, { error: `dyno air units must be one of: ${AIR_UNITS.join(', ')}` }).optional(),
    },
    { error: presence('settings', 'an object') },
  )
  .refine((s) => s.depositMaxCents >= s.depositMinCents, {
    path: ['depositMaxCents'],
    error: 'deposit maximum must not be below the deposit minimum',
  });
export type ShopSettingsValues = z.output<typeof ShopSettingsSchema>;
export type ShopSettingsInput = z.input<typeof ShopSettingsSchema>;
export const SHOP_SETTINGS_FIELDS = Object.keys(ShopSettingsSchema.shape) as (keyof ShopSettingsValues)[];

export const SettingsPatchControlSchema = z.object({ version: VersionSchema });
