import type { BuildProfileInput } from '@/lib/schemas/build-profile';
import type { CamCardInput } from '@/lib/schemas/cam-card';
import { ENGINE_PRESETS } from './interview-values';

// Invented example builds on the stock 5.3 L truck engine, written once for the advisor bench
// (src/cli/bench-advisor.ts) and the tests that need "a plausible truck": the engine is the interview's
// own 5.3 L preset (stock figures from memory, approximate), so an example never drifts from the form.

const preset53 = ENGINE_PRESETS.find((p) => p.liters === 5.3)!;
const { liters: _liters, label: _label, ...engine53 } = preset53;
void _liters;
void _label;

/** The stock 5.3 L engine as the interview's preset fills it in (cylinder deactivation active). */
export const STOCK_53_ENGINE: BuildProfileInput['engine'] = { cylinders: 8, ...engine53 };

// Stock truck cam about 190°/191° at 0.050", 0.467"/0.479" lift, 114.5° LSA, installed straight up
// (common practice, no published source; values from memory).
export const STOCK_TRUCK_CAM: CamCardInput = {
  id: 'stock',
  name: 'Stock truck cam (approximate)',
  intakeDuration050: 190,
  exhaustDuration050: 191,
  intakeLiftIn: 0.467,
  exhaustLiftIn: 0.479,
  lsa: 114.5,
  intakeCenterline: 114.5,
};

/** A stock towing truck as the counter interview sends it: manifolds, cats, the stock card typed in. */
export function towingTruck(): BuildProfileInput {
  return {
    engine: { ...STOCK_53_ENGINE },
    exhaust: { headers: 'manifold', system: 'full-with-cats' },
    drivetrain: { transmission: 'automatic', stallRpm: 2000, axleRatio: 3.42, topGearRatio: 0.7, tireDiameterIn: 31 },
    vehicle: { weightLb: 5200, powerBrakes: 'vacuum' },
    use: {
      primary: 'towing',
      idle: 'smooth',
      fuelOctane: 87,
      emissionsRequired: true,
      cruiseMph: 65,
      budgetCents: 350000,
    },
    baselineCam: { ...STOCK_TRUCK_CAM, id: 'typed', name: 'Stock card as typed' },
  };
}

/** A daily-driven 5.3 L truck with long tubes and a full exhaust, deactivation switched off (the bench's build). */
export function dailyTruck(): BuildProfileInput {
  return {
    engine: { ...STOCK_53_ENGINE, cylinderDeactivation: 'none' },
    exhaust: { headers: 'long-tube', primaryIn: 1.75, system: 'full' },
    drivetrain: { transmission: 'automatic', stallRpm: 2200, axleRatio: 3.73, topGearRatio: 0.7, tireDiameterIn: 31 },
    vehicle: { weightLb: 5200, powerBrakes: 'vacuum' },
    use: {
      primary: 'daily',
      idle: 'smooth',
      fuelOctane: 91,
      emissionsRequired: false,
      cruiseMph: 70,
      budgetCents: 250000,
    },
    baselineCam: { ...STOCK_TRUCK_CAM },
  };
}

export type ProfilePatch = {
  engine?: Partial<BuildProfileInput['engine']>;
  exhaust?: Partial<BuildProfileInput['exhaust']>;
  drivetrain?: Partial<BuildProfileInput['drivetrain']>;
  vehicle?: Partial<BuildProfileInput['vehicle']>;
  use?: Partial<BuildProfileInput['use']>;
  baselineCam?: CamCardInput;
};

/** `base` with some fields of each part replaced (not validated: the caller parses it). */
export function patchProfile(base: BuildProfileInput, p: ProfilePatch): BuildProfileInput {
  return {
    ...base,
    engine: { ...base.engine, ...p.engine },
    exhaust: { ...base.exhaust, ...p.exhaust },
    drivetrain: { ...base.drivetrain, ...p.drivetrain },
    vehicle: { ...base.vehicle, ...p.vehicle },
    use: { ...base.use, ...p.use },
    baselineCam: p.baselineCam ?? base.baselineCam,
  } as BuildProfileInput;
}
