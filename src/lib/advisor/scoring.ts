import type { BuildProfile } from '@/lib/schemas/build-profile';
import type { CamCard } from '@/lib/schemas/cam-card';
import { IDLE_VACUUM } from './idle';
import type { NeedKind } from './types';
import { springsCoverLift } from './needs';
import {
  BELOW_PULL_AWAY_FACTOR,
  COMPRESSION_SCORING,
  CONVERTER_SCORING,
  COST_SCORING,
  CRUISE_BUMP,
  EMISSIONS_GATE_MAX_SCORE,
  FIT_SCORING,
  HEAVY_VEHICLE,
  IDLE_SCORING,
  POWERBAND_SCALE_PCT,
  SCORING_WEIGHTS,
  SUBSCORE_NAMES,
  USE_BANDS,
  type SubscoreName,
} from './weights';

// Each sub-score is 0–100 and comes with the facts its reason sentence needs (see reasons.ts).

const clamp = (v: number, lo = 0, hi = 100) => Math.min(hi, Math.max(lo, v));

/** Weight of each rpm step for this customer's use; the same for every cam, so worked out once. */
export function powerbandWeights(
  build: BuildProfile,
  rpms: Float64Array,
  pullAwayRpm: number,
  cruiseRpm: number,
): Float64Array {
  const use = build.use.primary;
  const bands = USE_BANDS[use];
  const bump = CRUISE_BUMP[use];
  const heavy = clamp(
    build.vehicle.weightLb / HEAVY_VEHICLE.refWeightLb,
    HEAVY_VEHICLE.minFactor,
    HEAVY_VEHICLE.maxFactor,
  );
  const out = new Float64Array(rpms.length);
  for (let i = 0; i < rpms.length; i++) {
    const rpm = rpms[i];
    let w = 0;
    for (const b of bands) if (rpm >= b.fromRpm && rpm < b.toRpm) w += b.weight;
    if (rpm < pullAwayRpm) w *= BELOW_PULL_AWAY_FACTOR;
    if ((use === 'daily' || use === 'towing') && rpm < HEAVY_VEHICLE.belowRpm) w *= heavy;
    if (bump > 0) {
      const z = (rpm - cruiseRpm) / CRUISE_BUMP.widthRpm;
      w += bump * Math.exp(-z * z);
    }
    out[i] = w;
  }
  return out;
}

export type PowerbandDetail = { score: number; avgGainPct: number; bandFromRpm: number; bandToRpm: number };

// Weighted mean of torque change against the baseline over where this customer drives.
export function scorePowerband(
  weights: Float64Array,
  rpms: Float64Array,
  torque: Float64Array,
  baseline: Float64Array,
): PowerbandDetail {
  let sum = 0;
  let wsum = 0;
  let from = Infinity;
  let to = -Infinity;
  let maxW = 0;
  for (let i = 0; i < weights.length; i++) maxW = Math.max(maxW, weights[i]);
  for (let i = 0; i < weights.length; i++) {
    const w = weights[i];
    if (w <= 0 || baseline[i] <= 0) continue;
    sum += w * (torque[i] / baseline[i] - 1);
    wsum += w;
    // The band we name in the reason: where the weight is at least half its largest value.
    if (w >= maxW / 2) {
      from = Math.min(from, rpms[i]);
      to = Math.max(to, rpms[i]);
    }
  }
  const avgGainPct = wsum > 0 ? (sum / wsum) * 100 : 0;
  return {
    score: clamp(50 + 50 * Math.tanh(avgGainPct / POWERBAND_SCALE_PCT)),
    avgGainPct,
    bandFromRpm: Number.isFinite(from) ? from : rpms[0],
    bandToRpm: Number.isFinite(to) ? to : rpms[rpms.length - 1],
  };
}

export type ConverterDetail = {
  score: number;
  transmission: 'automatic' | 'manual';
  pullAwayRpm: number;
  crossoverRpm: number | null;
  crossoverRangeRpm: [number, number] | null;
  marginRpm: number | null; // crossover − pull-away
  aheadAtPullAway: boolean;
  lead: { fromRpm: number; toRpm: number } | null; // where it out-pulls the current cam, within the rev limit
  suggestedStallRpm: number | null;
};

