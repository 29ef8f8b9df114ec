import 'server-only';
import { rankCams, type Need as AdvisorNeed } from '@/lib/advisor';
import { evaluateNeedRules, type NeedRuleInput } from '@/lib/catalogue/need-rules';
import type { SpringKit } from '@/lib/catalogue/spring-kits';
import { camCardsForRanking } from '@/lib/db/queries/advisor-cams';
import { loadDynoHistory } from '@/lib/db/queries/dyno-history';
import { loadSpringKits } from '@/lib/db/queries/parts';
import { loadNeedRules } from '@/lib/db/queries/rules';
import { getShopSettings } from '@/lib/db/queries/settings';
import { jobItemLine, jobLines, jobPriceCents } from '@/lib/quotes/job-price';
import { lineNetCents } from '@/lib/quotes/pricing';
import { vehicleClassOf, type BuildProfile, type VehicleClass } from '@/lib/schemas/build-profile';
import type { CamCard } from '@/lib/schemas/cam-card';
import { createRankingCache } from './ranking-cache';
import type { PricedItem, ShopRanking } from './types';

// Joins the pure advisor to the shop's data: its catalogue, its need rules, its labour rate and its dyno
// history. It calls the query layer (src/lib/db/queries), never the other way round: a query module that
// needs a ranking is handed one by its caller (ESLint refuses db/queries → ranking).
//
// The advisor says what a cam needs in kinds ("springs", "install"); the manager's rules say which
// parts and labour those are for this vehicle class; jobLines()/jobPriceCents() price the whole job
// once, and that one number is what the cost reason, the shortlist, the customer and the quote show.

/** Curves are the bulk of an answer (2,000 cams: ~18 MB); by default only the top of the list carries them. */
export const DEFAULT_CURVE_LIMIT = 20;

type Priced = { items: PricedItem[]; jobPriceCents: number | null };

/** The advisor's answer and the job it priced per cam, kept per exact input (see ranking-cache.ts). Read only. */
const keptRankings = createRankingCache<{ result: ReturnType<typeof rankCams>; priced: ReadonlyMap<string, Priced> }>();

/** The rules' parts and labour for a cam's needs, each priced as its quote line will be. */
export function pricedItems(
  rules: readonly NeedRuleInput[],
  needs: readonly AdvisorNeed[],
  vehicleClass: VehicleClass,
  laborRateCents: number,
  springKits?: readonly SpringKit[],
): PricedItem[] {
  return evaluateNeedRules(rules, { needs, vehicleClass, springKits }).map((need) => {
    const line = jobItemLine(need, laborRateCents);
    return { ...need, priceCents: line ? lineNetCents(line) : 0 };
  });
}

export async function rankForShop(
  build: BuildProfile,
  {
    camIds,
    includeCurves = true,
    curveLimit = DEFAULT_CURVE_LIMIT,
    excludeBuildId,
  }: { camIds?: number[]; includeCurves?: boolean; curveLimit?: number; excludeBuildId?: number } = {},
): Promise<{ ok: true; result: ShopRanking } | { ok: false; missingIds: number[] }> {
  // The shop's measured before/after results on similar engines nudge the predicted gains of the cams they were measured on.
  const [{ cards, missingIds, stockOnHand }, rules, springKits, settings, history] = await Promise.all([
    camCardsForRanking(camIds),
    loadNeedRules(),
    loadSpringKits(),
    getShopSettings(),
    loadDynoHistory(build, camIds, { excludeBuildId }),
  ]);
  if (missingIds.length) return { ok: false, missingIds };
  const laborRateCents = settings?.laborRateCents ?? 0;
  const vehicleClass = vehicleClassOf(build);
  const compute = () => {
    const priced = new Map<string, Priced>();
    // Called by the advisor once per cam with the needs it found; the job it prices is kept for the entry.
    const priceJob = (cam: CamCard, needs: readonly AdvisorNeed[]): number | null => {
      const items = pricedItems(rules, needs, vehicleClass, laborRateCents, springKits);
      const job =
        cam.priceCents === undefined
          ? null
          : jobPriceCents(
              jobLines({ id: 0, description: cam.name, priceCents: cam.priceCents }, items, laborRateCents),
            );
      priced.set(String(cam.id), { items, jobPriceCents: job });
      return job;
    };
    return { result: rankCams(build, cards, { history, jobPriceCents: priceJob, includeCurves }), priced };
  };
  const { result, priced } = keptRankings.get(
    { build, cards, history, rules, springKits, laborRateCents, includeCurves },
    compute,
  );
  const byId = new Map(cards.map((card) => [String(card.id), card]));
  const curvesIncluded = includeCurves ? Math.min(curveLimit, result.rankings.length) : 0;
  const rankings = result.rankings.map((full, index) => {
    const ranking = index < curvesIncluded ? full : { ...full, curve: [] };
    const card = byId.get(String(ranking.camId))!;
    const { items, jobPriceCents: job } = priced.get(String(ranking.camId)) ?? { items: [], jobPriceCents: null };
    return {
      ...ranking,
      camPriceCents: card.priceCents ?? 0,
      neededItems: items,
      neededItemsCents: items.reduce((sum, item) => sum + item.priceCents, 0),
      jobPriceCents: job,
      stockOnHand: stockOnHand.get(String(ranking.camId)) ?? 0,
      emissionsCertified: card.emissionsCertified === true,
    };
  });
  return { ok: true, result: { ...result, rankings, vehicleClass, curvesIncluded } };
}
