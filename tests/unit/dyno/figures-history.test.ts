import { displacementCi } from '@/lib/advisor/geometry';
import { parseCurveCsv } from '@/lib/dyno/curve-csv';
import { gainPct, peaksOf, pullWithPower } from '@/lib/dyno/figures';
import { rankCams } from '@/lib/advisor';
import { HISTORY_SETTINGS, historySimilarity } from '@/lib/advisor/history';
import { gainByRpm, historyFromRuns, similarityWindow, type RunForHistory } from '@/lib/dyno/history';
import { dynoBuild, truckCam } from '../advisor/fixtures';
import { DynoRunSchema } from '@/lib/schemas/dyno-run';
import { BuildProfileSchema, type BuildProfile } from '@/lib/schemas/build-profile';

const profile = (over: { boreIn?: number; headers?: 'manifold' | 'shorty' | 'long-tube' } = {}): BuildProfile =>
  BuildProfileSchema.parse({
    engine: {
      cylinders: 8,
      boreIn: over.boreIn ?? 4.0,
      strokeIn: 3.622,
      rodLengthIn: 6.098,
      compressionRatio: 9.4,
      headMaterial: 'iron',
      intakeFlowCfm: 250,
      intakeManifold: 'truck',
      cylinderDeactivation: 'none',
    },
    exhaust: { headers: over.headers ?? 'long-tube', primaryIn: 1.75, system: 'full' },
    drivetrain: { transmission: 'automatic', stallRpm: 3000, axleRatio: 4.1, topGearRatio: 0.7, tireDiameterIn: 28 },
    vehicle: { weightLb: 4300, powerBrakes: 'vacuum' },
    use: {
      primary: 'street',
      idle: 'noticeable',
      fuelOctane: 93,
      emissionsRequired: false,
      cruiseMph: 65,
      budgetCents: 450000,
    },
    baselineCam: {
      id: 'stock',
      name: 'Stock',
      intakeDuration050: 204,
      exhaustDuration050: 211,
      intakeLiftIn: 0.525,
      exhaustLiftIn: 0.525,
      lsa: 116,
      intakeCenterline: 116,
    },
  });

describe('dyno figures (definition of horsepower: hp = lb·ft · rpm / 5252)', () => {
  it('computes power on every point and finds the peaks', () => {
    const pull = pullWithPower([
      { rpm: 3000, torqueLbFt: 400 },
      { rpm: 4000, torqueLbFt: 420 },
      { rpm: 5252, torqueLbFt: 380 },
      { rpm: 6000, torqueLbFt: 300 },
    ]);
    // 420 · 4000 / 5252 = 319.88 hp; 380 · 5252 / 5252 = 380 hp (torque and hp cross at 5,252 rpm); 300 · 6000 / 5252 = 342.73 hp
    expect(pull[1].hp).toBeCloseTo(319.878, 3);
    expect(pull[2].hp).toBe(380);
    expect(peaksOf(pull)).toEqual({ peakHp: 380, peakHpRpm: 5252, peakTorqueLbFt: 420, peakTorqueRpm: 4000 });
  });
  it('gain is after / before − 1: 360 → 414 hp is +15 %', () => {
    expect(gainPct(360, 414)).toBeCloseTo(15, 10);
  });
});

