import type { BuildProfile } from '@/lib/schemas/build-profile';

// The one scoring table. docs/advisor.md prints the same table and a test keeps the two in step.
// Weights are our choice: what a counter person weighs first when talking a customer through a cam.
export const SCORING_WEIGHTS = {
  powerband: 30, // torque where this customer drives, against the cam in the engine now
  converter: 15, // crossover against converter stall (or the launch rpm with a manual)
  idle: 15, // idle quality and vacuum against the wish and the brakes
  compression: 10, // dynamic compression against fuel octane and head material
  fit: 10, // springs, piston-to-valve, cylinder deactivation
  emissions: 10, // certification where the vehicle must stay road-legal
  cost: 10, // price against the budget
} as const;

export type SubscoreName = keyof typeof SCORING_WEIGHTS;
export const SUBSCORE_NAMES = Object.keys(SCORING_WEIGHTS) as SubscoreName[];

/** A cam that is not certified where emissions are required cannot score above this (our choice). */
export const EMISSIONS_GATE_MAX_SCORE = 30;

type Use = BuildProfile['use']['primary'];
export type RpmBand = { fromRpm: number; toRpm: number; weight: number };

// Where each kind of use spends its time at wide-open or heavy throttle (our choice, from how such
// vehicles are commonly driven; no published source). Weight per 100-rpm step of the curve.
export const USE_BANDS: Record<Use, RpmBand[]> = {
  daily: [
    { fromRpm: 1500, toRpm: 3000, weight: 3 },
    { fromRpm: 3000, toRpm: 4500, weight: 2 },
    { fromRpm: 4500, toRpm: 6000, weight: 0.5 },
    { fromRpm: 6000, toRpm: 7001, weight: 0.1 },
  ],
  towing: [
    { fromRpm: 1500, toRpm: 3000, weight: 4 },
    { fromRpm: 3000, toRpm: 4500, weight: 2 },
    { fromRpm: 4500, toRpm: 7001, weight: 0.2 },
  ],
  street: [
    { fromRpm: 1500, toRpm: 2500, weight: 1 },
    { fromRpm: 2500, toRpm: 4500, weight: 2 },
    { fromRpm: 4500, toRpm: 6500, weight: 2.5 },
    { fromRpm: 6500, toRpm: 7001, weight: 1 },
  ],
  strip: [
    { fromRpm: 1500, toRpm: 3000, weight: 0.2 },
    { fromRpm: 3000, toRpm: 4500, weight: 1 },
    { fromRpm: 4500, toRpm: 7001, weight: 3 },
  ],
};

/** Daily and towing vehicles also live at cruise: a bump of this weight, ±300 rpm wide (our choice). */
export const CRUISE_BUMP = { daily: 4, towing: 4, street: 0, strip: 0, widthRpm: 300 } as const;

/** Below the pull-away rpm (stall or launch) the engine spends little time under full load. */
export const BELOW_PULL_AWAY_FACTOR = 0.3;

/** Heavier vehicles lean on low-rpm torque: weights below 3,000 rpm scale with weight / 4,500 lb. */
export const HEAVY_VEHICLE = { refWeightLb: 4500, belowRpm: 3000, minFactor: 0.7, maxFactor: 1.6 } as const;

/** Powerband score: 50 + 50 · tanh(average torque change % / 10): 50 at no change, ~88 at +10 %. */
export const POWERBAND_SCALE_PCT = 10;

/** Converter / launch: full marks within 200 rpm of the crossover, then points lost per rpm. */
export const CONVERTER_SCORING = {
  toleranceRpm: 200,
  automaticPointsPerRpm: 0.08,
  manualPointsPerRpm: 0.05,
  neverCrossesScore: 40,
  // A converter is suggested when the crossover sits more than this above the stall (our choice).
  suggestConverterAboveStallRpm: 400,
} as const;

/** Idle: points lost per inHg outside what the wish wants; vacuum brakes lose more below 15 inHg. */
export const IDLE_SCORING = {
  smooth: { wantAtLeastInHg: 15, pointsPerInHgShort: 10 },
  noticeable: { wantFromInHg: 11, wantToInHg: 14.5, pointsPerInHgShort: 10, pointsPerInHgMild: 5 },
  aggressive: { wantAtMostInHg: 11, pointsPerInHgMild: 10 },
  brakePointsPerInHgShort: 5,
} as const;

/**
 * Dynamic compression window for pump gas, common practice (values from memory): about 7.5–8.5:1,
 * iron heads at the low end, aluminium tolerating more; each octane point (AKI) moves the top by 0.1.
 * The tops are set so the factory combinations we remember pass on their factory fuel, with this
 * module's seat timing (docs/advisor.md lists them: a 5.3 L truck at 9.9:1 on 87 works out to 8.4:1).
 */
export const COMPRESSION_SCORING = {
  iron: { minDcr: 7.2, maxDcrAt91: 8.4 },
  aluminum: { minDcr: 7.5, maxDcrAt91: 8.9 },
  refOctane: 91,
  maxDcrPerOctane: 0.1,
  pointsPerDcrOver: 40,
  pointsPerDcrUnder: 25,
} as const;

/** Fit risks (our choice of points; the thresholds are common practice, values from memory). */
export const FIT_SCORING = {
  springsNeededPoints: 15,
  // Installed springs with no stated limit are assumed good to the baseline lift plus this margin.
  assumedSpringMarginIn: 0.05,
  // Piston-to-valve risk index: lift past 0.580" per 0.040", plus 0.050" overlap past −5° per 8°.
  ptvLiftFromIn: 0.58,
  ptvLiftStepIn: 0.04,
  ptvOverlapFromDeg: -5,
  ptvOverlapStepDeg: 8,
  ptvPointsPerUnit: 10,
  ptvMaxPoints: 30,
  deactivationDeletePoints: 35,
} as const;

/** Cost: with no part prices known, the cam alone should stay within about a third of the budget. */
export const COST_SCORING = {
  camShareOfBudget: 0.35,
  fullMarksBelowRatio: 0.8,
  zeroAtRatio: 1.25,
  noPriceScore: 50,
} as const;
