import type { HEAD_PRESETS } from '@/lib/schemas/build-profile';
import { benchEffectiveAreaM2 } from './gas-flow';

// Cylinder heads as the model sees them: valve sizes and a flow-bench curve (cfm at 28 inH2O against
// valve lift). Presets are our own generic heads; every figure is from memory of typical bench sheets
// for two-valve pushrod V8 heads, not a measurement of any product.

export type FlowPoint = { liftIn: number; cfm: number };
export type HeadSpec = {
  intakeValveIn: number;
  exhaustValveIn: number;
  intakeFlow: FlowPoint[]; // rising lift, at least two points
  exhaustFlow: FlowPoint[];
};

export type HeadPreset = (typeof HEAD_PRESETS)[number];

/** Peak intake cfm, valve sizes and the exhaust-to-intake flow ratio of each preset (from memory). */
export const HEAD_PRESET_FIGURES: Record<
  HeadPreset,
  { peakCfm: number; intakeValveIn: number; exhaustValveIn: number; exhaustRatio: number }
> = {
  'stock-cathedral': { peakCfm: 240, intakeValveIn: 1.89, exhaustValveIn: 1.55, exhaustRatio: 0.75 },
  'ported-cathedral': { peakCfm: 290, intakeValveIn: 2.0, exhaustValveIn: 1.57, exhaustRatio: 0.76 },
  'stock-rectangle': { peakCfm: 315, intakeValveIn: 2.165, exhaustValveIn: 1.59, exhaustRatio: 0.7 },
  'ported-rectangle': { peakCfm: 350, intakeValveIn: 2.165, exhaustValveIn: 1.6, exhaustRatio: 0.72 },
};

/**
 * Discharge coefficient on the valve curtain area (π·D·L) at low lift, where the curtain limits flow.
 * Heywood ch. 6 shows curtain-area coefficients of about 0.6–0.8 at low L/D for well-shaped ports; 0.7 our pick.
 */
export const CURTAIN_DISCHARGE_COEFFICIENT = 0.7;
/** How sharply the port takes over from the curtain (our choice; 5 matches typical sheets, from memory). */
export const CURTAIN_TO_PORT_SHARPNESS = 5;
/** Bench cfm per in² of effective area at 28 inH2O (incompressible orifice, standard air). */
export const CFM_PER_EFFECTIVE_IN2 = 0.00064516 / benchEffectiveAreaM2(1);

/**
 * Generic curve from a peak figure (our choice, documented): the curtain-limited flow
 * Cd·π·D·L at low lift, handed smoothly to the port's own limit (the peak) at high lift:
 * cfm(L) = [curtain(L)^−k + peak^−k]^(−1/k). It rises linearly at low lift and levels off near L/D 0.3.
 */
export function genericFlowCurve(peakCfm: number, valveIn: number): FlowPoint[] {
  const points: FlowPoint[] = [];
  const k = CURTAIN_TO_PORT_SHARPNESS;
  for (let liftIn = 0.025; liftIn <= 0.9001; liftIn += 0.025) {
    const curtainCfm = CFM_PER_EFFECTIVE_IN2 * CURTAIN_DISCHARGE_COEFFICIENT * Math.PI * valveIn * liftIn;
    points.push({
      liftIn: Math.round(liftIn * 1000) / 1000,
      cfm: Math.pow(Math.pow(curtainCfm, -k) + Math.pow(peakCfm, -k), -1 / k),
    });
  }
  return points;
}

/** Valve size implied by a peak flow when the sizes are not given: D = √(cfm / 66) in (our choice, fits the presets ±5 %). */
export function valveSizeFromPeakCfm(peakCfm: number): number {
  return Math.sqrt(peakCfm / 66);
}

export function headFromPeak(
  peakCfm: number,
  intakeValveIn?: number,
  exhaustValveIn?: number,
  exhaustRatio = 0.75,
): HeadSpec {
  const di = intakeValveIn ?? valveSizeFromPeakCfm(peakCfm);
  const de = exhaustValveIn ?? di * 0.8;
  return {
    intakeValveIn: di,
    exhaustValveIn: de,
    intakeFlow: genericFlowCurve(peakCfm, di),
    exhaustFlow: genericFlowCurve(peakCfm * exhaustRatio, de),
  };
}

/** Bench flow (cfm) at a lift, linear between points, rising linearly from zero below the first point, flat past the last. */
export function flowAtLiftCfm(curve: readonly FlowPoint[], liftIn: number): number {
  if (liftIn <= 0) return 0;
  const first = curve[0];
  if (liftIn <= first.liftIn) return (first.cfm * liftIn) / first.liftIn;
  for (let i = 1; i < curve.length; i++) {
    const b = curve[i];
    if (liftIn <= b.liftIn) {
      const a = curve[i - 1];
      return a.cfm + ((b.cfm - a.cfm) * (liftIn - a.liftIn)) / (b.liftIn - a.liftIn);
    }
  }
  return curve[curve.length - 1].cfm;
}

/** Effective flow area (m²) at a lift, from the bench curve (Heywood app. C, incompressible at 28 inH2O). */
export function effectiveAreaAtLiftM2(curve: readonly FlowPoint[], liftIn: number): number {
  return benchEffectiveAreaM2(flowAtLiftCfm(curve, liftIn));
}
