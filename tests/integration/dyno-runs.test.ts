import request from 'supertest';
import { Op } from 'sequelize';
import { AuditEntry, Build, Cam, DynoRun } from '@/lib/db/models';
import { BuildProfileSchema } from '@/lib/schemas/build-profile';
import { signIn } from '../support/auth';
import { connectTestDatabase, disconnectTestDatabase } from '../support/database';
import { readRuntime } from '../support/runtime';
import { removeDynoRuns } from '../support/dyno-runs';
import { DEMO, MISSING_ID } from '../support/demo';
import type { ShopRankingEntry } from '@/lib/ranking/types';
import type { DynoRunView } from '@/lib/dyno/types';

// Dyno runs for the seeded job: the Okafor truck and its deposit-paid quote, cam F9-219 going in. A technician
// records a before and an after pull; the advisor then shows the measured result for a similar build.
const { appUrl } = readRuntime();
const JOB = { buildId: DEMO.builds.okaforStreetTruck, quoteId: DEMO.quotes.okaforDepositPaid };

type RunBody = DynoRunView;
type History = ShopRankingEntry['history'];

// Relative to now so the before run always sorts first, whatever the day the suite runs.
const hoursAgo = (hours: number) => new Date(Date.now() - hours * 3_600_000).toISOString();
const points = (rows: [number, number][]) => rows.map(([rpm, torqueLbFt]) => ({ rpm, torqueLbFt }));
const BEFORE = points([
  [3000, 360],
  [4000, 380],
  [4500, 370],
  [5000, 345],
  [5500, 310],
]);
const AFTER = points([
  [3000, 340],
  [4000, 385],
  [4500, 395],
  [5000, 390],
  [5500, 372],
  [6000, 345],
]);
// Hand-worked, SAE J1349 with the Magnus vapour pressure (see tests/unit/dyno/correction.test.ts):
// before, 98 kPa, 30 °C, 50 %: Pd = 98 − 0.5 · 4.23665 = 95.88167 kPa; cf = 1.18 · (99/95.88167) · √(303/298) − 0.18 = 1.048555
// after, 100 kPa, 20 °C, 30 %: es = 0.61094 · exp(17.625·20/263.04) = 2.33344 kPa; Pd = 100 − 0.3 · 2.33344 = 99.29997 kPa;
//   cf = 1.18 · 0.996979 · √(293/298) − 0.18 = 1.18 · 0.996979 · 0.991575 − 0.18 = 0.986524
const BEFORE_AIR = { airTempC: 30, baroKpa: 98, humidityPct: 50 };
const AFTER_AIR = { airTempC: 20, baroKpa: 100, humidityPct: 30 };

