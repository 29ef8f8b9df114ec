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
  maxCurveFactor: { min: 0.75, max: 1.25 },
} as const;

// Our choice: Gaussian similarity on relative differences, times a factor per mismatched part.
export function historySimilarity(entry: HistoryEntry, build: BuildProfile, displacementCi: number): number {
  const h = HISTORY_SETTINGS;
  const dz = ((entry.displacementCi - displacementCi) / displacementCi) * (100 / h.displacementWidthPct);
  let s = Math.exp(-dz * dz);
  if (entry.intakeFlowCfm !== undefined) {
    const fz = ((entry.intakeFlowCfm - build.engine.intakeFlowCfm) / build.engine.intakeFlowCfm) * (100 / h.flowWidthPct);
    s *= Math.exp(-fz * fz);
  }
  if (entry.headers !== undefined && entry.headers !== build.exhaust.headers) s *= h.mismatch.headers;
  if (entry.system !== undefined && entry.system !== build.exhaust.system) s *= h.mismatch.system;
  if (entry.intakeManifold !== undefined && entry.intakeManifold !== build.engine.intakeManifold) s *= h.mismatch.intakeManifold;
  return s;
}

function usable(e: HistoryEntry): boolean {
  const g = HISTORY_SETTINGS.gainLimitsPct;
  return Number.isFinite(e.measuredGainPctPeakHp) && e.measuredGainPctPeakHp >= g.min && e.measuredGainPctPeakHp <= g.max
    && Number.isFinite(e.displacementCi) && e.displacementCi > 0
    && (e.weight === undefined || (Number.isFinite(e.weight) && e.weight > 0))
    && (e.intakeFlowCfm === undefined || (Number.isFinite(e.intakeFlowCfm) && e.intakeFlowCfm > 0));
}

// Weighted blend: adjusted = (prior · model + Σ wᵢ · measuredᵢ) / (prior + Σ wᵢ), wᵢ = similarity · weight.
export function adjustGainForHistory(
  camId: string | number, modelGainPct: number, history: readonly HistoryEntry[], build: BuildProfile, displacementCi: number,
): HistoryAdjustment | null {
  const h = HISTORY_SETTINGS;
  let matches = 0;
  let wsum = 0;
  let gsum = 0;
  for (const e of history) {
    if (String(e.camId) !== String(camId) || !usable(e)) continue;
    const w = historySimilarity(e, build, displacementCi) * (e.weight ?? 1);
    if (!(w >= h.minSimilarity)) continue;
    matches++;
    wsum += w;
    gsum += w * e.measuredGainPctPeakHp;
  }
  if (matches === 0) return null;
  const measured = gsum / wsum;
  const adjusted = (h.priorWeight * modelGainPct + wsum * measured) / (h.priorWeight + wsum);
  return { matches, evidenceWeight: wsum, modelGainPctPeakHp: modelGainPct, measuredGainPctPeakHp: measured, adjustedGainPctPeakHp: adjusted };
}

/** The factor the whole candidate curve is scaled by so its peak-hp gain becomes the adjusted one. */
export function historyCurveFactor(adj: HistoryAdjustment): number {
  const f = (1 + adj.adjustedGainPctPeakHp / 100) / (1 + adj.modelGainPctPeakHp / 100);
  const lim = HISTORY_SETTINGS.maxCurveFactor;
  return Number.isFinite(f) ? Math.min(lim.max, Math.max(lim.min, f)) : 1;
}
