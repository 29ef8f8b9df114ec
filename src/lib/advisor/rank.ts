import type { BuildProfile } from '@/lib/schemas/build-profile';
import type { CamCard } from '@/lib/schemas/cam-card';
import { camCautions } from './cautions';
import { dynamicCompression } from './compression';
import { BAND, bandHalfWidthPct } from './bands';
import { aheadAt, crossoverRpm, leadStretch } from './crossover';
import { curvePeaks, curvePoints, percentChange, summarize } from './curve';
import { buildCruiseRpm, pullAwayRpm } from './drivetrain';
import { roundTo } from './format';
import { litresFromCubicInches, meanPistonSpeedFtMin } from './geometry';
import { blendHistory } from './history';
import { idleVacuumInHg } from './idle';
import { camNeeds } from './needs';
import { engineContext, torqueCurve, type EngineContext } from './prediction';
import {
  compressionReason,
  converterReason,
  costReason,
  emissionsReason,
  fitReason,
  idleReason,
  powerbandReason,
} from './reasons';
import {
  powerbandWeights,
  scoreCompression,
  scoreConverter,
  scoreCost,
  scoreEmissions,
  scoreFit,
  scoreIdle,
  scorePowerband,
  totalScore,
} from './scoring';
import { revLimitRpm } from './rpm-grid';
import { SCREENING, type RuledOut } from './screening';
import type { BaselineResult, CamRanking, CamSpecs, EngineFacts, RankingResult, RankOptions, Reason } from './types';
import { overlap050Deg, seatOverlapDeg, valveEvents } from './valve-events';
import { SCORING_WEIGHTS } from './weights';

export const PREDICTION_NOTICE =
  'Predictions are indicative: an engine-cycle model with a few physical constants fitted to engine-dyno results, shown with its band; not a measurement of this engine.';

/** Work shared by every cam of one ranking. */
type BuildWork = {
  build: BuildProfile;
  ctx: EngineContext;
  baseTorque: Float64Array;
  basePeakHp: number;
  baseLimitRpm: number;
  cruiseRpm: number;
  pullAway: ReturnType<typeof pullAwayRpm>;
  weights: Float64Array;
  torqueOf: (cam: CamCard) => Float64Array;
};

function prepare(
  build: BuildProfile,
  ctx = engineContext(build),
  torqueOf = (cam: CamCard) => torqueCurve(ctx, cam),
): BuildWork {
  const baseTorque = torqueOf(build.baselineCam);
  const cruiseRpm = buildCruiseRpm(build);
  const pullAway = pullAwayRpm(build);
  const baseLimitRpm = revLimitRpm(build, ctx.rpms[ctx.rpms.length - 1], false);
  return {
    build,
    ctx,
    baseTorque,
    basePeakHp: curvePeaks(ctx.rpms, baseTorque, baseLimitRpm).peakHp,
    baseLimitRpm,
    cruiseRpm,
    pullAway,
    weights: powerbandWeights(build, ctx.rpms, pullAway.rpm, cruiseRpm),
    torqueOf,
  };
}

function engineFacts(w: BuildWork): EngineFacts {
  const { ctx, build } = w;
  const limit = ctx.rpms[ctx.rpms.length - 1];
  return {
    displacementCi: roundTo(ctx.displacementCi, 1),
    displacementL: roundTo(litresFromCubicInches(ctx.displacementCi), 2),
    cylinderCi: roundTo(ctx.cylinderCi, 2),
    cruiseRpm: Math.round(w.cruiseRpm),
    pullAwayRpm: w.pullAway.rpm,
    pullAwaySource: w.pullAway.source,
    rpmLimit: limit,
    revLimitRpm: w.baseLimitRpm,
    meanPistonSpeedFtMinAtLimit: Math.round(meanPistonSpeedFtMin(build.engine.strokeIn, limit)),
    headFlowCeilingHp: Math.round(ctx.ceilingHp),
  };
}

