import { rankCams, type NeedKind, type RankingResult } from '@/lib/advisor';
import { evaluateNeedRules, type Need as CatalogueNeed, type NeedRuleInput } from '@/lib/catalogue/need-rules';
import { camCardsForRanking } from '@/lib/db/queries/advisor-cams';
import { loadDynoHistory } from '@/lib/db/queries/dyno-history';
import { loadNeedRules } from '@/lib/db/queries/rules';
import { getShopSettings } from '@/lib/db/queries/settings';
import type { BuildProfile } from '@/lib/schemas/build-profile';

// Joins the pure advisor to the shop's data: its catalogue, its need rules and its labour rate.
// The advisor says what a cam needs in kinds ("springs", "converter"); the manager's rules say
// which parts and labour operations those are, so the shortlist and the quote agree.

export type PricedItem = CatalogueNeed & { priceCents: number };
export type ShopRankingEntry = RankingResult['rankings'][number] & {
  camPriceCents: number; neededItems: PricedItem[]; neededItemsCents: number;
  /** Units on the shop's shelf (the catalogue's stock on hand), and whether the cam is emissions-certified. */
  stockOnHand: number; emissionsCertified: boolean;
};
export type ShopRanking = Omit<RankingResult, 'rankings'> & {
  rankings: ShopRankingEntry[];
};

const RULE_KIND_FOR_NEED: Record<NeedKind, NeedRuleInput['kind']> = {
  springs: 'lift-over',
  'deactivation-delete': 'deactivation-active',
  converter: 'crossover-over-stall',
  tune: 'always',
};

function itemPriceCents(need: CatalogueNeed, laborRateCents: number): number {
  if (need.type === 'part') return Math.round((need.part?.priceCents ?? 0) * need.quantity);
  return Math.round((need.laborOperation?.hours ?? 0) * need.quantity * laborRateCents);
}

/** What each kind of need costs under the shop's rules, so the budget check sees the whole job. */
function needPricesCents(rules: NeedRuleInput[], laborRateCents: number): Partial<Record<NeedKind, number>> {
  const prices: Partial<Record<NeedKind, number>> = {};
  for (const [kind, ruleKind] of Object.entries(RULE_KIND_FOR_NEED) as [NeedKind, NeedRuleInput['kind']][]) {
    const total = rules
      .filter((r) => r.kind === ruleKind)
      .flatMap((r) => r.items)
      .reduce((sum, item) => {
        const part = (item.part?.priceCents ?? 0) * item.quantity;
        const labor = (item.laborOperation?.hours ?? 0) * item.quantity * laborRateCents;
        return sum + part + labor;
      }, 0);
    if (total > 0) prices[kind] = Math.round(total);
  }
  return prices;
}

export async function rankForShop(
  build: BuildProfile,
  { camIds, includeCurves = true }: { camIds?: number[]; includeCurves?: boolean } = {},
): Promise<{ ok: true; result: ShopRanking } | { ok: false; missingIds: number[] }> {
  // The shop's measured before/after results (dyno runs) nudge the predicted gains of the cams they were measured on.
  const [{ cards, missingIds, stockOnHand }, rules, settings, history] = await Promise.all([camCardsForRanking(camIds), loadNeedRules(), getShopSettings(), loadDynoHistory()]);
  if (missingIds.length) return { ok: false, missingIds };
  const laborRateCents = settings?.laborRateCents ?? 0;
  const result = rankCams(build, cards, { history, needPriceCents: needPricesCents(rules, laborRateCents), includeCurves });
  const byId = new Map(cards.map((card) => [String(card.id), card]));
  const rankings = result.rankings.map((ranking) => {
    const card = byId.get(String(ranking.camId))!;
    const neededItems = evaluateNeedRules(rules, {
      cam: { intakeLiftIn: card.intakeLiftIn, exhaustLiftIn: card.exhaustLiftIn, deactivationCompatible: Boolean(card.deactivationCompatible) },
      build: { cylinderDeactivation: build.engine.cylinderDeactivation, stallRpm: build.drivetrain.stallRpm },
      crossoverRpm: ranking.crossoverRpm,
    }).map((need) => ({ ...need, priceCents: itemPriceCents(need, laborRateCents) }));
    return {
      ...ranking,
      camPriceCents: card.priceCents ?? 0,
      neededItems,
      neededItemsCents: neededItems.reduce((sum, item) => sum + item.priceCents, 0),
      stockOnHand: stockOnHand.get(String(ranking.camId)) ?? 0,
      emissionsCertified: card.emissionsCertified === true,
    };
  });
  return { ok: true, result: { ...result, rankings } };
}
