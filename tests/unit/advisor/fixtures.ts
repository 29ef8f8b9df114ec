import { CALIBRATION_ENGINE } from '@/lib/advisor/calibration';
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

// The dyno engine the model was calibrated on (src/lib/advisor/calibration.ts: a 5.3 L block bored to
// 3.900", ported cathedral heads, long tubes, open collectors), without the head and valvetrain presets,
// so the tests exercise the plain typed-in figures.
const { headPreset: _head, valvetrain: _valvetrain, ...dynoEngine } = CALIBRATION_ENGINE.engine;
void _head;
void _valvetrain;
export const dynoInput: BuildProfileInput = { ...CALIBRATION_ENGINE, engine: dynoEngine, baselineCam: stockTruckCam };
export const dynoBuild = build(dynoInput);

/** The dyno build with some fields changed (validated again). */
export function variant(p: ProfilePatch, base: BuildProfileInput = dynoInput): BuildProfile {
  return build(patchProfile(base, p));
}
