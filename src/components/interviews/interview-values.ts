import type { FormikErrors } from 'formik';
import { setIn } from 'formik';
import type { InterviewValues } from '@/lib/builds/interview-values';
import { buildPayloadChecks } from '@/lib/forms/build-checks';
import { formatMoney } from '@/lib/format';
import { BUILD_LIMITS } from '@/lib/schemas/build-profile';

// The interview form's side of its values: form → the JSON POST/PATCH /api/builds takes, and the server's
// 422 (or the yup checks run in the browser) → formik's nested errors. The values themselves and a stored
// build → form live in lib/builds/interview-values.ts (the questionnaire's server code reads them too).

/** Blank → undefined (the schema then says "is required" where it is); anything else → a number (NaN says "must be a number"). */
function num(text: string): number | undefined {
  const t = text.trim().replace(/,/g, '');
  return t === '' ? undefined : Number(t);
}

/** The JSON the API takes. mode 'edit' sends customerId only (the customer is edited on its own). */
export function payloadFromValues(values: InterviewValues, mode: 'create' | 'edit'): Record<string, unknown> {
  const p = values.profile;
  const manual = p.drivetrain.transmission === 'manual';
  const budgetDollars = num(p.use.budgetCents);
  const card = p.baselineCam;
  const customer =
    mode === 'create' && values.customerMode === 'new'
      ? {
          customer: {
            name: values.customer.name,
            phone: values.customer.phone,
            email: values.customer.email,
            notes: values.customer.notes,
          },
        }
      : { customerId: num(values.customerId) };
  return {
    ...customer,
    vehicleLabel: values.vehicleLabel,
    baselineCamId: values.baselineCamId ? Number(values.baselineCamId) : null,
    profile: {
      engine: {
        cylinders: num(p.engine.cylinders),
        boreIn: num(p.engine.boreIn),
        strokeIn: num(p.engine.strokeIn),
        rodLengthIn: num(p.engine.rodLengthIn),
        compressionRatio: num(p.engine.compressionRatio),
        headMaterial: p.engine.headMaterial,
        intakeFlowCfm: num(p.engine.intakeFlowCfm),
        intakeManifold: p.engine.intakeManifold,
        cylinderDeactivation: p.engine.cylinderDeactivation,
      },
      exhaust: {
        headers: p.exhaust.headers,
        primaryIn: p.exhaust.headers === 'manifold' ? undefined : num(p.exhaust.primaryIn),
        system: p.exhaust.system,
      },
      drivetrain: {
        transmission: p.drivetrain.transmission,
        stallRpm: manual ? 0 : num(p.drivetrain.stallRpm),
        launchRpm: manual ? num(p.drivetrain.launchRpm) : undefined,
        axleRatio: num(p.drivetrain.axleRatio),
        topGearRatio: num(p.drivetrain.topGearRatio),
        tireDiameterIn: num(p.drivetrain.tireDiameterIn),
      },
      vehicle: {
        weightLb: num(p.vehicle.weightLb),
        powerBrakes: p.vehicle.powerBrakes,
        class: p.vehicle.class || undefined,
      },
      use: {
        primary: p.use.primary,
        idle: p.use.idle,
        fuelOctane: num(p.use.fuelOctane),
        emissionsRequired: p.use.emissionsRequired === 'yes',
        cruiseMph: num(p.use.cruiseMph),
        budgetCents:
          p.use.budgetKnown === 'unsure' || budgetDollars === undefined ? undefined : Math.round(budgetDollars * 100),
      },
      baselineCam: {
        id: values.baselineCamId || 'typed',
        name: card.name,
        intakeDuration050: num(card.intakeDuration050),
        exhaustDuration050: num(card.exhaustDuration050),
        intakeAdvertised: num(card.intakeAdvertised),
        exhaustAdvertised: num(card.exhaustAdvertised),
        intakeLiftIn: num(card.intakeLiftIn),
        exhaustLiftIn: num(card.exhaustLiftIn),
        lsa: num(card.lsa),
        intakeCenterline: num(card.intakeCenterline),
        rockerRatio: num(card.rockerRatio),
        springMaxLiftIn: num(card.springMaxLiftIn),
      },
    },
  };
}

const budgetMax = formatMoney(BUILD_LIMITS.budgetCents.max, { whole: true });

/** The budget is typed in dollars; say its limit in dollars too. */
function reword(field: string, message: string): string {
  if (field === 'profile.use.budgetCents')
    return message.includes('required')
      ? 'budget is required ($), or choose “Not sure yet”'
      : `budget must be between $0 and ${budgetMax}`;
  return message;
}

/** Field errors (from zod or from a 422 answer) in formik's nested shape. */
export function nestErrors(list: { field: string; message: string }[]): FormikErrors<InterviewValues> {
  let errors: FormikErrors<InterviewValues> = {};
  for (const { field, message } of list) {
    const name = field === 'customer' ? 'customer.name' : field;
    errors = setIn(errors, name, reword(name, message));
  }
  return errors;
}

/** formik's validate: the payload through the yup checks (lib/forms/build-checks.ts), in formik's nested shape. */
export function interviewChecks(mode: 'create' | 'edit') {
  const check = buildPayloadChecks[mode];
  return (values: InterviewValues): FormikErrors<InterviewValues> => {
    // The schema takes a missing budget as "none given"; the form asks for a figure unless "not sure" was picked.
    const budgetMissing =
      values.profile.use.budgetKnown === 'figure' && num(values.profile.use.budgetCents) === undefined;
    const list: { field: string; message: string }[] = budgetMissing
      ? [{ field: 'profile.use.budgetCents', message: 'budget is required' }]
      : [];
    const seen = new Set<string>(list.map((l) => l.field));
    for (const [field, message] of Object.entries(check(payloadFromValues(values, mode)))) {
      if (seen.has(field)) continue;
      seen.add(field);
      list.push({ field: field || '(body)', message });
    }
    return nestErrors(list);
  };
}
