import { z } from 'zod';
import { text } from './text';
import { presence } from './cam-card';
import { pageParams, VersionSchema } from './catalogue-cam';
import { BuildProfileSchema } from './build-profile';
import { CustomerSchema } from './customer';

// A saved build: whose it is, which vehicle, and the advisor's build profile (BuildProfileSchema,
// reused as it is so a saved build is always one the advisor accepts).
export const BUILD_RECORD_LIMITS = {
  vehicleLabelMaxLength: 160,
  /**
   * The profile shape this code writes, stored beside each profile. 2: the cycle model's optional engine,
   * exhaust and fuel fields and vehicle.class (migration 20261205000100-profile-vehicle-class fills the class in).
   */
  profileSchemaVersion: 2,
} as const;

const idOf = (label: string) =>
  z
    .number({
      error: (iss) => (iss.input === undefined ? `${label} is required` : `${label} must be a whole number (an id)`),
    })
    .int({ error: `${label} must be a whole number (an id)` })
    .positive({ error: `${label} must be a whole number (an id)` });

export const VehicleLabelSchema = text('vehicle', { error: presence('vehicle', 'text') })
  .min(1, { error: 'vehicle must not be empty (year, body, engine, e.g. "2012 pickup, 5.3 L")' })
  .max(BUILD_RECORD_LIMITS.vehicleLabelMaxLength, {
    error: `vehicle must be at most ${BUILD_RECORD_LIMITS.vehicleLabelMaxLength} characters`,
  });

/** The catalogue cam the engine has now (a factory baseline card), when it was picked from the catalogue. */
const BaselineCamIdSchema = idOf('baselineCamId')
  .nullish()
  .transform((v) => v ?? null);

/** POST /api/builds: an existing customer's id, or a new customer inline; never both. */
export const BuildCreateSchema = z
  .strictObject(
    {
      customerId: idOf('customerId').optional(),
      customer: CustomerSchema.optional(),
      vehicleLabel: VehicleLabelSchema,
      baselineCamId: BaselineCamIdSchema,
      profile: BuildProfileSchema,
      // Set when the interview was started from a questionnaire lead: links the lead and marks it contacted.
      leadId: idOf('leadId').optional(),
    },
    { error: presence('build', 'an object') },
  )
  .superRefine((b, ctx) => {
    if (b.customerId === undefined && b.customer === undefined) {
      ctx.addIssue({
        code: 'custom',
        path: ['customerId'],
        message: 'pick a customer (customerId) or enter a new one (customer)',
      });
    }
    if (b.customerId !== undefined && b.customer !== undefined) {
      ctx.addIssue({
        code: 'custom',
        path: ['customer'],
        message: 'send either customerId or a new customer, not both',
      });
    }
  });
export type BuildCreate = z.output<typeof BuildCreateSchema>;
export type BuildCreateInput = z.input<typeof BuildCreateSchema>;

/** What a PATCH may change; the stored values are laid under the changes and the whole is checked again. */
export const BuildUpdateSchema = z.strictObject(
  {
    customerId: idOf('customerId'),
    vehicleLabel: VehicleLabelSchema,
    baselineCamId: BaselineCamIdSchema,
    // Replaced whole, never merged: a profile is checked as one combination (cross-field rules).
    profile: BuildProfileSchema,
  },
  { error: presence('build', 'an object') },
);
export type BuildUpdate = z.output<typeof BuildUpdateSchema>;

export const BuildPatchControlSchema = z.object({ version: VersionSchema });

const customerIdParam = text('customerId')
  .optional()
  .transform((v, ctx) => {
    if (v === undefined || v === '') return undefined;
    if (!/^\d{1,10}$/.test(v) || Number(v) < 1) {
      ctx.addIssue({ code: 'custom', message: 'customerId must be a customer id' });
      return z.NEVER;
    }
    return Number(v);
  });

/** Query string of GET /api/builds: newest first; q searches the vehicle and the customer's name, e-mail, phone. */
export const BuildListQuerySchema = z.strictObject({
  q: pageParams.q,
  customerId: customerIdParam,
  page: pageParams.page,
  pageSize: pageParams.pageSize,
});
export type BuildListQuery = z.output<typeof BuildListQuerySchema>;
