import * as yup from 'yup';
import { cruiseRpm } from '@/lib/advisor/drivetrain';
import { VALVETRAIN_LIMIT_RPM } from '@/lib/advisor/rpm-grid';
import { BUILD_RECORD_LIMITS } from '@/lib/schemas/build';
import {
  BUILD_LIMITS as B,
  DEACTIVATION_STATES,
  EXHAUST_SYSTEMS,
  HEAD_MATERIALS,
  HEADER_TYPES,
  IDLE_WISHES,
  INTAKE_MANIFOLDS,
  POWER_BRAKES,
  PRIMARY_USES,
  TRANSMISSIONS,
  VEHICLE_CLASSES,
} from '@/lib/schemas/build-profile';
import { CAM_LIMITS as C } from '@/lib/schemas/cam-card';
import { CUSTOMER_LIMITS } from '@/lib/schemas/customer';
import { fieldRule, isFiniteNumber, numberWithin, oneOfList, textUpTo, validateWithYup } from './yup-limits';

// The interview's checks in the browser: yup over the same JSON the form sends (payloadFromValues), built from
// the limits lib/schemas/build-profile.ts, cam-card.ts, customer.ts and build.ts export, with the zod schemas'
// wording, so a field is flagged here with the words the server's 422 would use. The cross-field rules (rod
// against stroke, an automatic's stall, cruise rpm, advertised against 0.050" duration) are yup tests with the
// zod refinements' messages. POST/PATCH /api/builds still validates everything with zod.

const needed = (label: string, unit: string, range: { min: number; max: number }) =>
  numberWithin(label, unit, range, { required: true });
const maybe = (label: string, unit: string, range: { min: number; max: number }) => numberWithin(label, unit, range);

function textField(label: string, maxLength: number, emptyMessage?: string) {
  return yup
    .string()
    .defined(`${label} is required`)
    .test('not-empty', emptyMessage ?? `${label} must not be empty`, (v) => Boolean(v?.trim()))
    .max(maxLength, `${label} must be at most ${maxLength} characters`);
}

const engine = yup
  .object({
    cylinders: needed('cylinders', 'cylinders', B.cylinders).integer('cylinders must be a whole number'),
    boreIn: needed('bore', 'in', B.boreIn),
    strokeIn: needed('stroke', 'in', B.strokeIn),
    rodLengthIn: needed('rod length', 'in', B.rodLengthIn),
    compressionRatio: needed('static compression ratio', ':1', B.compressionRatio),
    headMaterial: oneOfList('head material', HEAD_MATERIALS),
    intakeFlowCfm: needed('intake port flow at 28 inH2O', 'cfm', B.intakeFlowCfm),
    intakeManifold: oneOfList('intake manifold', INTAKE_MANIFOLDS),
    cylinderDeactivation: oneOfList('cylinder deactivation', DEACTIVATION_STATES),
  })
  .test(
    fieldRule<{ rodLengthIn?: number; strokeIn?: number }>(
      'rod-stroke',
      'rodLengthIn',
      `rod length must be at least ${B.rodStrokeRatio.min} times the stroke`,
      (e) =>
        !isFiniteNumber(e.rodLengthIn) ||
        !isFiniteNumber(e.strokeIn) ||
        e.rodLengthIn / e.strokeIn >= B.rodStrokeRatio.min,
    ),
  );

const exhaust = yup.object({
  headers: oneOfList('headers', HEADER_TYPES),
  primaryIn: maybe('header primary tube diameter', 'in', B.primaryIn),
  system: oneOfList('exhaust system', EXHAUST_SYSTEMS),
});

const drivetrain = yup
  .object({
    transmission: oneOfList('transmission', TRANSMISSIONS),
    stallRpm: maybe('converter stall speed', 'rpm', B.stallRpm),
    launchRpm: maybe('launch rpm', 'rpm', B.launchRpm),
    axleRatio: needed('axle ratio', ':1', B.axleRatio),
    topGearRatio: needed('top gear ratio', ':1', B.topGearRatio),
    tireDiameterIn: needed('tyre diameter', 'in', B.tireDiameterIn),
  })
  .test(
    fieldRule<{ transmission?: string; stallRpm?: number }>(
      'automatic-stall',
      'stallRpm',
      `an automatic needs its converter stall speed (at least ${B.stallRpm.automaticMin} rpm)`,
      // A stall that is not a number, or outside 0–6,000, already has its own message.
      (d) =>
        d.transmission !== 'automatic' ||
        (d.stallRpm !== undefined && (!isFiniteNumber(d.stallRpm) || d.stallRpm >= B.stallRpm.automaticMin)),
    ),
  );

const vehicle = yup.object({
  weightLb: needed('vehicle weight', 'lb', B.weightLb),
  powerBrakes: oneOfList('power brakes', POWER_BRAKES),
  class: yup.string().oneOf([...VEHICLE_CLASSES], `vehicle class must be one of: ${VEHICLE_CLASSES.join(', ')}`),
});

const use = yup.object({
  primary: oneOfList('primary use', PRIMARY_USES),
  idle: oneOfList('idle wish', IDLE_WISHES),
  fuelOctane: needed('fuel octane (pump, (R+M)/2)', 'AKI', B.fuelOctane),
  emissionsRequired: yup.boolean().required('emissionsRequired is required'),
  cruiseMph: needed('cruise speed', 'mph', B.cruiseMph),
  budgetCents: maybe('budget', 'cents', B.budgetCents).integer('budget must be a whole number of cents'),
});

