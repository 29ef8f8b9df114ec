import { horsepower } from './horsepower';
import { roundTo } from './format';

/** One rpm of a predicted curve; the band (when given) is where a measured curve may honestly fall. */
export type CurvePoint = {
  rpm: number;
  torqueLbFt: number;
  hp: number;
  torqueLowLbFt?: number;
  torqueHighLbFt?: number;
};

export type PredictedSummary = {
  peakHp: number;
  peakHpRpm: number;
  peakTorqueLbFt: number;
  peakTorqueRpm: number;
  gainPctPeakHp: number; // against the baseline cam's predicted peak hp
  lowEndLossPct: number; // largest torque shortfall against the baseline up to LOW_END_TOP_RPM, ≥ 0
};

/** "Low end" for lowEndLossPct: from the start of the curve up to this rpm (our choice). */
export const LOW_END_TOP_RPM = 3500;

/**
 * Curve points for output. Torque is rounded to 0.1 lb·ft and hp is then computed from that same
 * rounded torque, unrounded, so hp = torqueLbFt · rpm / 5252 holds exactly on every point.
 */
export function curvePoints(rpms: Float64Array, torque: Float64Array, bandPct?: Float64Array): CurvePoint[] {
  const out: CurvePoint[] = new Array(rpms.length);
  for (let i = 0; i < rpms.length; i++) {
    const t = Math.round(torque[i] * 10) / 10;
    out[i] = { rpm: rpms[i], torqueLbFt: t, hp: horsepower(t, rpms[i]) };
    if (bandPct) {
      out[i].torqueLowLbFt = Math.round(torque[i] * (1 - bandPct[i] / 100) * 10) / 10;
      out[i].torqueHighLbFt = Math.round(torque[i] * (1 + bandPct[i] / 100) * 10) / 10;
    }
  }
  return out;
}

export type Peaks = { peakHp: number; peakHpRpm: number; peakTorqueLbFt: number; peakTorqueRpm: number };

/** Peak torque and peak power and where they occur (first rpm on a tie). */
export function curvePeaks(rpms: ArrayLike<number>, torque: ArrayLike<number>, limitRpm = Infinity): Peaks {
  let ti = 0;
  let hi = 0;
  let bestHp = -Infinity;
  for (let i = 0; i < rpms.length && (i === 0 || rpms[i] <= limitRpm); i++) {
    if (torque[i] > torque[ti]) ti = i;
    const hp = horsepower(torque[i], rpms[i]);
    if (hp > bestHp) {
      bestHp = hp;
      hi = i;
    }
  }
  return { peakHp: bestHp, peakHpRpm: rpms[hi], peakTorqueLbFt: torque[ti], peakTorqueRpm: rpms[ti] };
}

// Arithmetic: percentage change = (new / old − 1) · 100.
export function percentChange(newValue: number, oldValue: number): number {
  return oldValue > 0 ? (newValue / oldValue - 1) * 100 : 0;
}

/** Largest torque shortfall (as a positive %) against the baseline up to LOW_END_TOP_RPM. */
export function lowEndLossPct(rpms: Float64Array, torque: Float64Array, baseline: Float64Array): number {
  let worst = 0;
  for (let i = 0; i < rpms.length && rpms[i] <= LOW_END_TOP_RPM; i++) {
    if (baseline[i] > 0) worst = Math.max(worst, (1 - torque[i] / baseline[i]) * 100);
  }
  return worst;
}

/** The output summary, rounded to 0.1 for display. */
export function summarize(
  rpms: Float64Array,
  torque: Float64Array,
  baseline: Float64Array,
  baselinePeakHp: number,
  limitRpm = Infinity,
): PredictedSummary {
  const p = curvePeaks(rpms, torque, limitRpm);
  return {
    peakHp: roundTo(p.peakHp, 1),
    peakHpRpm: p.peakHpRpm,
    peakTorqueLbFt: roundTo(p.peakTorqueLbFt, 1),
    peakTorqueRpm: p.peakTorqueRpm,
    gainPctPeakHp: roundTo(percentChange(p.peakHp, baselinePeakHp), 1),
    lowEndLossPct: roundTo(lowEndLossPct(rpms, torque, baseline), 1),
  };
}
