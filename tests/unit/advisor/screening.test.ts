import { rankCams, type CamRanking } from '@/lib/advisor';
import { SCREENING } from '@/lib/advisor/screening';
import type { BuildProfile } from '@/lib/schemas/build-profile';
import type { CamCard } from '@/lib/schemas/cam-card';
import { generatedCatalogue } from '../../../src/cli/generated-catalogue';
import { variant } from './fixtures';

// The large-catalogue screen must never change the top ten against the full model. The full ranking is
// built here without the screen: each cam's score depends only on that cam and the build, so ranking the
// catalogue in slices no larger than the full-model limit and merging gives the full model's order.
function fullModelRanking(b: BuildProfile, cams: CamCard[]): CamRanking[] {
  const all: CamRanking[] = [];
  for (let i = 0; i < cams.length; i += SCREENING.fullModelUpToCams)
    all.push(...rankCams(b, cams.slice(i, i + SCREENING.fullModelUpToCams)).rankings);
  const id = (r: CamRanking) => String(r.camId);
  return all.sort(
    (a, c) =>
      c.score - a.score ||
      c.subscores.powerband - a.subscores.powerband ||
      (id(a) < id(c) ? -1 : id(a) > id(c) ? 1 : 0),
  );
}

const builds: [string, BuildProfile][] = [
  [
    '5.3 L daily truck, full exhaust',
    variant({
      engine: { boreIn: 3.78, intakeFlowCfm: 240, cylinderDeactivation: 'none' },
      exhaust: { primaryIn: 1.75, system: 'full' },
    }),
  ],
  [
    '6.0 L street car, single plane, manual',
    variant({
      engine: { boreIn: 4.0, compressionRatio: 10.5, intakeFlowCfm: 300, intakeManifold: 'single-plane' },
      drivetrain: { transmission: 'manual' },
      vehicle: { weightLb: 3600, powerBrakes: 'hydraulic' },
      use: { primary: 'street', idle: 'aggressive', budgetCents: 400000 },
    }),
  ],
];

describe('large-catalogue screening (an upper bound on each score, then the full model)', () => {
  // Twice the full-model limit: big enough to screen, small enough to model whole for the comparison.
  const cams = generatedCatalogue(SCREENING.fullModelUpToCams * 2, 7);

  it.each(builds)("%s: the top ten and their figures are the full model's", (_name, b) => {
    const screened = rankCams(b, cams);
    const full = fullModelRanking(b, cams);
    expect(screened.rankings.slice(0, 10).map((r) => r.camId)).toEqual(full.slice(0, 10).map((r) => r.camId));
    expect(screened.rankings.slice(0, 10)).toEqual(full.slice(0, 10).map((r, i) => ({ ...r, rank: i + 1 })));
    // Every cam is either ranked or ruled out, once; a ruled-out cam's bound is below the tenth score and
    // really is a bound: its full-model score is not above it.
    const ids = [...screened.rankings.map((r) => r.camId), ...screened.ruledOut.map((r) => r.camId)];
    expect(new Set(ids).size).toBe(cams.length);
    const tenth = screened.rankings[9].score;
    const fullScore = new Map(full.map((r) => [r.camId, r.score]));
    for (const r of screened.ruledOut) {
      expect(r.maxScore).toBeLessThan(tenth);
      expect(fullScore.get(r.camId)!).toBeLessThanOrEqual(r.maxScore + SCREENING.roundingPoints);
    }
  });

  it('saves work: a smooth-idle daily truck rules out cams whose idle alone keeps them out of the top ten', () => {
    const r = rankCams(builds[0][1], cams);
    // 17 of these 80 on this build when written; the 1,000-cam bench rules out about half.
    expect(r.ruledOut.length).toBeGreaterThanOrEqual(10);
    expect(r.rankings.length + r.ruledOut.length).toBe(cams.length);
  });

  it('small catalogues are always modelled whole', () => {
    const r = rankCams(builds[0][1], cams.slice(0, 12));
    expect(r.rankings).toHaveLength(12);
    expect(r.ruledOut).toEqual([]);
  });
});
