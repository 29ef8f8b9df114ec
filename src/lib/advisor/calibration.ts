import type { BuildProfile } from '@/lib/schemas/build-profile';
import type { CamCard } from '@/lib/schemas/cam-card';

// The check data the model's few physical constants were fitted on, and the data held out from the fit.
// Facts of the trade, measured on an engine dyno, no published source; values from memory (docs/advisor.md).
// The engine: a 5.3 L truck block bored to 3.900" (5.7 L), 3.622" stroke, 6.098" rod, CNC-ported
// cathedral heads (290 cfm is our plausible pick, not a measurement), a truck intake, 1-7/8" long tubes
// and short open collectors; 10.0:1 is our estimate; 91 octane our pick.

export const CALIBRATION_ENGINE: Omit<BuildProfile, 'baselineCam'> = {
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
    headPreset: 'ported-cathedral',
    valvetrain: 'upgraded-hydraulic',
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
};

const card = (c: Omit<CamCard, 'rockerRatio'>): CamCard => ({ rockerRatio: 1.7, ...c });

/** Stock truck cam about 190°/191° at 0.050", 0.467"/0.479", 114.5° LSA (installed straight up, our pick). */
export const CALIBRATION_STOCK_CAM = card({
  id: 'stock',
  name: 'Stock truck cam (approximate)',
  intakeDuration050: 190,
  exhaustDuration050: 191,
  intakeLiftIn: 0.467,
  exhaustLiftIn: 0.479,
  lsa: 114.5,
  intakeCenterline: 114.5,
});
/** "A truck cam of about 212° intake": exhaust, lift, LSA and ICL are our plausible picks. */
export const CALIBRATION_TRUCK_CAM = card({
  id: 'truck-212',
  name: 'Invented truck grind 212',
  intakeDuration050: 212,
  exhaustDuration050: 218,
  intakeLiftIn: 0.565,
  exhaustLiftIn: 0.565,
  lsa: 113,
  intakeCenterline: 109,
});
/** "A bigger cam of 219°/225°": lift, LSA and ICL are our plausible picks. */
export const CALIBRATION_BIG_CAM = card({
  id: 'big-219',
  name: 'Invented big truck grind 219',
  intakeDuration050: 219,
  exhaustDuration050: 225,
  intakeLiftIn: 0.595,
  exhaustLiftIn: 0.595,
  lsa: 113,
  intakeCenterline: 109,
});

export type PeakFact = { cam: CamCard; quantity: 'peakHp' | 'peakTorqueLbFt'; value: number; set: 'fit' | 'held-out' };

/** Peak figures: three fit the constants, the rest are held out and only reported. */
export const PEAK_FACTS: PeakFact[] = [
  { cam: CALIBRATION_STOCK_CAM, quantity: 'peakHp', value: 401, set: 'fit' },
  { cam: CALIBRATION_STOCK_CAM, quantity: 'peakTorqueLbFt', value: 432, set: 'fit' },
  { cam: CALIBRATION_BIG_CAM, quantity: 'peakHp', value: 482, set: 'fit' },
  { cam: CALIBRATION_TRUCK_CAM, quantity: 'peakHp', value: 469, set: 'held-out' },
  { cam: CALIBRATION_BIG_CAM, quantity: 'peakTorqueLbFt', value: 462, set: 'held-out' },
];

/** Held-out shape facts: where curves cross (rpm), never used in the fit. */
export const CROSSING_FACTS = [
  {
    candidate: CALIBRATION_BIG_CAM,
    against: CALIBRATION_STOCK_CAM,
    rpm: 3100,
    what: 'the 219° cam loses to stock below about 3,100 rpm',
  },
  {
    candidate: CALIBRATION_BIG_CAM,
    against: CALIBRATION_TRUCK_CAM,
    rpm: 4250,
    what: 'the 212° cam out-pulls the 219° below about 4,200–4,300 rpm',
  },
] as const;
