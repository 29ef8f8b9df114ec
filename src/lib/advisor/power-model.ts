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
  // Per-rpm values that do not depend on the cam, kept so a 1,000-cam ranking stays fast.
  logRpms: Float64Array;
  exhaustLowEnd: Float64Array; // exhaustLowEndFactor at each rpm
  overlapFade: Float64Array; // 1 / (1 + (rpm / fadeRpm)²) at each rpm
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
export function overlapLossAmount(seatOverlapDeg: number, ctx: EngineContext): number {
  const c = ctx.coeffs;
  return c.overlapLossPer40Deg * (Math.max(0, seatOverlapDeg) / 40) * (c.refCylinderCi / ctx.cylinderCi) * ctx.overlapMultiplier;
}

// ... fading as 1 / (1 + (rpm / fade rpm)²), the fade rpm scaled like the cam's powerband.
export function overlapFadeFactor(rpm: number, sizeScale: number, c: ModelCoefficients): number {
  const fade = rpm / (c.overlapFadeRpm * sizeScale);
  return 1 / (1 + fade * fade);
}

export function overlapLossFraction(seatOverlapDeg: number, rpm: number, ctx: EngineContext): number {
  return overlapLossAmount(seatOverlapDeg, ctx) * overlapFadeFactor(rpm, ctx.sizeScale, ctx.coeffs);
}

// Semi-empirical, our model: short open collectors lose low-rpm torque on every cam, fading with rpm.
export function exhaustLowEndFactor(rpm: number, lowEndLoss: number, fadeRpm: number): number {
  const fade = rpm / fadeRpm;
  return 1 - lowEndLoss / (1 + fade * fade);
}

// Semi-empirical, our model: more port flow per in³ of cylinder fills it better, with diminishing
// returns, relative to the calibration engine: (1 − e^(−q/scale)) / (1 − e^(−qref/scale)), capped.
export function portFlowFactor(intakeFlowCfm: number, cylinderCi: number, c: ModelCoefficients): number {
  const fill = (q: number) => 1 - Math.exp(-q / c.specificFlowScaleCfmPerCi);
  return Math.min(c.specificFlowMaxFactor, fill(intakeFlowCfm / cylinderCi) / fill(c.specificFlowRefCfmPerCi));
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
  const r = hp / ceilingHp;
  // Sharpness 8 is the model's value: squarings and square roots instead of general powers (faster).
  if (sharpness === 8) {
    const r2 = r * r;
    const r4 = r2 * r2;
    return hp / Math.sqrt(Math.sqrt(Math.sqrt(1 + r4 * r4)));
  }
  return hp / Math.pow(1 + Math.pow(r, sharpness), 1 / sharpness);
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
  const rpms = rpmGrid(e.strokeIn, c);
  const sizeScale = Math.pow(c.refCylinderCi / cylinderCi, c.sizeExponent);
  return {
    displacementCi: displacement,
    cylinderCi,
    sizeScale,
    boreIn: e.boreIn,
    rpmFactor: manifold.rpm * headers.rpm * primary * system.rpm,
    veFactor: manifold.ve * headers.ve * system.ve * portFlowFactor(e.intakeFlowCfm, cylinderCi, c),
    lowWidthFactor: manifold.lowWidth,
    overlapMultiplier: system.overlapMultiplier,
    lowEndLoss: system.lowEndLoss,
    lowEndFadeRpm: system.lowEndFadeRpm,
    torqueScale: c.torquePerCiAtPeak * displacement * compression,
    ceilingHp: headFlowCeilingHp(e.intakeFlowCfm, e.cylinders, c.hpPerCfmPerCylinder),
    rpms,
    logRpms: rpms.map(Math.log),
    exhaustLowEnd: rpms.map((r) => exhaustLowEndFactor(r, system.lowEndLoss, system.lowEndFadeRpm)),
    overlapFade: rpms.map((r) => overlapFadeFactor(r, sizeScale, c)),
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

/**
 * Predicted torque (lb·ft, unrounded) over the context's rpm grid: the same arithmetic as
 * torqueAtRpm, with the cam-independent parts taken from the context's per-rpm tables.
 */
export function torqueCurve(ctx: EngineContext, cam: CamCard): Float64Array {
  const shape = camShape(ctx, cam);
  const n = ctx.rpms.length;
  const out = new Float64Array(n);
  const logPeak = Math.log(shape.peakRpm);
  const kLow = 1 / (2 * shape.sigmaLow * shape.sigmaLow);
  const kHigh = 1 / (2 * shape.sigmaHigh * shape.sigmaHigh);
  const overlap = overlapLossAmount(shape.seatOverlapDeg, ctx);
  const sharp = ctx.coeffs.ceilingSharpness;
  for (let i = 0; i < n; i++) {
    const rpm = ctx.rpms[i];
    const x = ctx.logRpms[i] - logPeak;
    const bell = Math.exp(-x * x * (x < 0 ? kLow : kHigh));
    const ve = shape.peakVe * bell - overlap * ctx.overlapFade[i];
    const raw = ctx.torqueScale * Math.max(0, ve) * ctx.exhaustLowEnd[i];
    out[i] = torqueFromHorsepower(softCeilingHp(horsepower(raw, rpm), ctx.ceilingHp, sharp), rpm);
  }
  return out;
}
