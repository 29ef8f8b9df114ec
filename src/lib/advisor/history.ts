import type { BuildProfile } from '@/lib/schemas/build-profile';
import type { HistoryAdjustment, HistoryEntry } from './types';

// options.history: the shop's own measured results nudge the model's predicted gain for a cam.
// Each past job counts by how similar its engine is; the model's own prediction counts as if it were
// `priorWeight` perfectly similar jobs. All values are our choice, documented in docs/advisor.md.
export const HISTORY_SETTINGS = {
  priorWeight: 2,
  displacementWidthPct: 6, // similarity falls to 37 % at a 6 % displacement difference
  flowWidthPct: 10, // ... and at a 10 % port-flow difference
  mismatch: { headers: 0.6, system: 0.7, intakeManifold: 0.7 },
  minSimilarity: 0.05,
  gainLimitsPct: { min: -50, max: 100 }, // measured gains outside this are treated as typos and ignored
} as const;

// Our choice: Gaussian similarity on relative differences, times a factor per mismatched part.
export function historySimilarity(entry: HistoryEntry, build: BuildProfile, displacementCi: number): number {
  const h = HISTORY_SETTINGS;
  const dz = ((entry.displacementCi - displacementCi) / displacementCi) * (100 / h.displacementWidthPct);
  let s = Math.exp(-dz * dz);
  if (entry.intakeFlowCfm !== undefined) {
    const fz =
      ((entry.intakeFlowCfm - build.engine.intakeFlowCfm) / build.engine.intakeFlowCfm) * (100 / h.flowWidthPct);
    s *= Math.exp(-fz * fz);
  }
  if (entry.headers !== undefined && entry.headers !== build.exhaust.headers) s *= h.mismatch.headers;
  if (entry.system !== undefined && entry.system !== build.exhaust.system) s *= h.mismatch.system;
  if (entry.intakeManifold !== undefined && entry.intakeManifold !== build.engine.intakeManifold)
    s *= h.mismatch.intakeManifold;
  return s;
}

function usable(e: HistoryEntry): boolean {
  const g = HISTORY_SETTINGS.gainLimitsPct;
  return (
    Number.isFinite(e.measuredGainPctPeakHp) &&
    e.measuredGainPctPeakHp >= g.min &&
    e.measuredGainPctPeakHp <= g.max &&
    Number.isFinite(e.displacementCi) &&
    e.displacementCi > 0 &&
    (e.weight === undefined || (Number.isFinite(e.weight) && e.weight > 0)) &&
    (e.intakeFlowCfm === undefined || (Number.isFinite(e.intakeFlowCfm) && e.intakeFlowCfm > 0))
  );
}

/** A peak-power record speaks for the top end only: full weight from 80 % of the peak-power rpm, none below 60 % (our choice). */
export const PEAK_ONLY_TAPER = { fromShare: 0.6, fullShare: 0.8 } as const;

function peakOnlyTaper(rpm: number, peakHpRpm: number): number {
  const share = rpm / peakHpRpm;
  return Math.min(
    1,
    Math.max(0, (share - PEAK_ONLY_TAPER.fromShare) / (PEAK_ONLY_TAPER.fullShare - PEAK_ONLY_TAPER.fromShare)),
  );
}

function gainAt(points: readonly { rpm: number; gainPct: number }[], rpm: number): number | null {
  if (points.length === 0 || rpm < points[0].rpm || rpm > points[points.length - 1].rpm) return null;
  for (let i = 1; i < points.length; i++) {
    const a = points[i - 1];
    const b = points[i];
    if (rpm <= b.rpm) return a.gainPct + ((b.gainPct - a.gainPct) * (rpm - a.rpm)) / (b.rpm - a.rpm || 1);
  }
  return points[0].gainPct;
}

export type HistoryBlend = { torque: Float64Array; evidence: Float64Array; adjustment: HistoryAdjustment };

/**
 * The shop's measured gains blended into the model's, rpm by rpm (our choice of rule, documented):
 * gain(r) = (prior · model(r) + Σ wᵢ(r) · measuredᵢ(r)) / (prior + Σ wᵢ(r)), wᵢ = similarity · weight,
 * where a record with a measured curve speaks where it was measured and a peak-only record speaks for
 * the top end (its peak gain, as an offset on the model's). With few records it stays near the model.
 */
export function blendHistory(
  camId: string | number,
  rpms: Float64Array,
  torque: Float64Array,
  baseline: Float64Array,
  peakHpRpm: number,
  modelPeakGainPct: number,
  history: readonly HistoryEntry[],
  build: BuildProfile,
  displacementCi: number,
): HistoryBlend | null {
  const h = HISTORY_SETTINGS;
  const used: { w: number; e: HistoryEntry }[] = [];
  for (const e of history) {
    if (String(e.camId) !== String(camId) || !usable(e)) continue;
    const w = historySimilarity(e, build, displacementCi) * (e.weight ?? 1);
    if (w >= h.minSimilarity) used.push({ w, e });
  }
  if (used.length === 0) return null;
  const out = new Float64Array(torque.length);
  const evidence = new Float64Array(torque.length);
  for (let i = 0; i < rpms.length; i++) {
    const modelGain = baseline[i] > 0 ? (torque[i] / baseline[i] - 1) * 100 : 0;
    let wsum = 0;
    let gsum = 0;
    for (const { w, e } of used) {
      const byRpm =
        e.measuredGainPctByRpm && e.measuredGainPctByRpm.length >= 2 ? gainAt(e.measuredGainPctByRpm, rpms[i]) : null;
      if (byRpm !== null) {
        wsum += w;
        gsum += w * byRpm;
      } else if (!e.measuredGainPctByRpm || e.measuredGainPctByRpm.length < 2) {
        const t = w * peakOnlyTaper(rpms[i], peakHpRpm);
        wsum += t;
        gsum += t * (modelGain + e.measuredGainPctPeakHp - modelPeakGainPct);
      }
    }
    const gain = (h.priorWeight * modelGain + gsum) / (h.priorWeight + wsum);
    out[i] = baseline[i] * (1 + gain / 100);
    evidence[i] = wsum;
  }
  const wTotal = used.reduce((s, u) => s + u.w, 0);
  const measured = used.reduce((s, u) => s + u.w * u.e.measuredGainPctPeakHp, 0) / wTotal;
  return {
    torque: out,
    evidence,
    adjustment: {
      matches: used.length,
      evidenceWeight: wTotal,
      modelGainPctPeakHp: modelPeakGainPct,
      measuredGainPctPeakHp: measured,
      adjustedGainPctPeakHp: NaN,
    },
  };
}
