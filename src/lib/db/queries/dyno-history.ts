import type { HistoryEntry } from '@/lib/advisor/types';
import { historyFromRuns, type RunForHistory } from '@/lib/dyno/history';
import { correctedFigure } from '@/lib/dyno/figures';
import { BuildProfileSchema, type BuildProfile } from '@/lib/schemas/build-profile';
import { Build, db, DynoRun } from '../models';
import { runCorrection } from './dyno-runs';

/**
 * The shop's measured results as the advisor's options.history: before/after pairs on the same build,
 * corrected figures, the build's engine for similarity. Builds whose saved profile no longer parses are
 * left out rather than guessed at.
 */
export async function loadDynoHistory(): Promise<HistoryEntry[]> {
  db();
  const runs = await DynoRun.findAll({
    attributes: ['id', 'buildId', 'phase', 'dynoType', 'camId', 'peakHp', 'correctionStandard', 'airTempC', 'baroKpa', 'humidityPct'],
    order: [['buildId', 'ASC'], ['id', 'ASC']],
  });
  if (!runs.length) return [];
  const buildIds = [...new Set(runs.map((r) => r.buildId))];
  const builds = await Build.findAll({ where: { id: buildIds }, attributes: ['id', 'profile'] });
  const profiles = new Map<number, BuildProfile>();
  for (const b of builds) {
    const parsed = BuildProfileSchema.safeParse(b.profile);
    if (parsed.success) profiles.set(b.id, parsed.data);
  }
  const forHistory: RunForHistory[] = runs.map((r) => {
    const c = runCorrection(r);
    return { buildId: r.buildId, phase: r.phase, dynoType: r.dynoType, camId: r.camId ?? null, correctedPeakHp: c && r.peakHp !== null ? correctedFigure(r.peakHp, c.factor) : null };
  });
  return historyFromRuns(forHistory, profiles);
}
