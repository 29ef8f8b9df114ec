import { z } from 'zod';
import { cruiseRpm } from '@/lib/advisor/drivetrain';
import { VALVETRAIN_LIMIT_RPM } from '@/lib/advisor/rpm-grid';
import { boundedNumber, CamCardSchema, presence } from './cam-card';

// The customer's combination as the counter interview captures it. Every number carries its unit in
// the name; the limits are physical sanity bounds for pushrod V8 work, shared with the forms.
export const BUILD_LIMITS = {
  cylinders: { min: 4, max: 12 },
  boreIn: { min: 2.5, max: 4.6 },
  strokeIn: { min: 2.5, max: 4.5 },
  rodLengthIn: { min: 4.5, max: 7.5 },
  // Rod length over stroke: below about 1.4 the slider-crank geometry stops being a real engine.
  rodStrokeRatio: { min: 1.4 },
  compressionRatio: { min: 7, max: 14 },
  intakeFlowCfm: { min: 120, max: 450 },
  primaryIn: { min: 1.375, max: 2.5, default: 1.75 },
  // 0 means "no converter" (a manual); an automatic needs a real stall speed.
  stallRpm: { min: 0, max: 6000, automaticMin: 1000 },
  launchRpm: { min: 1000, max: 7000 },
  axleRatio: { min: 2, max: 6.5 },
  topGearRatio: { min: 0.4, max: 1.5 },
  tireDiameterIn: { min: 20, max: 40 },
  weightLb: { min: 1500, max: 12000 },
  fuelOctane: { min: 80, max: 120 },
  cruiseMph: { min: 20, max: 90 },
  budgetCents: { min: 0, max: 100_000_000 },
  valveIn: { min: 1.2, max: 2.6 },
  flowSheetLiftIn: { min: 0.01, max: 1.0 },
  flowSheetCfm: { min: 1, max: 600 },
  flowSheetPoints: { min: 2, max: 40 },
  primaryLengthIn: { min: 4, max: 60 },
} as const;

export const HEAD_MATERIALS = ['iron', 'aluminum'] as const;
export const INTAKE_MANIFOLDS = ['truck', 'car', 'single-plane'] as const;
export const DEACTIVATION_STATES = ['none', 'active', 'deleted'] as const;
export const HEADER_TYPES = ['manifold', 'shorty', 'long-tube'] as const;
export const EXHAUST_SYSTEMS = ['full', 'full-with-cats', 'open-short'] as const;
export const TRANSMISSIONS = ['automatic', 'manual'] as const;
export const POWER_BRAKES = ['vacuum', 'hydraulic', 'none'] as const;
export const PRIMARY_USES = ['daily', 'towing', 'street', 'strip'] as const;
export const IDLE_WISHES = ['smooth', 'noticeable', 'aggressive'] as const;
export const HEAD_PRESETS = ['stock-cathedral', 'ported-cathedral', 'stock-rectangle', 'ported-rectangle'] as const;
/** What limits the engine's safe rpm: stock hydraulic valvetrain, upgraded springs, or a solid roller. */
export const VALVETRAINS = ['stock-hydraulic', 'upgraded-hydraulic', 'solid-roller'] as const;
export const FUELS = ['gasoline', 'e85'] as const;
/** Body class (profile schema 2): the rules price cam-install labour and parts by it. */
export const VEHICLE_CLASSES = ['truck', 'suv', 'van', 'car'] as const;
export type VehicleClass = (typeof VEHICLE_CLASSES)[number];

const B = BUILD_LIMITS;