// Crossover against converter stall (or launch rpm): full marks when the cam already pulls by then.
// A converter is a need only when even the earliest end of the crossover's range sits well above the stall.
export function scoreConverter(
  build: BuildProfile,
  pullAwayRpm: number,
  crossover: number | null,
  aheadAtPullAway: boolean,
  crossoverRange: [number, number] | null = null,
  lead: { fromRpm: number; toRpm: number } | null = null,
): ConverterDetail {
  const c = CONVERTER_SCORING;
  const transmission = build.drivetrain.transmission;
  const base = {
    transmission,
    pullAwayRpm,
    crossoverRpm: crossover,
    crossoverRangeRpm: crossoverRange,
    aheadAtPullAway,
    lead,
  };
  if (crossover === null) {
    // Leads somewhere below the limit without holding to it: judge it where it starts to lead.
    const from = lead?.fromRpm ?? null;
    const score = aheadAtPullAway
      ? 100
      : from !== null
        ? clamp(100 - Math.max(0, from - pullAwayRpm - c.toleranceRpm) * c.manualPointsPerRpm)
        : c.neverCrossesScore;
    return { ...base, score, marginRpm: null, suggestedStallRpm: null };
  }
  const margin = crossover - pullAwayRpm;
  const slope = transmission === 'automatic' ? c.automaticPointsPerRpm : c.manualPointsPerRpm;
  const score = clamp(100 - Math.max(0, margin - c.toleranceRpm) * slope);
  const earliest = crossoverRange ? crossoverRange[0] : crossover;
  const suggest =
    transmission === 'automatic' && earliest - pullAwayRpm > c.suggestConverterAboveStallRpm
      ? Math.ceil(crossover / 100) * 100
      : null;
  return { ...base, score, marginRpm: margin, suggestedStallRpm: suggest };
}

export type IdleDetail = {
  score: number;
  vacuumInHg: number;
  wish: BuildProfile['use']['idle'];
  brakesShortInHg: number;
};

// Idle vacuum against the customer's wish, then against vacuum brake assist.
export function scoreIdle(build: BuildProfile, vacuumInHg: number): IdleDetail {
  const wish = build.use.idle;
  const s = IDLE_SCORING;
  let score = 100;
  if (wish === 'smooth') score -= Math.max(0, s.smooth.wantAtLeastInHg - vacuumInHg) * s.smooth.pointsPerInHgShort;
  else if (wish === 'noticeable') {
    score -= Math.max(0, s.noticeable.wantFromInHg - vacuumInHg) * s.noticeable.pointsPerInHgShort;
    score -= Math.max(0, vacuumInHg - s.noticeable.wantToInHg) * s.noticeable.pointsPerInHgMild;
  } else score -= Math.max(0, vacuumInHg - s.aggressive.wantAtMostInHg) * s.aggressive.pointsPerInHgMild;
  const brakesShort =
    build.vehicle.powerBrakes === 'vacuum' ? Math.max(0, IDLE_VACUUM.brakeBoosterMinInHg - vacuumInHg) : 0;
  score -= brakesShort * s.brakePointsPerInHgShort;
  return { score: clamp(score), vacuumInHg, wish, brakesShortInHg: brakesShort };
}

export type CompressionDetail = { score: number; dcr: number; minDcr: number; maxDcr: number };

// Pump-gas dynamic compression window by head material, moved by octane (common practice).
export function compressionWindow(build: BuildProfile): { minDcr: number; maxDcr: number } {
  const c = COMPRESSION_SCORING;
  const m = c[build.engine.headMaterial];
  return { minDcr: m.minDcr, maxDcr: m.maxDcrAt91 + c.maxDcrPerOctane * (build.use.fuelOctane - c.refOctane) };
}

// Judged on the figures as the text shows them (one decimal), so the words never contradict the numbers.
const oneDp = (v: number) => Math.round(v * 10) / 10;

export function scoreCompression(build: BuildProfile, dcr: number): CompressionDetail {
  const c = COMPRESSION_SCORING;
  const window = compressionWindow(build);
  const [shown, minDcr, maxDcr] = [oneDp(dcr), oneDp(window.minDcr), oneDp(window.maxDcr)];
  const over = Math.max(0, shown - maxDcr);
  const under = Math.max(0, minDcr - shown);
  return { score: clamp(100 - over * c.pointsPerDcrOver - under * c.pointsPerDcrUnder), dcr: shown, minDcr, maxDcr };
}

export type FitDetail = {
  score: number;
  maxLiftIn: number;
  springLimitIn: number;
  springLimitAssumed: boolean;
  springsNeeded: boolean;
  ptvRisk: number; // index, 0 = none
  ptvLevel: 'low' | 'moderate' | 'high';
  deactivation: BuildProfile['engine']['cylinderDeactivation'];
  deleteNeeded: boolean;
};

