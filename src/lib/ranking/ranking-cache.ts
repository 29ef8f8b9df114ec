import { createHash } from 'node:crypto';
import { LRUCache } from 'lru-cache';

// Why a cache: the engine-cycle model costs about 10 ms of CPU per cam curve and runs on the event loop, so
// every request behind a ranking waits for it. The same question comes back often (the advisor page asked
// again for the same build, a quote drafted and then sent for the same build and cam, a page reloaded), and
// the answer is a pure function of its inputs.
//
// Why it cannot go stale: the key is a hash of everything the ranking reads — the build as sent, the cam
// cards, the dyno history, the need rules, the rated spring kits, the labour rate and whether curves are wanted — and the caller
// reads those from the database on every request. A catalogue, rule, settings or dyno-history write changes
// the key, so there is nothing to invalidate by hand and no write path that can forget to.

/** Enough for a counter's day of distinct builds; each entry is one ranking of a demo-sized catalogue (~100 kB). */
export const RANKING_CACHE_ENTRIES = 64;
/** Rankings of larger catalogues (megabytes each, seconds to compute, rarely repeated) are not kept. */
export const RANKING_CACHE_MAX_CAMS = 200;

export type RankingInputs = {
  build: unknown;
  cards: readonly unknown[];
  history: readonly unknown[];
  rules: readonly unknown[];
  /** The catalogue's rated spring kits the springs need picks from (src/lib/catalogue/spring-kits.ts). */
  springKits: readonly unknown[];
  laborRateCents: number;
  includeCurves: boolean;
};

/** The cache's key: a digest of the exact inputs (JSON keeps the order objects were built in, which is fixed). */
export function rankingKey(inputs: RankingInputs): string {
  return createHash('sha256').update(JSON.stringify(inputs)).digest('base64url');
}

/** Kept answers are shared by every request that asks the same: frozen, so code that edits one fails loudly. */
function deepFreeze<T>(value: T): T {
  // Typed arrays cannot be frozen (the engine refuses); the advisor's answer holds plain arrays of numbers.
  if (value && typeof value === 'object' && !ArrayBuffer.isView(value) && !Object.isFrozen(value)) {
    Object.freeze(value);
    // A Map's entries are not properties; freeze what they hold (the Map itself stays settable, so kept maps are only read).
    const children = value instanceof Map ? [...value.values()] : Object.values(value);
    for (const child of children) deepFreeze(child);
  }
  return value;
}

export type RankingCache<T extends object> = {
  /** The kept answer for these inputs, or `compute()`'s (kept when the catalogue is small enough). */
  get(inputs: RankingInputs, compute: () => T): T;
  clear(): void;
};

export function createRankingCache<T extends object>(max = RANKING_CACHE_ENTRIES): RankingCache<T> {
  const kept = new LRUCache<string, T>({ max });
  return {
    get(inputs, compute) {
      if (inputs.cards.length > RANKING_CACHE_MAX_CAMS) return compute();
      const key = rankingKey(inputs);
      const hit = kept.get(key);
      if (hit) return hit;
      const value = deepFreeze(compute());
      kept.set(key, value);
      return value;
    },
    clear: () => kept.clear(),
  };
}
