import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { rankCams, SCORING_WEIGHTS } from '@/lib/advisor';
import { bigCam, cam, dynoBuild, stockTruckCam, truckCam, variant } from './fixtures';

const order = (r: ReturnType<typeof rankCams>) => r.rankings.map((x) => x.camId);

describe('rankings (common practice, no published source)', () => {
  it('daily truck on a stock 2,200 converter: the truck cam ranks above the bigger one', () => {
    for (const system of ['full', 'open-short'] as const) {
      const b = variant({
        exhaust: { system },
        use: { primary: 'daily', idle: 'smooth' },
        drivetrain: { stallRpm: 2200 },
      });
      expect(order(rankCams(b, [bigCam, truckCam]))).toEqual(['truck-212', 'big-219']);
    }
  });

  it('towing truck on a stock converter: the truck cam ranks above the bigger one', () => {
    const b = variant({
      use: { primary: 'towing', idle: 'smooth' },
      drivetrain: { stallRpm: 2000 },
      vehicle: { weightLb: 6500 },
    });
    expect(order(rankCams(b, [bigCam, truckCam]))).toEqual(['truck-212', 'big-219']);
  });

  it('street/strip with a 3,000+ converter and an aggressive idle allowed: the bigger cam ranks above', () => {
    for (const primary of ['street', 'strip'] as const)
      for (const stallRpm of [3000, 3400]) {
        const b = variant({
          use: { primary, idle: 'aggressive' },
          drivetrain: { stallRpm },
          vehicle: { weightLb: 3600 },
        });
        expect(order(rankCams(b, [truckCam, bigCam]))).toEqual(['big-219', 'truck-212']);
      }
  });

  it('ranks are 1..n by score, scores within 0–100, and the output has the contract shape', () => {
    const r = rankCams(dynoBuild, [truckCam, bigCam, stockTruckCam]);
    expect(r.rankings.map((x) => x.rank)).toEqual([1, 2, 3]);
    for (let i = 1; i < r.rankings.length; i++)
      expect(r.rankings[i].score).toBeLessThanOrEqual(r.rankings[i - 1].score);
    for (const x of r.rankings) {
      expect(x.score).toBeGreaterThanOrEqual(0);
      expect(x.score).toBeLessThanOrEqual(100);
      expect(Object.keys(x.subscores).sort()).toEqual(Object.keys(SCORING_WEIGHTS).sort());
      expect(Object.keys(x.predicted).sort()).toEqual([
        'gainPctPeakHp',
        'lowEndLossPct',
        'peakHp',
        'peakHpRpm',
        'peakTorqueLbFt',
        'peakTorqueRpm',
      ]);
      expect(Object.keys(x.valveEvents)).toEqual(
        expect.arrayContaining(['ivo', 'ivc', 'evo', 'evc', 'overlap', 'exhaustCenterline']),
      );
      // Every sub-score yields a reason.
      expect(x.reasons.map((r) => r.subscore).sort()).toEqual(Object.keys(SCORING_WEIGHTS).sort());
      for (const reason of x.reasons) expect(reason.text.length).toBeGreaterThan(20);
    }
    expect(r.baseline.curve.length).toBe(56);
    expect(r.baseline.predicted.gainPctPeakHp).toBe(0);
  });

  it('the baseline cam never out-pulls itself: crossover null, gain 0 (definition of the crossover)', () => {
    const x = rankCams(dynoBuild, [stockTruckCam]).rankings[0];
    expect(x.crossoverRpm).toBeNull();
    expect(x.predicted.gainPctPeakHp).toBe(0);
  });
});

