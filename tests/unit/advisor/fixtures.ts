import { patchProfile, STOCK_TRUCK_CAM, type ProfilePatch } from '@/lib/builds/sample-trucks';
import { BuildProfileSchema, type BuildProfile, type BuildProfileInput } from '@/lib/schemas/build-profile';
import { CamCardSchema, type CamCard, type CamCardInput } from '@/lib/schemas/cam-card';

// Test fixtures go through the real schemas, so they are always schema-valid inputs.
export const cam = (c: CamCardInput): CamCard => CamCardSchema.parse(c);
export const build = (b: BuildProfileInput): BuildProfile => BuildProfileSchema.parse(b);

// The stock truck cam (about 190°/191° at 0.050"), written once in src/lib/builds/sample-trucks.ts.
export const stockTruckCam = cam(STOCK_TRUCK_CAM);
// "A truck-oriented cam of about 212° intake": exhaust, lift, LSA and ICL are our plausible picks.
export const truckCam = cam({
  id: 'truck-212',
  name: 'Invented truck grind 212',
  intakeDuration050: 212,
  exhaustDuration050: 218,
  intakeLiftIn: 0.565,
  exhaustLiftIn: 0.565,
  lsa: 113,
  intakeCenterline: 109,
  priceCents: 41900,
});
// "A bigger cam of 219°/225°": lift, LSA and ICL are our plausible picks.
export const bigCam = cam({
  id: 'big-219',
  name: 'Invented big truck grind 219',
  intakeDuration050: 219,
  exhaustDuration050: 225,
  intakeLiftIn: 0.595,
  exhaustLiftIn: 0.595,
  lsa: 113,
  intakeCenterline: 109,
  priceCents: 43900,
});

// The dyno engine: a 5.3 L truck block bored to 3.900" (5.7 L), 3.622" stroke, 6.098" rod (maker's
// published specs, from memory), CNC-ported cathedral heads — 290 cfm at 28 inH2O is our plausible
// pick from memory, not a measurement — truck intake, 1-7/8" long tubes, short open collectors.
// 10.0:1 static compression is our estimate for the bored block.
export const dynoInput: BuildProfileInput = {
  engine: {
    cylinders: 8,
    boreIn: 3.9,
    strokeIn: 3.622,
    rodLengthIn: 6.098,
    compressionRatio: 10.0,
    headMaterial: 'aluminum',
    intakeFlowCfm: 290,
    intakeManifold: 'truck',
    cylinderDeactivation: 'deleted',
  },
  exhaust: { headers: 'long-tube', primaryIn: 1.875, system: 'open-short' },
  drivetrain: { transmission: 'automatic', stallRpm: 2200, axleRatio: 3.73, topGearRatio: 0.7, tireDiameterIn: 31 },
  vehicle: { weightLb: 5200, powerBrakes: 'vacuum' },
  use: {
    primary: 'daily',
    idle: 'smooth',
    fuelOctane: 91,
    emissionsRequired: false,
    cruiseMph: 70,
    budgetCents: 300000,
  },
  baselineCam: stockTruckCam,
};
export const dynoBuild = build(dynoInput);

/** The dyno build with some fields changed (validated again). */
export function variant(p: ProfilePatch, base: BuildProfileInput = dynoInput): BuildProfile {
  return build(patchProfile(base, p));
}
