import 'server-only';
import { Op, type WhereOptions } from 'sequelize';
import { displacementCi } from '@/lib/advisor/geometry';
import type { HistoryEntry } from '@/lib/advisor/types';
import { similarityWindow } from '@/lib/dyno/history';
import type { BuildProfile } from '@/lib/schemas/build-profile';
import { DynoGain } from '../models';

/**
 * The most records a ranking reads on each side of the engine's displacement (so twice this in all).
 * Our choice: the advisor counts the shop's evidence against a prior worth two perfect matches, so a
 * few hundred nearest jobs say all the history can say; the bound keeps a ranking's cost flat however
 * many runs the shop has stored.
 */
export const HISTORY_ROWS_PER_SIDE = 200;

type InferredGain = Pick<
  DynoGain,
  | 'id'
  | 'camId'
  | 'displacementCi'
  | 'intakeFlowCfm'
  | 'headers'
  | 'exhaustSystem'
  | 'intakeManifold'
  | 'gainPctPeakHp'
  | 'gainPctByRpm'
>;

function entryOf(row: InferredGain): HistoryEntry {
  return {
    camId: row.camId,
    measuredGainPctPeakHp: row.gainPctPeakHp,
    displacementCi: row.displacementCi,
    intakeFlowCfm: row.intakeFlowCfm,
    headers: row.headers,
    system: row.exhaustSystem,
    intakeManifold: row.intakeManifold,
    ...(row.gainPctByRpm && row.gainPctByRpm.length >= 2 ? { measuredGainPctByRpm: row.gainPctByRpm } : {}),
  };
}

/**
 * The shop's measured results that can count for this engine, as the advisor's options.history: the
 * jobs within the similarity window (src/lib/dyno/history.ts), nearest displacement first on each side,
 * at most HISTORY_ROWS_PER_SIDE per side, read off the dyno_gains indexes. With exactly one cam asked
 * for, only that cam's jobs are read. `excludeBuildId` leaves one build's own results out (the job page
 * draws the prediction over that build's pulls, so it must not have learnt from them).
 */
export async function loadDynoHistory(
  build: BuildProfile,
  camIds?: readonly number[],
  { excludeBuildId }: { excludeBuildId?: number } = {},
): Promise<HistoryEntry[]> {
  const e = build.engine;
  const here = displacementCi(e.boreIn, e.strokeIn, e.cylinders);
  const window = similarityWindow(here, e.intakeFlowCfm);
  const oneCam = camIds?.length === 1 ? { camId: camIds[0] } : {};
  const flow = { intakeFlowCfm: { [Op.between]: window.intakeFlowCfm } };
  const notThisBuild = excludeBuildId === undefined ? {} : { buildId: { [Op.ne]: excludeBuildId } };
  const side = (where: WhereOptions<DynoGain>, direction: 'ASC' | 'DESC') =>
    DynoGain.findAll({
      attributes: [
        'id',
        'camId',
        'displacementCi',
        'intakeFlowCfm',
        'headers',
        'exhaustSystem',
        'intakeManifold',
        'gainPctPeakHp',
        'gainPctByRpm',
      ],
      where: { ...oneCam, ...where, ...flow, ...notThisBuild },
      // The index order: no sort, and the LIMIT stops the range read early.
      order: [
        ['displacementCi', direction],
        ['intakeFlowCfm', direction],
        ['id', direction],
      ],
      limit: HISTORY_ROWS_PER_SIDE,
    });
  const [above, below] = await Promise.all([
    side({ displacementCi: { [Op.gte]: here, [Op.lte]: window.displacementCi[1] } }, 'ASC'),
    side({ displacementCi: { [Op.gte]: window.displacementCi[0], [Op.lt]: here } }, 'DESC'),
  ]);
  const wanted = camIds && camIds.length > 1 ? new Set(camIds.map(String)) : null;
  return [...above, ...below]
    .sort((a, b) => a.id - b.id)
    .filter((row) => !wanted || wanted.has(String(row.camId)))
    .map(entryOf);
}