describe('history from before/after pairs', () => {
  const profiles = new Map([
    [2, profile()],
    [5, profile({ boreIn: 3.78, headers: 'manifold' })],
  ]);
  it('one entry per build and fitted cam, from the corrected peaks, with the build’s engine for similarity', () => {
    const runs: RunForHistory[] = [
      { buildId: 2, phase: 'before', dynoType: 'chassis', camId: null, correctedPeakHp: 350 },
      { buildId: 2, phase: 'before', dynoType: 'chassis', camId: null, correctedPeakHp: 354 }, // two baseline pulls → mean 352
      { buildId: 2, phase: 'after', dynoType: 'chassis', camId: 9, correctedPeakHp: 404.8 }, // 404.8 / 352 − 1 = +15 %
      { buildId: 5, phase: 'before', dynoType: 'chassis', camId: 1, correctedPeakHp: 300 },
      { buildId: 5, phase: 'after', dynoType: 'chassis', camId: 4, correctedPeakHp: 330 }, // +10 %
    ];
    const history = historyFromRuns(runs, profiles);
    expect(history).toHaveLength(2);
    expect(history[0]).toMatchObject({
      camId: 9,
      intakeFlowCfm: 250,
      headers: 'long-tube',
      system: 'full',
      intakeManifold: 'truck',
    });
    expect(history[0].measuredGainPctPeakHp).toBeCloseTo(15, 10);
    // Displacement, arithmetic: π/4 · 4.0² · 3.622 · 8 = 364.1 in³
    expect(history[0].displacementCi).toBeCloseTo(displacementCi(4.0, 3.622, 8), 10);
    expect(history[0].displacementCi).toBeCloseTo(364.1, 1);
    expect(history[1]).toMatchObject({ camId: 4, headers: 'manifold' });
    expect(history[1].measuredGainPctPeakHp).toBeCloseTo(10, 10);
  });
  it('needs both halves of the pair: a build with only before or only after runs gives nothing', () => {
    expect(
      historyFromRuns(
        [{ buildId: 2, phase: 'before', dynoType: 'chassis', camId: null, correctedPeakHp: 350 }],
        profiles,
      ),
    ).toEqual([]);
    expect(
      historyFromRuns([{ buildId: 2, phase: 'after', dynoType: 'chassis', camId: 9, correctedPeakHp: 400 }], profiles),
    ).toEqual([]);
  });
  it('pairs a chassis run only with chassis runs and an engine run only with engine runs', () => {
    const runs: RunForHistory[] = [
      // Build 2 on the rollers before, on the engine stand after: no pair, so no gain from it.
      { buildId: 2, phase: 'before', dynoType: 'chassis', camId: null, correctedPeakHp: 300 },
      { buildId: 2, phase: 'after', dynoType: 'engine', camId: 9, correctedPeakHp: 400 },
      // Build 5 on both: wheels 300 → 330 (+10 %), flywheel 360 → 405 (+12.5 %); each compared with its own kind.
      { buildId: 5, phase: 'before', dynoType: 'engine', camId: null, correctedPeakHp: 360 },
      { buildId: 5, phase: 'before', dynoType: 'chassis', camId: null, correctedPeakHp: 300 },
      { buildId: 5, phase: 'after', dynoType: 'chassis', camId: 4, correctedPeakHp: 330 },
      { buildId: 5, phase: 'after', dynoType: 'engine', camId: 4, correctedPeakHp: 405 },
    ];
    const history = historyFromRuns(runs, profiles);
    // Mixed pairs would have given build 2 +33 % and build 5 (405 / 300) +35 % or (330 / 360) −8 %.
    expect(history.map((h) => h.camId)).toEqual([4, 4]);
    expect(history[0].measuredGainPctPeakHp).toBeCloseTo(10, 10); // chassis sorts before engine
    expect(history[1].measuredGainPctPeakHp).toBeCloseTo(12.5, 10);
  });
  it('skips runs without figures and builds without a readable profile', () => {
    const runs: RunForHistory[] = [
      { buildId: 2, phase: 'before', dynoType: 'chassis', camId: null, correctedPeakHp: null },
      { buildId: 2, phase: 'after', dynoType: 'chassis', camId: 9, correctedPeakHp: 400 },
      { buildId: 7, phase: 'before', dynoType: 'chassis', camId: null, correctedPeakHp: 300 },
      { buildId: 7, phase: 'after', dynoType: 'chassis', camId: 9, correctedPeakHp: 330 },
    ];
    expect(historyFromRuns(runs, profiles)).toEqual([]);
  });
});

