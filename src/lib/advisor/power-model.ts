import type { BuildProfile } from '@/lib/schemas/build-profile';
import type { CamCard } from '@/lib/schemas/cam-card';
import {
  EXHAUST_SYSTEM_FACTORS, HEADER_FACTORS, INTAKE_MANIFOLD_FACTORS, MODEL, PRIMARY_REFERENCE_IN, PRIMARY_RPM_EXPONENT,
  type ModelCoefficients,
} from './coefficients';
import { cylinderVolumeCi, displacementCi, rpmAtMeanPistonSpeed } from './geometry';
import { horsepower, torqueFromHorsepower } from './horsepower';
import { overlap050Deg, SEAT_TIMING_ALLOWANCE_DEG } from './valve-events';

// The power model, in the order a builder would reason about it:
//  1. where this cam's breathing peaks in this engine (peak-VE rpm),
//  2. how fast VE falls away below and above that peak (a bell in log-rpm),
//  3. what overlap and the exhaust cost at low rpm,
//  4. torque = displacement · VE · compression, and the head's flow ceiling on power.
// Only 0.050" figures feed it, so a card with or without advertised durations predicts the same.

/** Everything about the engine that does not depend on the cam, worked out once per build. */
export type EngineContext = {
  displacementCi: number;
  cylinderCi: number;
  sizeScale: number; // (ref / cylinder in³)^exp: < 1 means the cam acts smaller
  boreIn: number;
  rpmFactor: number; // intake · headers · primary · system
  veFactor: number;
  lowWidthFactor: number;
  overlapMultiplier: number;
  lowEndLoss: number;
  lowEndFadeRpm: number;
  torqueScale: number; // lb·ft at 100 % of peak VE
  ceilingHp: number;
  rpms: Float64Array;
  coeffs: ModelCoefficients;
};

// Semi-empirical, our model: the cam's peak-VE rpm grows with intake duration and falls as the
// cylinder grows (a cam acts smaller in a bigger engine); a later centerline moves it up.
export function peakVeRpm(
  intakeDuration050Deg: number, intakeCenterlineDeg: number, sizeScale: number, partsFactor: number, c: ModelCoefficients,
): number {
  const duration = Math.pow(intakeDuration050Deg / 200, c.durationExponent);
  const centerline = 1 + c.centerlinePerDeg * (intakeCenterlineDeg - c.refCenterlineDeg);
  return c.peakRpmAt200Deg * duration * sizeScale * centerline * partsFactor;
}

// Semi-empirical, our model: VE relative to its peak, a bell in log-rpm, wider below than above.
export function veBell(rpm: number, peakRpm: number, sigmaLow: number, sigmaHigh: number): number {
  const x = Math.log(rpm / peakRpm);
  const s = x < 0 ? sigmaLow : sigmaHigh;
  return Math.exp(-(x * x) / (2 * s * s));
}

// Common practice: port flow levels off near L/D ≈ 0.30 with the intake valve ≈ 0.52 · bore;
// below that, the fraction of peak flow is 1 − (1 − L/Lpeak)^exp (exponent calibrated).
export function liftFlowFraction(liftIn: number, boreIn: number, c: ModelCoefficients): number {
  const peakLiftIn = c.liftOverDiameterAtPeakFlow * c.valveToBore * boreIn;
  const short = 1 - Math.min(1, liftIn / peakLiftIn);
  return 1 - Math.pow(short, c.liftExponent);
}

// Semi-empirical, our model: overlap lets exhaust push back into the intake at low rpm. The loss
// grows with seat-timed overlap, shrinks in a bigger cylinder, and fades as rpm rises.
export function overlapLossFraction(
  seatOverlapDeg: number, rpm: number, ctx: EngineContext,
): number {
  const c = ctx.coeffs;
  const size = c.refCylinderCi / ctx.cylinderCi;
  const amount = c.overlapLossPer40Deg * (Math.max(0, seatOverlapDeg) / 40) * size * ctx.overlapMultiplier;
  const fade = rpm / (c.overlapFadeRpm * ctx.sizeScale);
  return amount / (1 + fade * fade);
}

// Semi-empirical, our model: short open collectors lose low-rpm torque on every cam, fading with rpm.
export function exhaustLowEndFactor(rpm: number, lowEndLoss: number, fadeRpm: number): number {
  const fade = rpm / fadeRpm;
  return 1 - lowEndLoss / (1 + fade * fade);
}

// Semi-empirical, our model: more port flow per in³ of cylinder fills it better, with diminishing
// returns, relative to the calibration engine: (1 − e^(−q/scale)) / (1 − e^(−qref/scale)).
export function portFlowFactor(intakeFlowCfm: number, cylinderCi: number, c: ModelCoefficients): number {
  const fill = (q: number) => 1 - Math.exp(-q / c.specificFlowScaleCfmPerCi);
  return fill(intakeFlowCfm / cylinderCi) / fill(c.specificFlowRefCfmPerCi);
}

// Heywood ch. 5: ideal Otto-cycle efficiency η = 1 − 1 / CR^(γ−1).
export function ottoEfficiency(compressionRatio: number, gammaMinusOne: number): number {
  return 1 - 1 / Math.pow(compressionRatio, gammaMinusOne);
}

// Common practice: a two-valve head supports about 0.26 hp per cfm (28 inH2O) per cylinder.
export function headFlowCeilingHp(intakeFlowCfm: number, cylinders: number, hpPerCfmPerCylinder: number): number {
  return intakeFlowCfm * cylinders * hpPerCfmPerCylinder;
}

