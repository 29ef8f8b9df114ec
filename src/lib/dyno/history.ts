import { displacementCi } from '@/lib/advisor/geometry';
import { HISTORY_SETTINGS } from '@/lib/advisor/history';
import type { HistoryEntry } from '@/lib/advisor/types';
import type { BuildProfile } from '@/lib/schemas/build-profile';
import type { DynoType } from './dyno-type';
import { gainPct } from './figures';

// The shop's own results for the advisor's options.history: on each build with both a before and an
// after run, the measured peak-power gain of the cam that went in over the one that came out, from
// corrected figures, and where the pulls were recorded as curves, the torque gain rpm by rpm.
// Several pulls of one phase are averaged; each build and cam counts as one job.
// A before and an after are paired only on the same kind of dyno: a chassis run with chassis runs, an
// engine run with engine runs (the driveline's loss sits in one and not the other).

export type CurvePoint = { rpm: number; torqueLbFt: number };
export type RunForHistory = {
  buildId: number;
  phase: 'before' | 'after';
  dynoType: DynoType;
  camId: number | null;
  correctedPeakHp: number | null;
  /** The pull's points with torque corrected like the peak (rising rpm); null for a run recorded as peaks only. */
  correctedCurve?: readonly CurvePoint[] | null;
};

/** Per-rpm gains are read on this grid (rpm): fine enough for the advisor's curves, coarse enough to stay small. */
export const GAIN_GRID_RPM = 250;

const mean = (xs: number[]) => xs.reduce((s, x) => s + x, 0) / xs.length;

function torqueAt(curve: readonly CurvePoint[], rpm: number): number {
  for (let i = 1; i < curve.length; i++) {
    const a = curve[i - 1];
    const b = curve[i];
    if (rpm <= b.rpm) return a.torqueLbFt + ((b.torqueLbFt - a.torqueLbFt) * (rpm - a.rpm)) / (b.rpm - a.rpm || 1);
  }
  return curve[curve.length - 1].torqueLbFt;
}

/** The rpm every pull covers, on the grid: from the latest start to the earliest end. */
function sharedGrid(curves: readonly (readonly CurvePoint[])[]): number[] {
  const from = Math.ceil(Math.max(...curves.map((c) => c[0].rpm)) / GAIN_GRID_RPM) * GAIN_GRID_RPM;
  const to = Math.floor(Math.min(...curves.map((c) => c[c.length - 1].rpm)) / GAIN_GRID_RPM) * GAIN_GRID_RPM;
  const grid: number[] = [];
  for (let rpm = from; rpm <= to; rpm += GAIN_GRID_RPM) grid.push(rpm);
  return grid;
}

/**
 * Torque gain of the after pulls over the before pulls, % per rpm, where every pull of both phases was
 * measured (pulls of one phase averaged point by point). Fewer than two shared points says nothing.
 */
export function gainByRpm(
  before: readonly (readonly CurvePoint[])[],
  after: readonly (readonly CurvePoint[])[],
): { rpm: number; gainPct: number }[] | undefined {
  const usable = (c: readonly CurvePoint[]) => c.length >= 2;
  const b = before.filter(usable);
  const a = after.filter(usable);
  if (b.length === 0 || a.length === 0) return undefined;
  const grid = sharedGrid([...b, ...a]);
  if (grid.length < 2) return undefined;
  return grid.map((rpm) => ({
    rpm,
    gainPct: gainPct(mean(b.map((c) => torqueAt(c, rpm))), mean(a.map((c) => torqueAt(c, rpm)))),
  }));
}

export function historyFromRuns(
  runs: readonly RunForHistory[],
  profiles: ReadonlyMap<number, BuildProfile>,
): HistoryEntry[] {
  const byBench = new Map<string, RunForHistory[]>();
  for (const run of runs) {
    if (run.correctedPeakHp === null || !Number.isFinite(run.correctedPeakHp) || run.correctedPeakHp <= 0) continue;
    const key = `${run.buildId}:${run.dynoType}`;
    byBench.set(key, [...(byBench.get(key) ?? []), run]);
  }
  const benches = [...byBench.values()].sort(
    (a, b) => a[0].buildId - b[0].buildId || a[0].dynoType.localeCompare(b[0].dynoType),
  );
  const curvesOf = (list: RunForHistory[]) => list.flatMap((r) => (r.correctedCurve ? [r.correctedCurve] : []));
  const entries: HistoryEntry[] = [];
  for (const list of benches) {
    const buildId = list[0].buildId;
    const profile = profiles.get(buildId);
    const beforeRuns = list.filter((r) => r.phase === 'before');
    if (!profile || beforeRuns.length === 0) continue;
    const beforeHp = mean(beforeRuns.map((r) => r.correctedPeakHp!));
    const afterByCam = new Map<number, RunForHistory[]>();
    for (const r of list) {
      if (r.phase !== 'after' || r.camId === null) continue;
      afterByCam.set(r.camId, [...(afterByCam.get(r.camId) ?? []), r]);
    }
    for (const [camId, after] of [...afterByCam].sort((a, b) => a[0] - b[0])) {
      const byRpm = gainByRpm(curvesOf(beforeRuns), curvesOf(after));
      entries.push({
        camId,
        measuredGainPctPeakHp: gainPct(beforeHp, mean(after.map((r) => r.correctedPeakHp!))),
        displacementCi: displacementCi(profile.engine.boreIn, profile.engine.strokeIn, profile.engine.cylinders),
        intakeFlowCfm: profile.engine.intakeFlowCfm,
        headers: profile.exhaust.headers,
        system: profile.exhaust.system,
        intakeManifold: profile.engine.intakeManifold,
        ...(byRpm ? { measuredGainPctByRpm: byRpm } : {}),
      });
    }
  }
  return entries;
}

export type SimilarityWindow = { displacementCi: [number, number]; intakeFlowCfm: [number, number] };

/**
 * The engines whose history can count for this one at all: the advisor drops a record whose similarity
 * is under minSimilarity, and similarity is at most exp(−z²) on displacement and on port flow (the part
 * mismatches only lower it), so |z| ≤ √(ln(1 / minSimilarity)) bounds each. Records are stored with
 * weight 1, so the bound is exact: nothing outside it could change a ranking.
 */
export function similarityWindow(displacementCiNow: number, intakeFlowCfmNow: number): SimilarityWindow {
  const h = HISTORY_SETTINGS;
  const zMax = Math.sqrt(Math.log(1 / h.minSimilarity));
  const d = (zMax * h.displacementWidthPct) / 100;
  const f = (zMax * h.flowWidthPct) / 100;
  return {
    displacementCi: [displacementCiNow * (1 - d), displacementCiNow * (1 + d)],
    intakeFlowCfm: [intakeFlowCfmNow * (1 - f), intakeFlowCfmNow * (1 + f)],
  };
}
