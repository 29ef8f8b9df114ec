import { Op, type WhereOptions } from 'sequelize';
import { camCardOf } from '@/lib/catalogue/cam-card-of';
import type { CamCard } from '@/lib/schemas/cam-card';
import { Cam, db } from '../models';

/**
 * The cams a ranking considers: the named ones (active or not, so a saved shortlist can be re-run),
 * or every active, non-archived cam the shop sells (factory baseline cards are references, not stock).
 */
export async function camCardsForRanking(camIds?: number[]): Promise<{ cards: CamCard[]; missingIds: number[] }> {
  db();
  const where: WhereOptions = camIds?.length
    ? { id: { [Op.in]: camIds } }
    : { active: true, archivedAt: null, isFactoryBaseline: false };
  const cams = await Cam.findAll({ where, order: [['intakeDuration050', 'ASC'], ['id', 'ASC']] });
  const found = new Set(cams.map((c) => c.id));
  return { cards: cams.map(camCardOf), missingIds: (camIds ?? []).filter((id) => !found.has(id)) };
}