// Our choice: a soft ceiling, hp / (1 + (hp / ceiling)^m)^(1/m), invisible well below the ceiling.
export function softCeilingHp(hp: number, ceilingHp: number, sharpness: number): number {
  return hp / Math.pow(1 + Math.pow(hp / ceilingHp, sharpness), 1 / sharpness);
}

/** The rpm grid: 1500 to 7000 in 100s, cut at the mean-piston-speed limit when that comes first. */
export function rpmGrid(strokeIn: number, c: ModelCoefficients = MODEL): Float64Array {
  const safe = Math.floor(rpmAtMeanPistonSpeed(strokeIn, c.safePistonSpeedFtMin) / c.curveStepRpm) * c.curveStepRpm;
  const end = Math.max(c.curveStartRpm + 10 * c.curveStepRpm, Math.min(c.curveEndRpm, safe));
  const n = Math.floor((end - c.curveStartRpm) / c.curveStepRpm) + 1;
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) out[i] = c.curveStartRpm + i * c.curveStepRpm;
  return out;
}

export function engineContext(build: BuildProfile, c: ModelCoefficients = MODEL): EngineContext {
  const e = build.engine;
  const x = build.exhaust;
  const cylinderCi = cylinderVolumeCi(e.boreIn, e.strokeIn);
  const displacement = displacementCi(e.boreIn, e.strokeIn, e.cylinders);
  const manifold = INTAKE_MANIFOLD_FACTORS[e.intakeManifold];
  const headers = HEADER_FACTORS[x.headers];
  const system = EXHAUST_SYSTEM_FACTORS[x.system];
  const primary = headers.usesPrimary ? Math.pow((x.primaryIn ?? PRIMARY_REFERENCE_IN) / PRIMARY_REFERENCE_IN, PRIMARY_RPM_EXPONENT) : 1;
  const compression = ottoEfficiency(e.compressionRatio, c.compressionGammaMinusOne) / ottoEfficiency(c.refCompressionRatio, c.compressionGammaMinusOne);
  return {
    displacementCi: displacement,
    cylinderCi,
    sizeScale: Math.pow(c.refCylinderCi / cylinderCi, c.sizeExponent),
    boreIn: e.boreIn,
    rpmFactor: manifold.rpm * headers.rpm * primary * system.rpm,
    veFactor: manifold.ve * headers.ve * system.ve * portFlowFactor(e.intakeFlowCfm, cylinderCi, c),
    lowWidthFactor: manifold.lowWidth,
    overlapMultiplier: system.overlapMultiplier,
    lowEndLoss: system.lowEndLoss,
    lowEndFadeRpm: system.lowEndFadeRpm,
    torqueScale: c.torquePerCiAtPeak * displacement * compression,
    ceilingHp: headFlowCeilingHp(e.intakeFlowCfm, e.cylinders, c.hpPerCfmPerCylinder),
    rpms: rpmGrid(e.strokeIn, c),
    coeffs: c,
  };
}

/** The cam-dependent inputs of the model, worked out once per cam. */
export type CamShape = { peakRpm: number; sigmaLow: number; sigmaHigh: number; peakVe: number; seatOverlapDeg: number };

export function camShape(ctx: EngineContext, cam: CamCard): CamShape {
  const c = ctx.coeffs;
  const lsaDelta = cam.lsa - c.refLsaDeg;
  const width = Math.max(0.5, 1 + c.lsaWidthPerDeg * lsaDelta);
  return {
    peakRpm: peakVeRpm(cam.intakeDuration050, cam.intakeCenterline, ctx.sizeScale, ctx.rpmFactor, c),
    sigmaLow: c.sigmaLow * width * ctx.lowWidthFactor,
    sigmaHigh: c.sigmaHigh * width,
    peakVe: liftFlowFraction(cam.intakeLiftIn, ctx.boreIn, c) * (1 - c.lsaPeakPerDeg * lsaDelta) * ctx.veFactor,
    // The model always uses 0.050" overlap plus the seat allowance, for consistency between cards.
    seatOverlapDeg: overlap050Deg(cam) + 2 * SEAT_TIMING_ALLOWANCE_DEG,
  };
}

/** Predicted torque (lb·ft, unrounded) at one rpm. */
export function torqueAtRpm(ctx: EngineContext, shape: CamShape, rpm: number): number {
  const ve = shape.peakVe * veBell(rpm, shape.peakRpm, shape.sigmaLow, shape.sigmaHigh) - overlapLossFraction(shape.seatOverlapDeg, rpm, ctx);
  const raw = ctx.torqueScale * Math.max(0, ve) * exhaustLowEndFactor(rpm, ctx.lowEndLoss, ctx.lowEndFadeRpm);
  const hp = softCeilingHp(horsepower(raw, rpm), ctx.ceilingHp, ctx.coeffs.ceilingSharpness);
  return torqueFromHorsepower(hp, rpm);
}

/** Predicted torque (lb·ft, unrounded) over the context's rpm grid. */
export function torqueCurve(ctx: EngineContext, cam: CamCard): Float64Array {
  const shape = camShape(ctx, cam);
  const out = new Float64Array(ctx.rpms.length);
  for (let i = 0; i < out.length; i++) out[i] = torqueAtRpm(ctx, shape, ctx.rpms[i]);
  return out;
}
