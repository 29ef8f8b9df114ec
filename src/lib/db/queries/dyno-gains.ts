import 'server-only';
import { Op, type Transaction } from 'sequelize';
import { historyFromRuns, type RunForHistory } from '@/lib/dyno/history';
import { correctedFigure } from '@/lib/dyno/figures';
import { BuildProfileSchema, type BuildProfile } from '@/lib/schemas/build-profile';
import { Build, db, DynoGain, DynoRun } from '../models';
import { runCorrection } from './dyno-runs';

// dyno_gains: the advisor's history in the form a ranking reads it (one row per build and fitted cam),
// written from the build's dyno runs and profile inside the transaction that changed either, so it
// can never disagree with them once that transaction commits.

/**
 * Rewrites the rows of these builds from their runs as stored now. The caller holds the builds' rows
 * locked (FOR UPDATE) so two writes to one build take turns; the runs are read with a locking read,
 * which sees every committed run whatever the transaction's snapshot.
 */
export async function refreshDynoGains(buildIds: readonly number[], t: Transaction): Promise<void> {
  if (buildIds.length === 0) return;
  const ids = [...new Set(buildIds)];
  const [builds, runs] = await Promise.all([
    Build.findAll({ where: { id: { [Op.in]: ids } }, attributes: ['id', 'profile'], transaction: t }),
    DynoRun.findAll({
      where: { buildId: { [Op.in]: ids } },
      attributes: [
        'id',
        'buildId',
        'phase',
        'dynoType',
        'camId',
        'peakHp',
        'curve',
        'correctionStandard',
        'airTempC',
        'baroKpa',
        'humidityPct',
      ],
      order: [
        ['buildId', 'ASC'],
        ['id', 'ASC'],
      ],
      lock: t.LOCK.SHARE,
      transaction: t,
    }),
  ]);
  // A profile that no longer parses is left out rather than guessed at.
  const profiles = new Map<number, BuildProfile>();
  for (const b of builds) {
    const parsed = BuildProfileSchema.safeParse(b.profile);
    if (parsed.success) profiles.set(b.id, parsed.data);
  }
  const forHistory: RunForHistory[] = runs.map((r) => {
    const f = runCorrection(r)?.factor;
    return {
      buildId: r.buildId,
      phase: r.phase,
      dynoType: r.dynoType,
      camId: r.camId ?? null,
      correctedPeakHp: f !== undefined && r.peakHp !== null ? correctedFigure(r.peakHp, f) : null,
      correctedCurve:
        f !== undefined && r.curve
          ? r.curve.map((p) => ({ rpm: p.rpm, torqueLbFt: correctedFigure(p.torqueLbFt, f) }))
          : null,
    };
  });
  const runsByBench = new Map<string, RunForHistory[]>();
  for (const r of forHistory) {
    const key = `${r.buildId}:${r.dynoType}`;
    runsByBench.set(key, [...(runsByBench.get(key) ?? []), r]);
  }
  // One build and kind of dyno at a time, so every entry is known to be that build's, on that dyno.
  const rows = [...runsByBench.values()].flatMap((list) =>
    historyFromRuns(list, profiles).map((e) => ({
      buildId: list[0].buildId,
      camId: Number(e.camId),
      dynoType: list[0].dynoType,
      displacementCi: e.displacementCi,
      intakeFlowCfm: e.intakeFlowCfm!,
      headers: e.headers!,
      exhaustSystem: e.system!,
      intakeManifold: e.intakeManifold!,
      gainPctPeakHp: e.measuredGainPctPeakHp,
      // Hundredths of a percent are far finer than a dyno repeats; the row stays small.
      gainPctByRpm:
        e.measuredGainPctByRpm?.map((p) => ({ rpm: p.rpm, gainPct: Math.round(p.gainPct * 100) / 100 })) ?? null,
    })),
  );
  await DynoGain.destroy({ where: { buildId: { [Op.in]: ids } }, transaction: t });
  if (rows.length) await DynoGain.bulkCreate(rows, { transaction: t });
}

/** Every build with dyno runs refiled, a chunk of builds per transaction (after the migration, or at scale). */
export async function refreshAllDynoGains(chunk = 500): Promise<number> {
  const sequelize = db();
  const [rows] = await sequelize.query('SELECT DISTINCT build_id AS id FROM dyno_runs ORDER BY build_id');
  const ids = (rows as { id: number }[]).map((r) => Number(r.id));
  for (let i = 0; i < ids.length; i += chunk) {
    const part = ids.slice(i, i + chunk);
    await sequelize.transaction(async (t) => {
      await Build.findAll({
        where: { id: { [Op.in]: part } },
        attributes: ['id'],
        lock: t.LOCK.UPDATE,
        transaction: t,
      });
      await refreshDynoGains(part, t);
    });
  }
  return ids.length;
}