/** A head's flow-bench sheet: cfm at 28 inH2O against valve lift, lifts rising. */
export const FlowSheetSchema = z
  .array(
    z.strictObject({
      liftIn: boundedNumber('flow sheet lift', 'in', B.flowSheetLiftIn),
      cfm: boundedNumber('flow sheet flow at 28 inH2O', 'cfm', B.flowSheetCfm),
    }),
    { error: 'a flow sheet must be a list of { liftIn, cfm } points' },
  )
  .min(B.flowSheetPoints.min, { error: `a flow sheet needs at least ${B.flowSheetPoints.min} points` })
  .max(B.flowSheetPoints.max, { error: `a flow sheet takes at most ${B.flowSheetPoints.max} points` })
  .refine((pts) => pts.every((p, i) => i === 0 || p.liftIn > pts[i - 1].liftIn), {
    error: 'flow sheet lifts must rise from one point to the next',
  });

function oneOf<T extends readonly [string, ...string[]]>(label: string, values: T) {
  return z.enum(values, { error: presence(label, `one of: ${values.join(', ')}`) });
}

export const EngineSchema = z
  .strictObject(
    {
      cylinders: boundedNumber('cylinders', 'cylinders', B.cylinders).int({
        error: 'cylinders must be a whole number',
      }),
      boreIn: boundedNumber('bore', 'in', B.boreIn),
      strokeIn: boundedNumber('stroke', 'in', B.strokeIn),
      rodLengthIn: boundedNumber('rod length', 'in', B.rodLengthIn),
      compressionRatio: boundedNumber('static compression ratio', ':1', B.compressionRatio),
      headMaterial: oneOf('head material', HEAD_MATERIALS),
      intakeFlowCfm: boundedNumber('intake port flow at 28 inH2O', 'cfm', B.intakeFlowCfm),
      intakeManifold: oneOf('intake manifold', INTAKE_MANIFOLDS),
      cylinderDeactivation: oneOf('cylinder deactivation', DEACTIVATION_STATES),
      // Added in profile schema 2, all optional: the head as the cycle model sees it, and the valvetrain.
      headPreset: oneOf('head preset', HEAD_PRESETS).optional(),
      intakeValveIn: boundedNumber('intake valve diameter', 'in', B.valveIn).optional(),
      exhaustValveIn: boundedNumber('exhaust valve diameter', 'in', B.valveIn).optional(),
      intakeFlowSheet: FlowSheetSchema.optional(),
      exhaustFlowSheet: FlowSheetSchema.optional(),
      valvetrain: oneOf('valvetrain', VALVETRAINS).optional(),
    },
    { error: presence('engine', 'an object') },
  )
  .refine((e) => e.rodLengthIn / e.strokeIn >= B.rodStrokeRatio.min, {
    path: ['rodLengthIn'],
    error: `rod length must be at least ${B.rodStrokeRatio.min} times the stroke`,
  });

export const ExhaustSchema = z.strictObject(
  {
    headers: oneOf('headers', HEADER_TYPES),
    // Ignored for cast manifolds; defaults to 1.75" for headers.
    primaryIn: boundedNumber('header primary tube diameter', 'in', B.primaryIn).optional(),
    // Schema 2: primary length; by header type when absent (see docs/advisor.md).
    primaryLengthIn: boundedNumber('header primary length', 'in', B.primaryLengthIn).optional(),
    system: oneOf('exhaust system', EXHAUST_SYSTEMS),
  },
  { error: presence('exhaust', 'an object') },
);

export const DrivetrainSchema = z
  .strictObject(
    {
      transmission: oneOf('transmission', TRANSMISSIONS),
      stallRpm: boundedNumber('converter stall speed', 'rpm', B.stallRpm).optional(),
      // Manual only: the rpm the driver launches at. Defaults by use (see docs/advisor.md).
      launchRpm: boundedNumber('launch rpm', 'rpm', B.launchRpm).optional(),
      axleRatio: boundedNumber('axle ratio', ':1', B.axleRatio),
      topGearRatio: boundedNumber('top gear ratio', ':1', B.topGearRatio),
      tireDiameterIn: boundedNumber('tyre diameter', 'in', B.tireDiameterIn),
    },
    { error: presence('drivetrain', 'an object') },
  )
  .refine(
    (d) => d.transmission !== 'automatic' || (d.stallRpm !== undefined && d.stallRpm >= B.stallRpm.automaticMin),
    {
      path: ['stallRpm'],
      error: `an automatic needs its converter stall speed (at least ${B.stallRpm.automaticMin} rpm)`,
    },
  );