describe('per-rpm gains from the pulls', () => {
  const flat = (from: number, to: number, torqueLbFt: number) =>
    Array.from({ length: (to - from) / 500 + 1 }, (_, i) => ({ rpm: from + i * 500, torqueLbFt }));

  it('torque gain on a 250 rpm grid where every pull of both phases was measured, pulls of a phase averaged', () => {
    // Before: two pulls, 300 and 320 lb·ft (mean 310), 2,000–6,000 rpm; after: 341 lb·ft from 2,500 to 5,500 rpm.
    const gains = gainByRpm([flat(2000, 6000, 300), flat(2000, 6000, 320)], [flat(2500, 5500, 341)])!;
    expect(gains[0].rpm).toBe(2500);
    expect(gains[gains.length - 1].rpm).toBe(5500);
    expect(gains.map((g) => g.rpm)).toEqual(Array.from({ length: 13 }, (_, i) => 2500 + i * 250));
    for (const g of gains) expect(g.gainPct).toBeCloseTo(10, 10); // 341 / 310 − 1
  });

  it('interpolates between the points and says nothing without two shared points', () => {
    const gains = gainByRpm(
      [
        [
          { rpm: 3000, torqueLbFt: 300 },
          { rpm: 4000, torqueLbFt: 300 },
        ],
      ],
      [
        [
          { rpm: 3000, torqueLbFt: 300 },
          { rpm: 4000, torqueLbFt: 360 },
        ],
      ],
    )!;
    expect(gains.find((g) => g.rpm === 3500)!.gainPct).toBeCloseTo(10, 10); // 330 / 300 − 1, halfway
    expect(gainByRpm([flat(2000, 3000, 300)], [flat(3000, 4000, 300)])).toBeUndefined(); // one shared rpm only
    expect(gainByRpm([], [flat(3000, 4000, 300)])).toBeUndefined();
  });

  it('historyFromRuns gives the advisor measuredGainPctByRpm from corrected curves, none for peak-only runs', () => {
    const profiles = new Map([[2, profile()]]);
    const runs: RunForHistory[] = [
      {
        buildId: 2,
        phase: 'before',
        dynoType: 'chassis',
        camId: null,
        correctedPeakHp: 300,
        correctedCurve: flat(2000, 6000, 300),
      },
      {
        buildId: 2,
        phase: 'after',
        dynoType: 'chassis',
        camId: 9,
        correctedPeakHp: 330,
        correctedCurve: flat(2000, 6000, 315),
      },
      { buildId: 2, phase: 'after', dynoType: 'chassis', camId: 4, correctedPeakHp: 320 },
    ];
    const [four, nine] = historyFromRuns(runs, profiles);
    expect(four.camId).toBe(4);
    expect(four.measuredGainPctByRpm).toBeUndefined();
    expect(nine.measuredGainPctByRpm).toHaveLength(17);
    for (const g of nine.measuredGainPctByRpm!) expect(g.gainPct).toBeCloseTo(5, 10);
  });

  it('reach the ranking: a gain measured low down lifts the low end, where a peak-only record counts for nothing', () => {
    const e = dynoBuild.engine;
    const at = (rpm: number, r: ReturnType<typeof rankCams>['rankings'][number]) =>
      r.curve.find((p) => p.rpm === rpm)!.torqueLbFt;
    const engine = {
      displacementCi: displacementCi(e.boreIn, e.strokeIn, e.cylinders),
      intakeFlowCfm: e.intakeFlowCfm,
      headers: dynoBuild.exhaust.headers,
      system: dynoBuild.exhaust.system,
      intakeManifold: e.intakeManifold,
    };
    const model = rankCams(dynoBuild, [truckCam]).rankings[0];
    const lowRpm = model.curve.find((p) => p.rpm <= model.predicted.peakHpRpm * 0.5)!.rpm;
    const peakOnly = rankCams(dynoBuild, [truckCam], {
      history: [{ camId: truckCam.id, measuredGainPctPeakHp: model.predicted.gainPctPeakHp, ...engine }],
    }).rankings[0];
    const byRpm = rankCams(dynoBuild, [truckCam], {
      history: [
        {
          camId: truckCam.id,
          measuredGainPctPeakHp: model.predicted.gainPctPeakHp,
          ...engine,
          measuredGainPctByRpm: [
            { rpm: 1000, gainPct: 30 },
            { rpm: 8000, gainPct: 30 },
          ],
        },
      ],
    }).rankings[0];
    expect(at(lowRpm, peakOnly)).toBeCloseTo(at(lowRpm, model), 9);
    expect(at(lowRpm, byRpm)).toBeGreaterThan(at(lowRpm, model) * 1.05);
  });
});