/** The installed springs' limit: the baseline card's, else the baseline lift plus a margin. */
export function installedSpringLimitIn(build: BuildProfile): { limitIn: number; assumed: boolean } {
  const b = build.baselineCam;
  if (b.springMaxLiftIn !== undefined) return { limitIn: b.springMaxLiftIn, assumed: false };
  return { limitIn: Math.max(b.intakeLiftIn, b.exhaustLiftIn) + FIT_SCORING.assumedSpringMarginIn, assumed: true };
}

// Common practice, values from memory: piston-to-valve gets tighter with lift and with overlap.
export function pistonToValveRisk(maxLiftIn: number, overlap050Deg: number): number {
  const f = FIT_SCORING;
  return (
    Math.max(0, maxLiftIn - f.ptvLiftFromIn) / f.ptvLiftStepIn +
    Math.max(0, overlap050Deg - f.ptvOverlapFromDeg) / f.ptvOverlapStepDeg
  );
}

export function scoreFit(build: BuildProfile, cam: CamCard, overlap050: number): FitDetail {
  const f = FIT_SCORING;
  const maxLiftIn = Math.max(cam.intakeLiftIn, cam.exhaustLiftIn);
  const { limitIn, assumed } = installedSpringLimitIn(build);
  const springsNeeded = !springsCoverLift(limitIn, maxLiftIn);
  const ptvRisk = pistonToValveRisk(maxLiftIn, overlap050);
  const deleteNeeded = build.engine.cylinderDeactivation === 'active' && cam.deactivationCompatible !== true;
  const score =
    100 -
    (springsNeeded ? f.springsNeededPoints : 0) -
    Math.min(f.ptvMaxPoints, ptvRisk * f.ptvPointsPerUnit) -
    (deleteNeeded ? f.deactivationDeletePoints : 0);
  return {
    score: clamp(score),
    maxLiftIn,
    springLimitIn: limitIn,
    springLimitAssumed: assumed,
    springsNeeded,
    ptvRisk,
    ptvLevel: ptvRisk < 0.5 ? 'low' : ptvRisk < 1.5 ? 'moderate' : 'high',
    deactivation: build.engine.cylinderDeactivation,
    deleteNeeded,
  };
}

export type EmissionsDetail = { score: number; required: boolean; certified: boolean; gated: boolean };

export function scoreEmissions(build: BuildProfile, cam: CamCard): EmissionsDetail {
  const required = build.use.emissionsRequired;
  const certified = cam.emissionsCertified === true;
  const gated = required && !certified;
  return { score: gated ? 0 : 100, required, certified, gated };
}

/** wholeJob: jobCents is the shop's full job price before tax (labour and tune included). */
export type CostDetail = {
  score: number;
  priceCents: number | null;
  jobCents: number | null;
  budgetCents: number;
  partsPriced: boolean;
  wholeJob?: boolean;
};

// Price against the budget: the whole job when the shop priced it (or part prices are known), else the cam against its share.
export function scoreCost(
  build: BuildProfile,
  cam: CamCard,
  needKinds: NeedKind[],
  needPriceCents?: Partial<Record<NeedKind, number>>,
  jobPriceCents?: number | null,
): CostDetail {
  const c = COST_SCORING;
  const budget = build.use.budgetCents;
  if (cam.priceCents === undefined || jobPriceCents === null)
    return { score: c.noPriceScore, priceCents: null, jobCents: null, budgetCents: budget, partsPriced: false };
  const wholeJob = jobPriceCents !== undefined;
  const partsPriced = wholeJob || (needPriceCents !== undefined && Object.keys(needPriceCents).length > 0);
  let job = wholeJob ? jobPriceCents : cam.priceCents;
  if (partsPriced && !wholeJob) for (const k of needKinds) job += Math.max(0, needPriceCents?.[k] ?? 0);
  const allowance = partsPriced ? budget : budget * c.camShareOfBudget;
  let score: number;
  if (allowance <= 0) score = job <= 0 ? 100 : 0;
  else {
    const r = job / allowance;
    score = clamp((100 * (c.zeroAtRatio - r)) / (c.zeroAtRatio - c.fullMarksBelowRatio));
  }
  return { score, priceCents: cam.priceCents, jobCents: job, budgetCents: budget, partsPriced, wholeJob };
}

/** Weighted total from the one table; a cam that fails a required emissions check is capped. */
export function totalScore(subscores: Record<SubscoreName, number>, emissionsGated: boolean): number {
  let sum = 0;
  let wsum = 0;
  for (const k of SUBSCORE_NAMES) {
    sum += SCORING_WEIGHTS[k] * subscores[k];
    wsum += SCORING_WEIGHTS[k];
  }
  const total = sum / wsum;
  return emissionsGated ? Math.min(total, EMISSIONS_GATE_MAX_SCORE) : total;
}