describe('needs', () => {
  it('springs when lift exceeds the installed springs, with the lift the kit must reach', () => {
    const b = variant({ baselineCam: { ...stockTruckCam, springMaxLiftIn: 0.57 } });
    const needs = (c: typeof truckCam) => rankCams(b, [c]).rankings[0].needs;
    expect(needs(truckCam).some((n) => n.kind === 'springs')).toBe(false); // 0.565" ≤ 0.570"
    expect(needs(bigCam).find((n) => n.kind === 'springs')?.minLiftIn).toBe(0.595);
  });

  it('a deactivation delete when deactivation is active and the cam is not compatible', () => {
    const b = variant({ engine: { cylinderDeactivation: 'active' } });
    const kinds = (c: typeof truckCam) => rankCams(b, [c]).rankings[0].needs.map((n) => n.kind);
    expect(kinds(truckCam)).toContain('deactivation-delete');
    expect(kinds({ ...truckCam, deactivationCompatible: true })).not.toContain('deactivation-delete');
    expect(rankCams(dynoBuild, [truckCam]).rankings[0].needs.map((n) => n.kind)).not.toContain('deactivation-delete');
  });

  it('a converter when the crossover sits well above the stall, suggesting a stall near the crossover', () => {
    const soft = rankCams(variant({ drivetrain: { stallRpm: 2000 } }), [bigCam]).rankings[0];
    const conv = soft.needs.find((n) => n.kind === 'converter');
    expect(conv?.suggestedStallRpm).toBeGreaterThanOrEqual(soft.crossoverRpm as number);
    expect((conv?.suggestedStallRpm as number) - (soft.crossoverRpm as number)).toBeLessThan(100);
    expect(soft.reasons.find((r) => r.subscore === 'converter')?.text).toMatch(/pair it with a \d,\d00 stall/);
    const matched = rankCams(variant({ drivetrain: { stallRpm: 3200 } }), [bigCam]).rankings[0];
    expect(matched.needs.map((n) => n.kind)).not.toContain('converter');
    expect(matched.subscores.converter).toBeGreaterThan(soft.subscores.converter);
  });

  it('a tune, always', () => {
    for (const c of [truckCam, bigCam, stockTruckCam])
      expect(rankCams(dynoBuild, [c]).rankings[0].needs.map((n) => n.kind)).toContain('tune');
  });
});

describe('cautions and gates', () => {
  it('emissions: a non-certified cam where emissions are required is flagged and capped at 30', () => {
    const b = variant({ use: { emissionsRequired: true } });
    const r = rankCams(b, [truckCam, { ...truckCam, id: 'cert', emissionsCertified: true }]);
    const uncert = r.rankings.find((x) => x.camId === 'truck-212');
    expect(uncert?.score).toBeLessThanOrEqual(30);
    expect(uncert?.cautions.find((c) => c.kind === 'emissions')?.text).toMatch(/local codes/);
    expect(r.rankings[0].camId).toBe('cert');
  });

  it('brakes: vacuum below ~15 inHg with vacuum brakes gives a brake caution (common practice)', () => {
    const big = cam({
      id: 'lumpy',
      name: 'lumpy',
      intakeDuration050: 236,
      exhaustDuration050: 244,
      intakeLiftIn: 0.63,
      exhaustLiftIn: 0.62,
      lsa: 108,
      intakeCenterline: 104,
    });
    const r = rankCams(dynoBuild, [big]).rankings[0];
    expect(r.idleVacuumInHg).toBeLessThan(15);
    expect(r.cautions.map((c) => c.kind)).toContain('brakes');
    const hydro = rankCams(variant({ vehicle: { powerBrakes: 'hydraulic' } }), [big]).rankings[0];
    expect(hydro.cautions.map((c) => c.kind)).not.toContain('brakes');
  });

  it('valvetrain checks by a qualified technician and a re-tune are always cautioned', () => {
    const kinds = rankCams(dynoBuild, [truckCam]).rankings[0].cautions;
    expect(kinds.find((c) => c.kind === 'valvetrain')?.text).toMatch(/qualified technician/);
    expect(kinds.find((c) => c.kind === 'tune')?.text).toMatch(/re-tuned/);
  });

  it('dynamic compression above the pump-gas window costs points; better fuel restores them (common practice, from memory)', () => {
    const hot = variant({ engine: { compressionRatio: 11.5, headMaterial: 'iron' }, use: { fuelOctane: 87 } });
    const cool = variant({ engine: { compressionRatio: 10.5, headMaterial: 'aluminum' }, use: { fuelOctane: 100 } });
    const s = (b: typeof hot) => rankCams(b, [truckCam]).rankings[0];
    expect(s(hot).subscores.compression).toBeLessThan(50);
    expect(s(cool).subscores.compression).toBe(100);
    expect(s(hot).reasons.find((r) => r.subscore === 'compression')?.text).toMatch(/knock/);
  });

  it('cost: a cam that eats the budget scores lower than one that leaves room', () => {
    const cheap = variant({ use: { budgetCents: 400000 } });
    const tight = variant({ use: { budgetCents: 100000 } });
    expect(rankCams(cheap, [truckCam]).rankings[0].subscores.cost).toBe(100);
    expect(rankCams(tight, [truckCam]).rankings[0].subscores.cost).toBeLessThan(50);
    // With part prices known the whole job is compared with the budget.
    const priced = rankCams(cheap, [truckCam], { needPriceCents: { springs: 30000, converter: 90000, tune: 50000 } })
      .rankings[0];
    expect(priced.reasons.find((r) => r.subscore === 'cost')?.text).toMatch(/parts it needs/);
  });
});