/** Band half-width (%) per rpm, narrowed where the shop has measured similar builds. */
function bandPcts(rpms: Float64Array, evidence: Float64Array | null): Float64Array {
  return rpms.map((r, i) => bandHalfWidthPct(r, evidence ? evidence[i] : 0));
}

function analyseCam(w: BuildWork, cam: CamCard, options: RankOptions): CamRanking {
  const { build, ctx, baseTorque } = w;
  const rpms = ctx.rpms;
  let torque = w.torqueOf(cam);
  const fit0 = scoreFit(build, cam, overlap050Deg(cam));
  const limitRpm = revLimitRpm(build, rpms[rpms.length - 1], fit0.springsNeeded);

  // History: the shop's measured gains for this cam on similar builds, blended in rpm by rpm.
  let history = null;
  let evidence: Float64Array | null = null;
  if (options.history && options.history.length > 0) {
    const peaks = curvePeaks(rpms, torque, limitRpm);
    const blend = blendHistory(
      cam.id,
      rpms,
      torque,
      baseTorque,
      peaks.peakHpRpm,
      percentChange(peaks.peakHp, w.basePeakHp),
      options.history,
      build,
      ctx.displacementCi,
    );
    if (blend) {
      torque = blend.torque;
      evidence = blend.evidence;
      const a = blend.adjustment;
      history = {
        ...a,
        evidenceWeight: roundTo(a.evidenceWeight, 2),
        modelGainPctPeakHp: roundTo(a.modelGainPctPeakHp, 1),
        measuredGainPctPeakHp: roundTo(a.measuredGainPctPeakHp, 1),
        adjustedGainPctPeakHp: roundTo(percentChange(curvePeaks(rpms, torque, limitRpm).peakHp, w.basePeakHp), 1),
      };
    }
  }

  const predicted = summarize(rpms, torque, baseTorque, w.basePeakHp, limitRpm);
  const crossover = crossoverRpm(rpms, torque, baseTorque, limitRpm);
  const lead = leadStretch(rpms, torque, baseTorque, limitRpm);
  // The crossover's range: the same comparison with the candidate's gain moved by its calibration uncertainty.
  const shift = BAND.gainUncertaintyPct / 100;
  const early = crossoverRpm(
    rpms,
    torque.map((t) => t * (1 + shift)),
    baseTorque,
    limitRpm,
  );
  const late = crossoverRpm(
    rpms,
    torque.map((t) => t * (1 - shift)),
    baseTorque,
    limitRpm,
  );
  const crossoverRange =
    crossover === null ? null : ([early ?? crossover, late ?? rpms[rpms.length - 1]] as [number, number]);
  const events = valveEvents(cam);
  const dcr = dynamicCompression(build, cam);
  const vacuum = idleVacuumInHg(seatOverlapDeg(cam), ctx.cylinderCi);

  const powerband = scorePowerband(w.weights, rpms, torque, baseTorque);
  const converter = scoreConverter(
    build,
    w.pullAway.rpm,
    crossover,
    aheadAt(rpms, torque, baseTorque, w.pullAway.rpm),
    crossoverRange,
    lead,
  );
  const idle = scoreIdle(build, vacuum);
  const compression = scoreCompression(build, dcr);
  const fit = fit0;
  const emissions = scoreEmissions(build, cam);
  const needs = camNeeds(fit, converter, build, cam);
  const cost = scoreCost(
    build,
    cam,
    needs.map((n) => n.kind),
    options.needPriceCents,
    options.jobPriceCents?.(cam, needs),
  );

  const raw = {
    powerband: powerband.score,
    converter: converter.score,
    idle: idle.score,
    compression: compression.score,
    fit: fit.score,
    emissions: emissions.score,
    cost: cost.score,
  };
  const subscores = {
    powerband: Math.round(raw.powerband),
    converter: Math.round(raw.converter),
    idle: Math.round(raw.idle),
    compression: Math.round(raw.compression),
    fit: Math.round(raw.fit),
    emissions: Math.round(raw.emissions),
    cost: Math.round(raw.cost),
  };
  const reasons: Reason[] = [
    powerbandReason(powerband, build, w.cruiseRpm, predicted.peakHp, predicted.gainPctPeakHp),
    converterReason(converter),
    idleReason(idle, build),
    compressionReason(compression, build),
    fitReason(fit),
    emissionsReason(emissions),
    costReason(cost),
  ];
  // Read the heaviest sub-scores first (the table is already in that order; keep it explicit).
  reasons.sort((a, b) => SCORING_WEIGHTS[b.subscore] - SCORING_WEIGHTS[a.subscore]);

  return {
    camId: cam.id,
    camName: cam.name,
    specs: camSpecs(cam),
    rank: 0, // set once sorted
    score: roundTo(totalScore(raw, emissions.gated), 1),
    subscores,
    crossoverRpm: crossover,
    crossoverRangeRpm: crossoverRange,
    leads: lead,
    revLimitRpm: limitRpm,
    predicted,
    curve: options.includeCurves === false ? [] : curvePoints(rpms, torque, bandPcts(rpms, evidence)),
    valveEvents: events,
    dynamicCompression: roundTo(dcr, 2),
    idleVacuumInHg: roundTo(vacuum, 1),
    reasons,
    cautions: camCautions(emissions, idle, fit, converter, build.vehicle.powerBrakes === 'vacuum'),
    needs,
    history,
  };
}

