import { Op } from 'sequelize';
import { Build, db, DynoRun } from '@/lib/db/models';
import { refreshDynoGains } from '@/lib/db/queries/dyno-gains';

/**
 * Deletes a test's dyno runs straight from the table and refiles their builds' measured history, as the
 * app's own delete does (dyno_gains is written with the runs; a bare DELETE would leave it describing runs
 * that are gone, and the next test's ranking would find them).
 */
export async function removeDynoRuns(ids: readonly number[]): Promise<void> {
  if (ids.length === 0) return;
  const runs = await DynoRun.findAll({ where: { id: { [Op.in]: [...ids] } }, attributes: ['id', 'buildId'] });
  const buildIds = [...new Set(runs.map((r) => r.buildId))];
  await db().transaction(async (t) => {
    await Build.findAll({
      where: { id: { [Op.in]: buildIds } },
      attributes: ['id'],
      lock: t.LOCK.UPDATE,
      transaction: t,
    });
    await DynoRun.destroy({ where: { id: { [Op.in]: [...ids] } }, transaction: t });
    await refreshDynoGains(buildIds, t);
  });
}
