import fc from 'fast-check';
import request from 'supertest';
import { Build, Cam } from '@/lib/db/models';
import { BuildProfileSchema, type BuildProfile } from '@/lib/schemas/build-profile';
import { signIn } from '../support/auth';
import { connectTestDatabase, disconnectTestDatabase } from '../support/database';
import { readRuntime } from '../support/runtime';
import type { ShopRanking } from '@/lib/ranking/types';

const { appUrl } = readRuntime();

type RankingBody = ShopRanking;

describe('POST /api/advisor/rank', () => {
  let cookie: string;
  let towingTruck: BuildProfile;
  let sellableCamIds: number[];

  beforeAll(async () => {
    connectTestDatabase();
    cookie = await signIn('counter');
    const build = await Build.findByPk(1);
    towingTruck = BuildProfileSchema.parse(build!.profile);
    sellableCamIds = (await Cam.findAll({ where: { active: true, isFactoryBaseline: false, archivedAt: null } })).map(
      (c) => c.id,
    );
  });
  afterAll(() => disconnectTestDatabase());

  const rank = (body: unknown) =>
    request(appUrl)
      .post('/api/advisor/rank')
      .set('Cookie', cookie)
      .send(body as object);

  it('refuses a signed-out caller', async () => {
    await request(appUrl).post('/api/advisor/rank').send({ build: towingTruck }).expect(401);
  });

  it('carries curves for the top curveLimit cams only; a lower cam’s curve comes when asked for by camIds', async () => {
    const body = (await rank({ build: towingTruck, curveLimit: 2 }).expect(200)).body as RankingBody & {
      curvesIncluded: number;
    };
    expect(body.curvesIncluded).toBe(2);
    expect(body.rankings.slice(0, 2).every((r) => r.curve.length > 10)).toBe(true);
    expect(body.rankings.slice(2).every((r) => r.curve.length === 0)).toBe(true);
    const last = body.rankings[body.rankings.length - 1];
    const alone = (await rank({ build: towingTruck, camIds: [last.camId], curveLimit: 1 }).expect(200))
      .body as RankingBody;
    expect(alone.rankings[0].curve.length).toBeGreaterThan(10);
    // Default: the top 20, which is every cam of the demo catalogue.
    expect(
      ((await rank({ build: towingTruck, includeCurves: false }).expect(200)).body as { curvesIncluded: number })
        .curvesIncluded,
    ).toBe(0);
    const bad = await rank({ build: towingTruck, curveLimit: -1 }).expect(422);
    expect(bad.body.errors[0].field).toBe('curveLimit');
  });

  it('every demo build in the database is a valid build profile', async () => {
    const builds = await Build.findAll();
    expect(builds.length).toBeGreaterThanOrEqual(3);
    for (const build of builds) expect(BuildProfileSchema.safeParse(build.profile).error?.issues ?? []).toEqual([]);
  });

  it('ranks every sellable cam for the demo towing truck, with the shop rules’ parts and prices', async () => {
    const response = await rank({ build: towingTruck }).expect(200);
    const body = response.body as RankingBody;
    // The advisor's cam ids may be strings (the command line's skus); the shop's are numbers.
    expect(body.rankings.map((r) => Number(r.camId)).sort((a, b) => a - b)).toEqual(
      [...sellableCamIds].sort((a, b) => a - b),
    );
    expect(body.rankings.map((r) => r.rank)).toEqual(body.rankings.map((_, i) => i + 1));
    for (let i = 1; i < body.rankings.length; i++)
      expect(body.rankings[i - 1].score).toBeGreaterThanOrEqual(body.rankings[i].score);
    for (const ranking of body.rankings) {
      // Definition of horsepower: hp = torque (lb·ft) · rpm / 5252.
      for (const point of ranking.curve) expect(point.hp).toBe((point.torqueLbFt * point.rpm) / 5252);
      // Every cam needs fitting and a tune: the seeded rules add the truck cam swap and the dyno tune.
      expect(ranking.neededItems.some((item) => item.part?.sku === 'TUNE-DYNO')).toBe(true);
      expect(ranking.neededItems.some((item) => item.laborOperation?.code === 'CAM-TRUCK')).toBe(true);
      expect(ranking.neededItemsCents).toBe(ranking.neededItems.reduce((sum, item) => sum + item.priceCents, 0));
      // The one job price: the cam plus every needed item, and the cost reason quotes that number.
      expect(ranking.jobPriceCents).toBe(ranking.camPriceCents + ranking.neededItemsCents);
      const jobPriceCents = ranking.jobPriceCents!; // every demo cam has a price
      const dollars = `$${Math.floor(jobPriceCents / 100).toLocaleString('en-US')}.${String(jobPriceCents % 100).padStart(2, '0')}`;
      expect(ranking.reasons.find((r) => r.subscore === 'cost')?.text).toContain(`about ${dollars} before tax`);
    }
    // The truck still has active cylinder deactivation: a cam not made for it brings the delete kit.
    const cams = await Cam.findAll({ where: { id: sellableCamIds } });
    const compatible = new Map(cams.map((c) => [c.id, c.deactivationCompatible]));
    for (const ranking of body.rankings) {
      const hasDeleteKit = ranking.neededItems.some((item) => item.part?.sku === 'DD-KIT-53');
      expect(hasDeleteKit).toBe(!compatible.get(Number(ranking.camId)));
    }
  });

  it('ranks only the named cams, and can leave the curves out', async () => {
    const camIds = sellableCamIds.slice(0, 3);
    const body = (await rank({ build: towingTruck, camIds, includeCurves: false }).expect(200)).body as RankingBody;
    expect(body.rankings.map((r) => r.camId).sort()).toEqual([...camIds].sort());
    for (const ranking of body.rankings) expect(ranking.curve).toEqual([]);
  });

  it('names an unknown cam id in a 422', async () => {
    const response = await rank({ build: towingTruck, camIds: [sellableCamIds[0], 999999] }).expect(422);
    expect(response.body.errors).toEqual([{ field: 'camIds', message: expect.stringContaining('999999') }]);
  });

  it('names the bad field of a build profile', async () => {
    const bad = { ...towingTruck, engine: { ...towingTruck.engine, boreIn: '3.78' } };
    const response = await rank({ build: bad }).expect(422);
    expect(response.body.errors).toEqual(
      expect.arrayContaining([expect.objectContaining({ field: 'build.engine.boreIn' })]),
    );
  });

  it('answers 400 to a body that is not JSON', async () => {
    const response = await request(appUrl)
      .post('/api/advisor/rank')
      .set('Cookie', cookie)
      .set('Content-Type', 'application/json')
      .send('{"build":');
    expect(response.status).toBe(400);
  });

  it('answers random and hostile bodies with a 4xx naming fields, never a 500 (property-based)', async () => {
    const hostileValue = fc.oneof(
      fc.constant(null),
      fc.constant(Number.NaN),
      fc.constant(-1e308),
      fc.constant('__proto__'),
      fc.string(),
      fc.integer(),
      fc.double(),
      fc.boolean(),
      fc.array(fc.integer(), { maxLength: 3 }),
      fc.dictionary(fc.string(), fc.integer(), { maxKeys: 3 }),
    );
    const paths = [
      'engine.boreIn',
      'engine.strokeIn',
      'engine.headMaterial',
      'drivetrain.stallRpm',
      'use.primary',
      'baselineCam.lsa',
      'exhaust',
      'vehicle',
    ];
    await fc.assert(
      fc.asyncProperty(fc.constantFrom(...paths), hostileValue, async (path, value) => {
        const build = structuredClone(towingTruck) as unknown as Record<string, Record<string, unknown>>;
        const [group, field] = path.split('.');
        if (field) build[group][field] = value;
        else build[group] = value as Record<string, unknown>;
        const response = await rank({ build });
        // Some random values are valid (e.g. a bore in range); those rank normally.
        expect([200, 400, 422]).toContain(response.status);
        if (response.status === 422) expect(response.body.errors.length).toBeGreaterThan(0);
      }),
      { numRuns: 40, seed: 20261202 },
    );
  });
});