function camSpecs(cam: CamCard): CamSpecs {
  const {
    intakeDuration050,
    exhaustDuration050,
    intakeLiftIn,
    exhaustLiftIn,
    lsa,
    intakeCenterline,
    rockerRatio,
    intakeAdvertised,
    exhaustAdvertised,
  } = cam;
  return {
    intakeDuration050,
    exhaustDuration050,
    intakeLiftIn,
    exhaustLiftIn,
    lsa,
    intakeCenterline,
    rockerRatio,
    ...(intakeAdvertised === undefined ? {} : { intakeAdvertised }),
    ...(exhaustAdvertised === undefined ? {} : { exhaustAdvertised }),
  };
}

function baselineResult(w: BuildWork, includeCurves: boolean): BaselineResult {
  const cam = w.build.baselineCam;
  const rpms = w.ctx.rpms;
  return {
    camId: cam.id,
    camName: cam.name,
    predicted: summarize(rpms, w.baseTorque, w.baseTorque, w.basePeakHp, w.baseLimitRpm),
    curve: includeCurves ? curvePoints(rpms, w.baseTorque, bandPcts(rpms, null)) : [],
    valveEvents: valveEvents(cam),
    dynamicCompression: roundTo(dynamicCompression(w.build, cam), 2),
    idleVacuumInHg: roundTo(idleVacuumInHg(seatOverlapDeg(cam), w.ctx.cylinderCi), 1),
  };
}

/** The highest total a cam could reach: full marks where the curve decides, the cheapest job its fit allows. */
function upperBoundScore(w: BuildWork, cam: CamCard, options: RankOptions): number {
  const { build, ctx } = w;
  const fit = scoreFit(build, cam, overlap050Deg(cam));
  const emissions = scoreEmissions(build, cam);
  // Cost never rises when a need is left out (prices are counted as at least zero), so the converter,
  // which only the curve can call for, is left out: a converter verdict "ahead at pull-away" asks for none.
  const needs = camNeeds(fit, scoreConverter(build, w.pullAway.rpm, null, true), build, cam);
  const raw = {
    powerband: 100,
    converter: 100,
    idle: scoreIdle(build, idleVacuumInHg(seatOverlapDeg(cam), ctx.cylinderCi)).score,
    compression: scoreCompression(build, dynamicCompression(build, cam)).score,
    fit: fit.score,
    emissions: emissions.score,
    cost: scoreCost(
      build,
      cam,
      needs.map((n) => n.kind),
      options.needPriceCents,
      options.jobPriceCents?.(cam, needs),
    ).score,
  };
  return totalScore(raw, emissions.gated);
}