describe('options.history (measured results nudge predicted gains)', () => {
  const modelGain = rankCams(dynoBuild, [truckCam]).rankings[0].predicted.gainPctPeakHp;

  it('a similar build measuring more gain moves the prediction toward it, not all the way', () => {
    const history = [
      {
        camId: 'truck-212',
        measuredGainPctPeakHp: modelGain + 10,
        displacementCi: 346,
        intakeFlowCfm: 290,
        headers: 'long-tube' as const,
        system: 'open-short' as const,
      },
    ];
    const r = rankCams(dynoBuild, [truckCam], { history }).rankings[0];
    expect(r.history?.matches).toBe(1);
    expect(r.predicted.gainPctPeakHp).toBeGreaterThan(modelGain + 1);
    expect(r.predicted.gainPctPeakHp).toBeLessThan(modelGain + 10);
    // The adjusted curve keeps the horsepower identity.
    for (const p of r.curve) expect(p.hp).toBe((p.torqueLbFt * p.rpm) / 5252);
  });

  it('ignores other cams, dissimilar engines and impossible values', () => {
    const history = [
      { camId: 'big-219', measuredGainPctPeakHp: 40, displacementCi: 346 },
      { camId: 'truck-212', measuredGainPctPeakHp: 40, displacementCi: 454 },
      { camId: 'truck-212', measuredGainPctPeakHp: Number.NaN, displacementCi: 346 },
      { camId: 'truck-212', measuredGainPctPeakHp: 900, displacementCi: 346 },
    ];
    const r = rankCams(dynoBuild, [truckCam], { history }).rankings[0];
    expect(r.history).toBeNull();
    expect(r.predicted.gainPctPeakHp).toBe(modelGain);
  });
});

describe('weights table', () => {
  it('sums to 100 and is the same table docs/advisor.md prints (one table in code, one in the docs)', () => {
    expect(Object.values(SCORING_WEIGHTS).reduce((a, b) => a + b, 0)).toBe(100);
    const doc = readFileSync(join(__dirname, '../../../docs/advisor.md'), 'utf8');
    const md = doc.slice(doc.indexOf('## Scoring'), doc.indexOf('### Needs and cautions'));
    expect(md.length).toBeGreaterThan(100);
    const rows = [...md.matchAll(/^\| `(\w+)` \| (\d+) \|/gm)].map((m) => [m[1], Number(m[2])]);
    expect(Object.fromEntries(rows)).toEqual(SCORING_WEIGHTS);
  });
});