describe('dyno runs', () => {
  let tech: string;
  let counter: string;
  let f9Id: number;
  const created: number[] = [];

  beforeAll(async () => {
    connectTestDatabase();
    [tech, counter] = await Promise.all([signIn('tech'), signIn('counter')]);
    f9Id = (await Cam.findOne({ where: { sku: 'F9-219' } }))!.id;
    expect(await DynoRun.count({ where: { buildId: JOB.buildId } })).toBe(0);
  });
  afterAll(async () => {
    if (created.length) {
      await removeDynoRuns(created);
      await AuditEntry.destroy({ where: { entityType: 'dyno-run', entityId: { [Op.in]: created.map(String) } } });
    }
    await disconnectTestDatabase();
  });

  const post = (cookie: string | null, body: unknown) => {
    const r = request(appUrl).post('/api/dyno-runs');
    return (cookie ? r.set('Cookie', cookie) : r).send(body as object);
  };
  const rankF9 = async (cookie: string) => {
    const profile = BuildProfileSchema.parse((await Build.findByPk(2))!.profile);
    // A similar build: the same combination bored 0.010" over.
    const similar = { ...profile, engine: { ...profile.engine, boreIn: profile.engine.boreIn + 0.01 } };
    const response = await request(appUrl)
      .post('/api/advisor/rank')
      .set('Cookie', cookie)
      .send({ build: similar, camIds: [f9Id], includeCurves: false })
      .expect(200);
    return response.body.rankings[0] as { camId: number; history: History; predicted: { gainPctPeakHp: number } };
  };

  it('has no measured history for F9-219 before any run is recorded', async () => {
    expect((await rankF9(counter)).history).toBeNull();
  });

  it('refuses signed-out callers (401) and counter staff writing (403); counter may read', async () => {
    await request(appUrl).get(`/api/dyno-runs?buildId=${JOB.buildId}`).expect(401);
    await post(null, { buildId: JOB.buildId }).expect(401);
    await post(counter, { buildId: JOB.buildId, phase: 'before', ...BEFORE_AIR, curve: BEFORE }).expect(403);
    await request(appUrl).delete('/api/dyno-runs/1').set('Cookie', counter).expect(403);
    const list = await request(appUrl).get(`/api/dyno-runs?buildId=${JOB.buildId}`).set('Cookie', counter).expect(200);
    expect(list.body.runs).toEqual([]);
  });

  it('answers 422 naming each field and why', async () => {
    const res = await post(tech, {
      buildId: JOB.buildId,
      phase: 'sideways',
      dynoType: 'rollers',
      baroKpa: 200,
      humidityPct: 40,
      curve: points([
        [3000, 300],
        [2900, 310],
        [4000, 320],
      ]),
    }).expect(422);
    const fields = (res.body.errors as { field: string; message: string }[]).map((e) => e.field).sort();
    expect(fields).toEqual(['airTempC', 'baroKpa', 'curve.1.rpm', 'dynoType', 'phase']);
    expect(res.body.errors.find((e: { field: string }) => e.field === 'dynoType').message).toBe(
      'dynoType must be one of: chassis, engine',
    );
    expect(res.body.errors.find((e: { field: string }) => e.field === 'baroKpa').message).toBe(
      'barometric pressure must be at most 110 kPa',
    );
    const noBuild = await post(tech, { buildId: MISSING_ID, phase: 'before', ...BEFORE_AIR, curve: BEFORE }).expect(
      422,
    );
    expect(noBuild.body.errors).toEqual([{ field: 'buildId', message: 'no build with id 999999' }]);
    const otherQuote = await post(tech, {
      buildId: JOB.buildId,
      quoteId: DEMO.quotes.whitlockSent,
      phase: 'before',
      ...BEFORE_AIR,
      curve: BEFORE,
    }).expect(422);
    expect(otherQuote.body.errors[0].field).toBe('quoteId');
    // Definition of horsepower: 450 hp at 4,000 rpm is 450 · 5252 / 4000 = 590.9 lb·ft there, above a 400 lb·ft peak.
    const impossible = await post(tech, {
      buildId: JOB.buildId,
      phase: 'before',
      ...BEFORE_AIR,
      peak: { hp: 450, hpRpm: 4000, torqueLbFt: 400, torqueRpm: 3500 },
    }).expect(422);
    expect(impossible.body.errors[0]).toMatchObject({ field: 'peak.hp' });
    await request(appUrl)
      .post('/api/dyno-runs')
      .set('Cookie', tech)
      .set('Content-Type', 'application/json')
      .send('{not json')
      .expect(400);
    expect(await DynoRun.count({ where: { buildId: JOB.buildId } })).toBe(0);
  });

  it('a technician records the before pull: hp from the horsepower definition, peaks derived, SAE J1349 correction', async () => {
    const res = await post(tech, {
      buildId: JOB.buildId,
      phase: 'before',
      ...BEFORE_AIR,
      curve: BEFORE,
      notes: 'Baseline, stock cam',
      runAt: hoursAgo(2),
    }).expect(201);
    const run = res.body as RunBody;
    created.push(run.id);
    // Left out, the kind of dyno is a chassis dyno: every run before the flag existed was one.
    expect(run).toMatchObject({ buildId: JOB.buildId, quoteId: JOB.quoteId, phase: 'before', dynoType: 'chassis' });
    // Definition of horsepower: hp = lb·ft · rpm / 5252 on every point; 345 · 5000 / 5252 = 328.446 hp is the peak.
    for (const p of run.curve!) expect(p.hp).toBeCloseTo((p.torqueLbFt * p.rpm) / 5252, 9);
    expect(run.observed.peakHp).toBeCloseTo(328.446, 3);
    expect(run.observed).toMatchObject({ peakHpRpm: 5000, peakTorqueLbFt: 380, peakTorqueRpm: 4000 });
    // SAE J1349, hand-worked above: cf = 1.048555; corrected peak = 328.446 · 1.048555 = 344.39 → 344.4 hp, 380 · 1.048555 = 398.45 → 398.5 lb·ft.
    expect(run.correction!.standard).toBe('sae-j1349');
    expect(run.correction!.factor).toBeCloseTo(1.048555, 5);
    expect(run.correction!.pressureKpa).toBeCloseTo(95.8817, 3);
    expect(run.corrected).toEqual({ peakHp: 344.4, peakTorqueLbFt: 398.5 });
    for (const p of run.correctedCurve!) expect(p.hp).toBeCloseTo((p.torqueLbFt * p.rpm) / 5252, 9);
  });

  it('the after pull on F9-219 (the quote’s cam, filled in from the job) corrects down on a cooler, denser day', async () => {
    const res = await post(tech, {
      buildId: JOB.buildId,
      phase: 'after',
      dynoType: 'chassis',
      ...AFTER_AIR,
      curve: AFTER,
      runAt: hoursAgo(1),
    }).expect(201);
    const run = res.body as RunBody;
    created.push(run.id);
    expect(run).toMatchObject({ camId: f9Id, quoteId: JOB.quoteId, phase: 'after' });
    // 345 · 6000 / 5252 = 394.136 hp observed; SAE J1349 cf = 0.986524 (hand-worked above) → 388.8 hp corrected.
    expect(run.observed).toMatchObject({ peakHpRpm: 6000, peakTorqueLbFt: 395, peakTorqueRpm: 4500 });
    expect(run.observed.peakHp).toBeCloseTo(394.136, 3);
    expect(run.correction!.factor).toBeCloseTo(0.986524, 5);
    expect(run.corrected).toEqual({ peakHp: 388.8, peakTorqueLbFt: 389.7 });
    const one = await request(appUrl).get(`/api/dyno-runs/${run.id}`).set('Cookie', counter).expect(200);
    expect(one.body.corrected).toEqual(run.corrected);
    const list = await request(appUrl).get(`/api/dyno-runs?buildId=${JOB.buildId}`).set('Cookie', counter).expect(200);
    expect((list.body.runs as RunBody[]).map((r) => r.phase)).toEqual(['before', 'after']);
  });

  it('the advisor then blends the measured gain into F9-219’s prediction for a similar build', async () => {
    const ranking = await rankF9(counter);
    expect(ranking.history).not.toBeNull();
    const h = ranking.history!;
    expect(h.matches).toBeGreaterThanOrEqual(1);
    // Measured gain from corrected peaks: 388.824 / 344.394 − 1 = +12.90 %.
    expect(h.measuredGainPctPeakHp).toBeCloseTo(12.9, 1);
    expect(h.modelGainPctPeakHp).not.toBeCloseTo(h.measuredGainPctPeakHp, 1);
    // The pulls were recorded as curves, so the advisor blends their torque gain rpm by rpm where both
    // covered (3,000–5,500 rpm): the predicted peak may lie above that and keep the model's figure. It never
    // leaves the span between the model and the measurement. (The per-rpm blend: dyno-history.test.ts.)
    const [lo, hi] = [
      Math.min(h.modelGainPctPeakHp, h.measuredGainPctPeakHp),
      Math.max(h.modelGainPctPeakHp, h.measuredGainPctPeakHp),
    ];
    expect(h.adjustedGainPctPeakHp).toBeGreaterThanOrEqual(lo);
    expect(h.adjustedGainPctPeakHp).toBeLessThanOrEqual(hi);
  });

  it('an engine-dyno pull is never compared with the chassis-dyno before pull', async () => {
    // At the flywheel the same cam reads far more than at the wheels: 430 · 6000 / 5252 = 491.2 hp observed.
    // Paired with the chassis before pull it would claim about +40 %; the measured gain must stay +12.90 %.
    const flywheel = points([
      [3000, 420],
      [4000, 450],
      [5000, 445],
      [6000, 430],
    ]);
    const res = await post(tech, {
      buildId: JOB.buildId,
      phase: 'after',
      dynoType: 'engine',
      ...AFTER_AIR,
      curve: flywheel,
      runAt: hoursAgo(0.5),
    }).expect(201);
    created.push(res.body.id);
    expect(res.body).toMatchObject({ dynoType: 'engine', phase: 'after', camId: f9Id });
    expect((await DynoRun.findByPk(res.body.id))!.dynoType).toBe('engine');
    const h = (await rankF9(counter)).history!;
    expect(h.measuredGainPctPeakHp).toBeCloseTo(12.9, 1);
    // An engine-dyno before pull completes the engine pair: 410 · 5000 / 5252 = 390.3 hp observed, so the
    // flywheel gain (491.2 / 390.3 − 1 = +25.9 %, both on the after run's air) now counts as its own job beside the wheel one.
    const stand = points([
      [3000, 400],
      [4000, 415],
      [5000, 410],
      [5500, 380],
    ]);
    const before = await post(tech, {
      buildId: JOB.buildId,
      phase: 'before',
      dynoType: 'engine',
      ...AFTER_AIR,
      curve: stand,
      runAt: hoursAgo(0.75),
    }).expect(201);
    created.push(before.body.id);
    const both = (await rankF9(counter)).history!;
    expect(both.measuredGainPctPeakHp).toBeGreaterThan(h.measuredGainPctPeakHp);
    expect(both.measuredGainPctPeakHp).toBeLessThan(25.9);
  });

  it('the job page shows the technician the build sheet and keeps counter staff out', async () => {
    const page = await request(appUrl).get(`/jobs/${JOB.quoteId}`).set('Cookie', tech).redirects(0).expect(200);
    expect(page.text).toContain('Build sheet');
    expect(page.text).toContain('F9-219');
    // No prices for the workshop: neither money amounts nor the cam's own price in any format.
    const camPrice = (await Cam.findByPk(f9Id))!.priceCents / 100;
    expect(page.text).not.toMatch(/\$\s?\d{1,3}(,\d{3})*\.\d{2}|\$\d{1,3},\d{3}/);
    expect(page.text).not.toContain(camPrice.toLocaleString('en-US', { style: 'currency', currency: 'USD' }));
    expect(page.text).not.toContain(
      camPrice.toLocaleString('en-US', { style: 'currency', currency: 'USD', maximumFractionDigits: 0 }),
    );
    const list = await request(appUrl).get('/jobs').set('Cookie', tech).redirects(0).expect(200);
    expect(list.text).toContain('Q-2026-0102');
    const denied = await request(appUrl).get(`/jobs/${JOB.quoteId}`).set('Cookie', counter).redirects(0);
    expect(denied.status).toBeGreaterThanOrEqual(300);
    expect(denied.status).toBeLessThan(400);
  });

  it('deletes: counter refused, technician allowed, and the history goes with it', async () => {
    for (const id of [...created]) {
      await request(appUrl).delete(`/api/dyno-runs/${id}`).set('Cookie', counter).expect(403);
      await request(appUrl).delete(`/api/dyno-runs/${id}`).set('Cookie', tech).expect(200);
      await request(appUrl).get(`/api/dyno-runs/${id}`).set('Cookie', tech).expect(404);
    }
    expect(await DynoRun.count({ where: { buildId: JOB.buildId } })).toBe(0);
    expect(
      await AuditEntry.count({ where: { action: 'dyno-run.deleted', entityId: { [Op.in]: created.map(String) } } }),
    ).toBe(created.length);
    expect((await rankF9(counter)).history).toBeNull();
  });
});