describe('similarity window', () => {
  const build = profile();
  const here = displacementCi(4.0, 3.622, 8);
  const entry = (d: number, flow: number) => ({
    camId: 1,
    measuredGainPctPeakHp: 5,
    displacementCi: d,
    intakeFlowCfm: flow,
  });
  it('holds every record the advisor can count and none it cannot (the edges, from HISTORY_SETTINGS)', () => {
    const w = similarityWindow(here, 250);
    const min = HISTORY_SETTINGS.minSimilarity;
    for (const d of w.displacementCi) expect(historySimilarity(entry(d, 250), build, here)).toBeCloseTo(min, 9);
    for (const f of w.intakeFlowCfm) expect(historySimilarity(entry(here, f), build, here)).toBeCloseTo(min, 9);
    expect(historySimilarity(entry(w.displacementCi[1] * 1.001, 250), build, here)).toBeLessThan(min);
    expect(historySimilarity(entry(w.displacementCi[1] * 0.999, 250), build, here)).toBeGreaterThan(min);
    expect(historySimilarity(entry(here, w.intakeFlowCfm[0] * 0.999), build, here)).toBeLessThan(min);
  });
});

describe('dyno run schema', () => {
  const air = { buildId: 2, phase: 'before', airTempC: 25, baroKpa: 99, humidityPct: 40 };
  it('wants peaks or a curve, not both, not neither', () => {
    expect(DynoRunSchema.safeParse(air).error?.issues.map((i) => i.path.join('.'))).toEqual(['curve']);
    const both = {
      ...air,
      peak: { hp: 300, hpRpm: 5000, torqueLbFt: 350, torqueRpm: 4000 },
      curve: [
        { rpm: 3000, torqueLbFt: 300 },
        { rpm: 4000, torqueLbFt: 320 },
        { rpm: 5000, torqueLbFt: 310 },
      ],
    };
    expect(DynoRunSchema.safeParse(both).error?.issues.map((i) => i.path.join('.'))).toEqual(['peak']);
  });
  it('refuses peak power that implies more torque than the peak torque (hp · 5252 / rpm)', () => {
    // 400 hp at 4,000 rpm is 400 · 5252 / 4000 = 525.2 lb·ft at that rpm, more than a 350 lb·ft peak.
    const r = DynoRunSchema.safeParse({ ...air, peak: { hp: 400, hpRpm: 4000, torqueLbFt: 350, torqueRpm: 3500 } });
    expect(r.error?.issues[0]).toMatchObject({ path: ['peak', 'hp'] });
    expect(r.error?.issues[0].message).toMatch(/525\.2 lb·ft/);
  });
  it('wants rpm rising along the curve and air data within limits', () => {
    const r = DynoRunSchema.safeParse({
      ...air,
      baroKpa: 200,
      curve: [
        { rpm: 3000, torqueLbFt: 300 },
        { rpm: 2900, torqueLbFt: 320 },
        { rpm: 5000, torqueLbFt: 310 },
      ],
    });
    expect(r.error?.issues.map((i) => i.path.join('.')).sort()).toEqual(['baroKpa', 'curve.1.rpm']);
  });
});

describe('pasted CSV', () => {
  it('reads rpm,torque rows with or without a header', () => {
    expect(parseCurveCsv('rpm,torque\n3000,310.5\n3500,330\n').points).toEqual([
      { rpm: 3000, torqueLbFt: 310.5 },
      { rpm: 3500, torqueLbFt: 330 },
    ]);
    expect(parseCurveCsv('3000\t310\n3500\t330').points).toHaveLength(2);
    expect(parseCurveCsv('3000;310\n3500;330').points).toHaveLength(2);
  });
  it('names the line that is not two numbers', () => {
    expect(parseCurveCsv('3000,310\n3500,abc').errors).toEqual([
      'line 2: expected two numbers, rpm and torque in lb·ft (got "3500,abc")',
    ]);
  });
});
