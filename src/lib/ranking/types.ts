import type { RankingResult } from '@/lib/advisor';
import type { Need as CatalogueNeed } from '@/lib/catalogue/need-rules';
import type { VehicleClass } from '@/lib/schemas/build-profile';

// The shop's ranking as POST /api/advisor/rank answers it and the advisor page, the shortlist and the
// quote's frozen advice read it: the advisor's result with each cam's priced job added.

export type PricedItem = CatalogueNeed & { priceCents: number };
export type ShopRankingEntry = RankingResult['rankings'][number] & {
  camPriceCents: number;
  neededItems: PricedItem[];
  neededItemsCents: number;
  /** The whole job before tax (cam, needed parts and labour, tune), cents; null when the cam has no price. */
  jobPriceCents: number | null;
  /** Units on the shop's shelf (the catalogue's stock on hand), and whether the cam is emissions-certified. */
  stockOnHand: number;
  emissionsCertified: boolean;
};
export type ShopRanking = Omit<RankingResult, 'rankings'> & {
  rankings: ShopRankingEntry[];
  vehicleClass: VehicleClass;
  /** How many of the rankings, from the top, carry their curve; the rest have an empty one (ask for them by camIds). */
  curvesIncluded: number;
};