const advertisedLonger = (side: 'intake' | 'exhaust') =>
  fieldRule<Record<string, unknown>>(
    `${side}-advertised`,
    `${side}Advertised`,
    `${side} advertised duration must be longer than the duration at 0.050"`,
    (c) => {
      const advertised = c[`${side}Advertised`];
      const at050 = c[`${side}Duration050`];
      return !isFiniteNumber(advertised) || !isFiniteNumber(at050) || advertised > at050;
    },
  );

const baselineCam = yup
  .object({
    name: textField('name', C.nameMaxLength),
    intakeDuration050: needed('intake duration at 0.050"', 'deg', C.duration050Deg),
    exhaustDuration050: needed('exhaust duration at 0.050"', 'deg', C.duration050Deg),
    intakeAdvertised: maybe('intake advertised duration', 'deg', C.advertisedDeg),
    exhaustAdvertised: maybe('exhaust advertised duration', 'deg', C.advertisedDeg),
    intakeLiftIn: needed('intake lift at the valve', 'in', C.liftIn),
    exhaustLiftIn: needed('exhaust lift at the valve', 'in', C.liftIn),
    lsa: needed('lobe separation angle', 'deg', C.lsaDeg),
    intakeCenterline: needed('installed intake centerline', 'deg', C.intakeCenterlineDeg),
    rockerRatio: maybe('rocker ratio', ':1', C.rockerRatio),
    springMaxLiftIn: maybe('spring max lift', 'in', C.springMaxLiftIn),
  })
  .test(advertisedLonger('intake'))
  .test(advertisedLonger('exhaust'));

type ProfileNumbers = {
  use?: { cruiseMph?: number };
  drivetrain?: { axleRatio?: number; topGearRatio?: number; tireDiameterIn?: number };
};
const CRUISE_FIELDS = [
  ['use', 'cruiseMph'],
  ['drivetrain', 'axleRatio'],
  ['drivetrain', 'topGearRatio'],
  ['drivetrain', 'tireDiameterIn'],
] as const;
// The interview never sets a valvetrain, so the stock hydraulic limit applies (as the zod schema's default does).
const CRUISE_LIMIT_RPM = VALVETRAIN_LIMIT_RPM['stock-hydraulic'];
const inRange = (v: unknown, range: { min: number; max: number }): v is number =>
  isFiniteNumber(v) && v >= range.min && v <= range.max;

/** The cruise the gearing implies, when every figure it needs is itself in range; null otherwise. */
function cruiseRpmOf(p: ProfileNumbers): number | null {
  const mph = p.use?.cruiseMph,
    axle = p.drivetrain?.axleRatio,
    gear = p.drivetrain?.topGearRatio,
    tyre = p.drivetrain?.tireDiameterIn;
  if (
    !inRange(mph, B.cruiseMph) ||
    !inRange(axle, B.axleRatio) ||
    !inRange(gear, B.topGearRatio) ||
    !inRange(tyre, B.tireDiameterIn)
  )
    return null;
  return cruiseRpm(mph, axle, gear, tyre);
}

const profile = yup
  .object({ engine, exhaust, drivetrain, vehicle, use, baselineCam })
  .test('cruise-rpm', '', function (value) {
    const rpm = value ? cruiseRpmOf(value as ProfileNumbers) : null;
    if (rpm === null || rpm <= CRUISE_LIMIT_RPM) return true;
    const mph = (value as ProfileNumbers).use!.cruiseMph!;
    const message = `cruising at ${mph} mph works out to ${Math.round(rpm).toLocaleString('en-US')} rpm, past the engine's ${CRUISE_LIMIT_RPM.toLocaleString('en-US')} rpm limit: check the axle ratio, top gear ratio and tyre diameter`;
    const prefix = this.path ? `${this.path}.` : '';
    return new yup.ValidationError(
      CRUISE_FIELDS.map(([group, field]) => this.createError({ path: `${prefix}${group}.${field}`, message })),
    );
  });

const L = CUSTOMER_LIMITS;
const optionalText = (label: string, maxLength: number) => textUpTo(label, maxLength);
const customer = yup.object({
  name: textField('name', L.nameMaxLength),
  email: optionalText('e-mail', L.emailMaxLength).test(
    'email',
    'e-mail must look like name@example.com',
    (v) => !v?.trim() || yup.string().email().isValidSync(v.trim()),
  ),
  phone: optionalText('phone', L.phoneMaxLength).test(
    'phone',
    'phone may hold only digits, spaces and + ( ) . / -',
    (v) => !v?.trim() || /^[0-9+()./ -]+$/.test(v.trim()),
  ),
  notes: optionalText('notes', L.notesMaxLength),
});

const customerId = yup
  .number()
  .typeError('customerId must be a whole number (an id)')
  .integer('customerId must be a whole number (an id)')
  .positive('customerId must be a whole number (an id)');

const vehicleLabel = textField(
  'vehicle',
  BUILD_RECORD_LIMITS.vehicleLabelMaxLength,
  'vehicle must not be empty (year, body, engine, e.g. "2012 pickup, 5.3 L")',
);

/** A new build: a picked customer or a new one (never neither), the vehicle and the profile. */
const createChecks = yup
  .object({ customerId, customer: customer.default(undefined), vehicleLabel, profile })
  .test(
    fieldRule<{ customerId?: number; customer?: object }>(
      'customer',
      'customerId',
      'pick a customer (customerId) or enter a new one (customer)',
      (b) => b.customerId !== undefined || b.customer !== undefined,
    ),
  );
/** A saved build's changes: the customer is fixed, so only its id travels. */
const editChecks = yup.object({ customerId: customerId.required('customerId is required'), vehicleLabel, profile });

/** The interview's payload checked as the server will: field path → message, the first per field. */
export const buildPayloadChecks = {
  create: validateWithYup<Record<string, unknown>>(createChecks),
  edit: validateWithYup<Record<string, unknown>>(editChecks),
};
