import { rankCams } from '@/lib/advisor';
import {
  RANKING_CACHE_MAX_CAMS,
  createRankingCache,
  rankingKey,
  type RankingInputs,
} from '@/lib/ranking/ranking-cache';
import { bigCam, dynoBuild, stockTruckCam, truckCam } from '../advisor/fixtures';

// The ranking cache answers a repeated question without the model, and any change to what the ranking
// reads (a catalogue, rule, settings or dyno-history write shows up as different inputs) asks the model again.

const inputs = (patch: Partial<RankingInputs> = {}): RankingInputs => ({
  build: dynoBuild,
  cards: [truckCam, bigCam],
  history: [{ camId: truckCam.id, measuredGainPctPeakHp: 6.5, displacementCi: 325 }],
  rules: [{ id: 1, label: 'Springs', items: [] }],
  springKits: [{ id: 2, sku: 'KIT', maxLiftIn: 0.6 }],
  laborRateCents: 12_500,
  includeCurves: true,
  ...patch,
});

function counted() {
  let runs = 0;
  return {
    compute: () => {
      runs += 1;
      return { run: runs, list: [{ score: 1 }] };
    },
    runs: () => runs,
  };
}

describe('ranking cache', () => {
  it('answers the same inputs from the kept ranking without running the model again', () => {
    const cache = createRankingCache<{ run: number }>();
    const model = counted();
    const first = cache.get(inputs(), model.compute);
    // Built afresh, as each request reads them from the database: equal content, new objects.
    const second = cache.get(inputs(), model.compute);
    expect(model.runs()).toBe(1);
    expect(second).toBe(first);
  });

  it.each<[string, Partial<RankingInputs>]>([
    ['a cam card changed (catalogue write)', { cards: [truckCam, { ...bigCam, priceCents: 51_000 }] }],
    ['a cam added to the catalogue', { cards: [truckCam, bigCam, stockTruckCam] }],
    [
      'a dyno run recorded (history write)',
      {
        history: [
          { camId: truckCam.id, measuredGainPctPeakHp: 6.5, displacementCi: 325 },
          { camId: bigCam.id, measuredGainPctPeakHp: 9.1, displacementCi: 330 },
        ],
      },
    ],
    ['a need rule edited', { rules: [{ id: 1, label: 'Springs and retainers', items: [] }] }],
    ['a spring kit re-rated (catalogue write)', { springKits: [{ id: 2, sku: 'KIT', maxLiftIn: 0.62 }] }],
    ['the labour rate changed (settings write)', { laborRateCents: 13_000 }],
    ['curves left out', { includeCurves: false }],
    ['another build', { build: { ...dynoBuild, use: { ...dynoBuild.use, cruiseMph: 65 } } }],
  ])('runs the model again when %s', (_name, patch) => {
    const cache = createRankingCache<{ run: number }>();
    const model = counted();
    cache.get(inputs(), model.compute);
    const changed = cache.get(inputs(patch), model.compute);
    expect(changed.run).toBe(2);
    expect(rankingKey(inputs(patch))).not.toBe(rankingKey(inputs()));
  });

  it('keeps at most its number of entries, forgetting the least recently used', () => {
    const cache = createRankingCache<{ run: number }>(2);
    const model = counted();
    cache.get(inputs({ laborRateCents: 1 }), model.compute);
    cache.get(inputs({ laborRateCents: 2 }), model.compute);
    cache.get(inputs({ laborRateCents: 1 }), model.compute); // 1 is now the most recent
    cache.get(inputs({ laborRateCents: 3 }), model.compute); // evicts 2
    expect(model.runs()).toBe(3);
    cache.get(inputs({ laborRateCents: 1 }), model.compute);
    expect(model.runs()).toBe(3);
    cache.get(inputs({ laborRateCents: 2 }), model.compute);
    expect(model.runs()).toBe(4);
  });

  it('does not keep rankings of catalogues larger than its limit', () => {
    const cache = createRankingCache<{ run: number }>();
    const model = counted();
    const many = inputs({
      cards: Array.from({ length: RANKING_CACHE_MAX_CAMS + 1 }, (_, i) => ({ ...truckCam, id: i })),
    });
    cache.get(many, model.compute);
    cache.get(many, model.compute);
    expect(model.runs()).toBe(2);
  });

  it('hands out a real ranking frozen and unchanged, so a caller cannot edit the shared copy', () => {
    const cache = createRankingCache<ReturnType<typeof rankCams>>();
    const fresh = rankCams(dynoBuild, [truckCam, bigCam]);
    const kept = cache.get(inputs(), () => rankCams(dynoBuild, [truckCam, bigCam]));
    expect(JSON.stringify(kept)).toBe(JSON.stringify(fresh));
    expect(Object.isFrozen(kept.rankings[0].reasons)).toBe(true);
    expect(() => {
      (kept.rankings as unknown as unknown[]).push({});
    }).toThrow(TypeError);
  });
});
