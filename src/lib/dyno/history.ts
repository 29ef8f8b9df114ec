import { displacementCi } from '@/lib/advisor/geometry';
import type { HistoryEntry } from '@/lib/advisor/types';
import type { BuildProfile } from '@/lib/schemas/build-profile';
import type { DynoType } from './dyno-type';
import { gainPct } from './figures';

// The shop's own results for the advisor's options.history: on each build with both a before and an
// after run, the measured peak-power gain of the cam that went in over the one that came out, from
// corrected figures. Several pulls of one phase are averaged; each build and cam counts as one job.
// A before and an after are paired only on the same kind of dyno: a chassis run with chassis runs, an
// engine run with engine runs (the driveline's loss sits in one and not the other).

export type RunForHistory = { buildId: number; phase: 'before' | 'after'; dynoType: DynoType; camId: number | null; correctedPeakHp: number | null };

const mean = (xs: number[]) => xs.reduce((s, x) => s + x, 0) / xs.length;

export function historyFromRuns(runs: readonly RunForHistory[], profiles: ReadonlyMap<number, BuildProfile>): HistoryEntry[] {
  const byBench = new Map<string, RunForHistory[]>();
  for (const run of runs) {
    if (run.correctedPeakHp === null || !Number.isFinite(run.correctedPeakHp) || run.correctedPeakHp <= 0) continue;
    const key = `${run.buildId}:${run.dynoType}`;
    byBench.set(key, [...(byBench.get(key) ?? []), run]);
  }
  const benches = [...byBench.values()].sort((a, b) => a[0].buildId - b[0].buildId || a[0].dynoType.localeCompare(b[0].dynoType));
  const entries: HistoryEntry[] = [];
  for (const list of benches) {
    const buildId = list[0].buildId;
    const profile = profiles.get(buildId);
    const before = list.filter((r) => r.phase === 'before').map((r) => r.correctedPeakHp!);
    if (!profile || before.length === 0) continue;
    const beforeHp = mean(before);
    const afterByCam = new Map<number, number[]>();
    for (const r of list) {
      if (r.phase !== 'after' || r.camId === null) continue;
      afterByCam.set(r.camId, [...(afterByCam.get(r.camId) ?? []), r.correctedPeakHp!]);
    }
    for (const [camId, after] of [...afterByCam].sort((a, b) => a[0] - b[0])) {
      entries.push({
        camId,
        measuredGainPctPeakHp: gainPct(beforeHp, mean(after)),
        displacementCi: displacementCi(profile.engine.boreIn, profile.engine.strokeIn, profile.engine.cylinders),
        intakeFlowCfm: profile.engine.intakeFlowCfm,
        headers: profile.exhaust.headers,
        system: profile.exhaust.system,
        intakeManifold: profile.engine.intakeManifold,
      });
    }
  }
  return entries;
}
