import 'server-only';
import { Op, type WhereOptions } from 'sequelize';
import { camCardOf } from '@/lib/catalogue/cam-card-of';
import type { CamCard } from '@/lib/schemas/cam-card';
import { Cam } from '../models';

/**
 * The cams a ranking considers: the named ones (active or not, so a saved shortlist can be re-run),
 * or every active, non-archived cam the shop sells (factory baseline cards are references, not stock).
 */
export async function camCardsForRanking(
  camIds?: number[],
): Promise<{ cards: CamCard[]; missingIds: number[]; stockOnHand: Map<string, number> }> {
  const where: WhereOptions = camIds?.length
    ? { id: { [Op.in]: camIds } }
    : { active: true, archivedAt: null, isFactoryBaseline: false };
  const cams = await Cam.findAll({
    where,
    order: [
      ['intakeDuration050', 'ASC'],
      ['id', 'ASC'],
    ],
  });
  const found = new Set(cams.map((c) => c.id));
  // Stock is the shop's, not the cam's: kept beside the cards (the advisor never sees it), keyed as the cards' ids are.
  const stockOnHand = new Map(cams.map((c) => [String(c.id), c.stockOnHand]));
  return { cards: cams.map(camCardOf), missingIds: (camIds ?? []).filter((id) => !found.has(id)), stockOnHand };
}