/** The large-catalogue path (see screening.ts): exact top ten, the cycle model run only where it can matter. */
function boundedRankings(
  w: BuildWork,
  cams: readonly CamCard[],
  options: RankOptions,
): { rankings: CamRanking[]; ruledOut: RuledOut[] } {
  const bounded = cams
    .map((cam) => ({ cam, bound: upperBoundScore(w, cam, options) }))
    .sort((a, b) => b.bound - a.bound || compareIds(a.cam.id, b.cam.id));
  const modelled: CamRanking[] = [];
  const top: number[] = []; // the best modelled scores, highest first, at most protectedTop long
  let next = 0;
  for (; next < bounded.length; next++) {
    const tenth = top.length >= SCREENING.protectedTop ? top[SCREENING.protectedTop - 1] : -Infinity;
    if (bounded[next].bound + SCREENING.roundingPoints < tenth) break;
    const r = analyseCam(w, bounded[next].cam, options);
    modelled.push(r);
    top.push(r.score);
    top.sort((a, b) => b - a).splice(SCREENING.protectedTop);
  }
  const ruledOut = bounded
    .slice(next)
    .map(({ cam, bound }) => ({ camId: cam.id, camName: cam.name, maxScore: roundTo(bound, 1) }));
  return { rankings: sortRankings(modelled), ruledOut };
}

function compareRankings(a: CamRanking, b: CamRanking): number {
  return b.score - a.score || b.subscores.powerband - a.subscores.powerband || compareIds(a.camId, b.camId);
}

function sortRankings(rankings: CamRanking[]): CamRanking[] {
  return rankings.sort(compareRankings);
}

// Deterministic, locale-free order of ids for ties: by their text, code unit by code unit.
function compareIds(a: CamCard['id'], b: CamCard['id']): number {
  const x = String(a);
  const y = String(b);
  return x < y ? -1 : x > y ? 1 : 0;
}

/**
 * Ranks the shop's cams for one combination, best first. Inputs must already be schema-valid
 * (BuildProfileSchema, CamCardSchema). Ties break on the powerband sub-score, then on the id.
 */
export function rankCams(build: BuildProfile, cams: readonly CamCard[], options: RankOptions = {}): RankingResult {
  const w = prepare(build);
  const { rankings: scored, ruledOut } =
    cams.length <= SCREENING.fullModelUpToCams
      ? { rankings: sortRankings(cams.map((cam) => analyseCam(w, cam, options))), ruledOut: [] }
      : boundedRankings(w, cams, options);
  scored.forEach((r, i) => {
    r.rank = i + 1;
  });
  return {
    rankings: scored,
    baseline: baselineResult(w, options.includeCurves !== false),
    engine: engineFacts(w),
    notice: PREDICTION_NOTICE,
    ruledOut,
  };
}

/** One cam's predicted curve in this engine, with its summary and crossover against the build's baseline cam. */
export function predictCurve(build: BuildProfile, cam: CamCard) {
  const w = prepare(build);
  const torque = torqueCurve(w.ctx, cam);
  const limitRpm = revLimitRpm(
    build,
    w.ctx.rpms[w.ctx.rpms.length - 1],
    scoreFit(build, cam, overlap050Deg(cam)).springsNeeded,
  );
  return {
    curve: curvePoints(w.ctx.rpms, torque, bandPcts(w.ctx.rpms, null)),
    predicted: summarize(w.ctx.rpms, torque, w.baseTorque, w.basePeakHp, limitRpm),
    crossoverRpm: crossoverRpm(w.ctx.rpms, torque, w.baseTorque, limitRpm),
    revLimitRpm: limitRpm,
  };
}