export const VehicleSchema = z.strictObject(
  {
    weightLb: boundedNumber('vehicle weight', 'lb', B.weightLb),
    powerBrakes: oneOf('power brakes', POWER_BRAKES),
    // Optional: a profile without it reads as vehicleClassOf() says.
    class: oneOf('vehicle class', VEHICLE_CLASSES).optional(),
  },
  { error: presence('vehicle', 'an object') },
);

export const UseSchema = z.strictObject(
  {
    primary: oneOf('primary use', PRIMARY_USES),
    idle: oneOf('idle wish', IDLE_WISHES),
    fuelOctane: boundedNumber('fuel octane (pump, (R+M)/2)', 'AKI', B.fuelOctane),
    // Schema 2: gasoline unless the customer runs E85.
    fuel: oneOf('fuel', FUELS).optional(),
    emissionsRequired: z.boolean({ error: presence('emissionsRequired', 'true or false') }),
    cruiseMph: boundedNumber('cruise speed', 'mph', B.cruiseMph),
    // Optional: a customer who is "not sure" gives none, and none is stored as 0, which the advisor already
    // reads as "no budget was given" (it then judges no cam against a figure the customer never named).
    budgetCents: boundedNumber('budget', 'cents', B.budgetCents)
      .int({ error: 'budget must be a whole number of cents' })
      .default(0),
  },
  { error: presence('use', 'an object') },
);

export const BuildProfileSchema = z
  .strictObject(
    {
      engine: EngineSchema,
      exhaust: ExhaustSchema,
      drivetrain: DrivetrainSchema,
      vehicle: VehicleSchema,
      use: UseSchema,
      // The cam in the engine now; its springMaxLiftIn, when given, is the limit of the springs installed now.
      baselineCam: CamCardSchema,
    },
    { error: presence('build profile', 'an object') },
  )
  // A cruise the engine cannot turn is a typo in the gearing, not a build to advise on.
  .superRefine((b, ctx) => {
    const rpm = cruiseRpm(
      b.use.cruiseMph,
      b.drivetrain.axleRatio,
      b.drivetrain.topGearRatio,
      b.drivetrain.tireDiameterIn,
    );
    const limit = VALVETRAIN_LIMIT_RPM[b.engine.valvetrain ?? 'stock-hydraulic'];
    if (rpm > limit) {
      const message = `cruising at ${b.use.cruiseMph} mph works out to ${Math.round(rpm).toLocaleString('en-US')} rpm, past the engine's ${limit.toLocaleString('en-US')} rpm limit: check the axle ratio, top gear ratio and tyre diameter`;
      for (const path of [
        ['use', 'cruiseMph'],
        ['drivetrain', 'axleRatio'],
        ['drivetrain', 'topGearRatio'],
        ['drivetrain', 'tireDiameterIn'],
      ])
        ctx.addIssue({ code: 'custom', path, message });
    }
  });

/** A validated build profile (defaults applied inside the baseline cam card). */
export type BuildProfile = z.output<typeof BuildProfileSchema>;
export type BuildProfileInput = z.input<typeof BuildProfileSchema>;

/**
 * The vehicle class, or the default when the profile does not say: a truck-style intake means a truck
 * engine (pickups and SUVs share it, and their cam swaps are priced alike), anything else a car.
 */
export function vehicleClassOf(profile: {
  vehicle: { class?: VehicleClass };
  engine: { intakeManifold: string };
}): VehicleClass {
  return profile.vehicle.class ?? (profile.engine.intakeManifold === 'truck' ? 'truck' : 'car');
}
