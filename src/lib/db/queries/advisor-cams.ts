import { Op, type WhereOptions } from 'sequelize';
import type { CamCard } from '@/lib/schemas/cam-card';
import { Cam, db } from '../models';

type CamCardSource = Pick<
  Cam,
  'id' | 'sku' | 'name' | 'intakeDuration050' | 'exhaustDuration050' | 'intakeAdvertised' | 'exhaustAdvertised' | 'intakeLiftIn' |
  'exhaustLiftIn' | 'lsa' | 'intakeCenterline' | 'rockerRatio' | 'deactivationCompatible' | 'emissionsCertified' | 'springMaxLiftIn' | 'priceCents'
>;

/** A catalogue cam (model row or API record) as the advisor's cam card; the advisor never sees the database. */
export function camCardOf(cam: CamCardSource): CamCard {
  return {
    id: cam.id,
    name: `${cam.sku} ${cam.name}`,
    intakeDuration050: cam.intakeDuration050,
    exhaustDuration050: cam.exhaustDuration050,
    intakeAdvertised: cam.intakeAdvertised ?? undefined,
    exhaustAdvertised: cam.exhaustAdvertised ?? undefined,
    intakeLiftIn: cam.intakeLiftIn,
    exhaustLiftIn: cam.exhaustLiftIn,
    lsa: cam.lsa,
    intakeCenterline: cam.intakeCenterline,
    rockerRatio: cam.rockerRatio,
    deactivationCompatible: cam.deactivationCompatible,
    emissionsCertified: cam.emissionsCertified,
    springMaxLiftIn: cam.springMaxLiftIn ?? undefined,
    priceCents: cam.priceCents,
  };
}

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
