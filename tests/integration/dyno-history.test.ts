import request from 'supertest';
import { Op, QueryTypes, type Sequelize } from 'sequelize';
import { Build, Cam, DynoGain, DynoRun } from '@/lib/db/models';
import { refreshDynoGains } from '@/lib/db/queries/dyno-gains';
import { BuildProfileSchema, type BuildProfile } from '@/lib/schemas/build-profile';
import { signIn } from '../support/auth';
import { connectTestDatabase, disconnectTestDatabase } from '../support/database';
import { readRuntime } from '../support/runtime';
import { DEMO } from '../support/demo';
import type { ShopRankingEntry } from '@/lib/ranking/types';

// Issue 11, item 5: a ranking reads the measured history of similar engines only (dyno_gains, kept in
// the dyno run's own transaction), and the advisor gets the measured gain rpm by rpm, not just at the peak.
const { appUrl } = readRuntime();
const MARK = 'Historyrow';
const BUILD_ID = DEMO.builds.whitlockTowingTruck; // the demo 5.3 L towing truck

type RankedCam = ShopRankingEntry;

const hoursAgo = (hours: number) => new Date(Date.now() - hours * 3_600_000).toISOString();
const grid = (from: number, to: number) => Array.from({ length: (to - from) / 250 + 1 }, (_, i) => from + i * 250);
// The after pull is 20 % stronger up to 3,000 rpm and level from 4,000 rpm: all of its gain is low down.
const BEFORE = grid(2000, 6000).map((rpm) => ({ rpm, torqueLbFt: 330 }));
const AFTER = grid(2000, 6000).map((rpm) => ({
  rpm,
  torqueLbFt: rpm <= 3000 ? 396 : rpm >= 4000 ? 330 : 396 - ((rpm - 3000) / 1000) * 66,
}));
const AIR = { airTempC: 25, baroKpa: 99, humidityPct: 40 };

let sequelize: Sequelize;
let tech: string;
let counter: string;
let profile: BuildProfile;
let camId: number;
const created: number[] = [];

async function rowsRead(): Promise<number> {
  const [row] = await sequelize.query<{ v: unknown }>(
    "SELECT VARIABLE_VALUE AS v FROM information_schema.GLOBAL_STATUS WHERE VARIABLE_NAME = 'ROWS_READ'",
    { type: QueryTypes.SELECT },
  );
  return Number(row.v);
}

const rank = (body: object) => request(appUrl).post('/api/advisor/rank').set('Cookie', counter).send(body).expect(200);

/** The fewest rows (MariaDB's Rows_read, every table) any of three whole-catalogue rankings read (the least disturbed by anything else). */
async function rowsReadByRanking(): Promise<number> {
  const seen: number[] = [];
  for (let i = 0; i < 3; i++) {
    const before = await rowsRead();
    await rank({ build: profile, includeCurves: false });
    seen.push((await rowsRead()) - before);
  }
  return Math.min(...seen);
}

async function removeMarked() {
  const [rows] = await sequelize.query(`SELECT id FROM customers WHERE name LIKE '${MARK} %'`);
  const ids = (rows as { id: number }[]).map((r) => Number(r.id));
  // Builds, their runs and their dyno_gains go with the customers (cascades).
  if (ids.length) await sequelize.query(`DELETE FROM customers WHERE id IN (${ids.join(',')})`);
}

/** Builds on an engine far from build 1's (6.2 L against 5.3 L), each with a before and an after pull, filed as the app files them. */
async function addUnrelatedHistory(builds: number) {
  const big = { ...profile, engine: { ...profile.engine, boreIn: 4.5, strokeIn: 4.2 } };
  BuildProfileSchema.parse(big);
  const e = (v: unknown) => sequelize.escape(v as string);
  const people = Array.from(
    { length: builds },
    (_, i) => `(${e(`${MARK} ${i}`)}, ${e(`history${i}@historyrow.example`)})`,
  );
  await sequelize.query(`INSERT INTO customers (name, email) VALUES ${people.join(',')}`);
  const [customers] = await sequelize.query(`SELECT id FROM customers WHERE name LIKE '${MARK} %' ORDER BY id`);
  await sequelize.query(
    `INSERT INTO builds (customer_id, vehicle_label, profile) VALUES ${(customers as { id: number }[]).map((c) => `(${c.id}, 'Historyrow truck', ${e(JSON.stringify(big))})`).join(',')}`,
  );
  const [made] = await sequelize.query(
    `SELECT b.id FROM builds b JOIN customers c ON c.id = b.customer_id WHERE c.name LIKE '${MARK} %' ORDER BY b.id`,
  );
  const buildIds = (made as { id: number }[]).map((b) => Number(b.id));
  const curve = e(JSON.stringify(BEFORE.map((p) => ({ ...p, hp: (p.torqueLbFt * p.rpm) / 5252 }))));
  const runs = buildIds.flatMap((id) => [
    `(${id}, NULL, 'before', NOW(), 25, 99, 40, 377, 6000, 330, 2000, ${curve})`,
    `(${id}, ${camId}, 'after', NOW(), 25, 99, 40, 400, 6000, 350, 2000, ${curve})`,
  ]);
  await sequelize.query(
    `INSERT INTO dyno_runs (build_id, cam_id, phase, run_at, air_temp_c, baro_kpa, humidity_pct, peak_hp, peak_hp_rpm, peak_torque_lb_ft, peak_torque_rpm, curve) VALUES ${runs.join(',')}`,
  );
  await sequelize.transaction(async (t) => {
    await Build.findAll({
      where: { id: { [Op.in]: buildIds } },
      attributes: ['id'],
      lock: t.LOCK.UPDATE,
      transaction: t,
    });
    await refreshDynoGains(buildIds, t);
  });
  await sequelize.query('ANALYZE TABLE dyno_runs, dyno_gains');
  return buildIds;
}

beforeAll(async () => {
  sequelize = connectTestDatabase();
  await removeMarked();
  [tech, counter] = await Promise.all([signIn('tech'), signIn('counter')]);
  profile = BuildProfileSchema.parse((await Build.findByPk(1))!.profile);
  camId = (await Cam.findOne({
    where: { isFactoryBaseline: false, active: true, sku: { [Op.ne]: 'F9-219' } },
    order: [['sku', 'ASC']],
  }))!.id;
  expect(await DynoRun.count({ where: { buildId: BUILD_ID } })).toBe(0);
});

afterAll(async () => {
  for (const id of created) await request(appUrl).delete(`/api/dyno-runs/${id}`).set('Cookie', tech);
  await removeMarked();
  await disconnectTestDatabase();
});

describe('the measured history a ranking reads', () => {
  it('does not grow with runs stored on unrelated engines', async () => {
    await rank({ build: profile, includeCurves: false }); // warm: the first request after start loads code and caches
    const alone = await rowsReadByRanking();
    const buildIds = await addUnrelatedHistory(1_500);
    // The history is really there: every unrelated build filed a row for the cam.
    expect(await DynoGain.count({ where: { buildId: { [Op.in]: buildIds }, camId } })).toBe(1_500);
    const withUnrelated = await rowsReadByRanking();
    // Reading the whole history (the old loader) would read 3,000 runs and 1,500 build profiles more.
    expect(withUnrelated - alone).toBeLessThan(100);
    // ... while a ranking for the big engine itself does find them (bounded by the per-side limit).
    const big = { ...profile, engine: { ...profile.engine, boreIn: 4.5, strokeIn: 4.2 } };
    const ranked = (await rank({ build: big, camIds: [camId], includeCurves: false })).body.rankings[0] as RankedCam;
    expect(ranked.history?.matches).toBeGreaterThan(100);
    await removeMarked();
    expect(await DynoGain.count({ where: { buildId: { [Op.in]: buildIds } } })).toBe(0);
  });

  it('per-rpm gains from the pulls reach the advisor: a low-rpm gain moves the low end of the prediction', async () => {
    const lowRpm = 2500; // well under 60 % of the peak-power rpm, where a peak-only record counts for nothing
    const at = (r: RankedCam, rpm: number) => r.curve.find((p) => p.rpm === rpm)!.torqueLbFt;
    const without = (await rank({ build: profile, camIds: [camId] })).body.rankings[0] as RankedCam;
    expect(without.history).toBeNull();

    for (const [phase, curve, when] of [
      ['before', BEFORE, 3],
      ['after', AFTER, 2],
    ] as const) {
      const res = await request(appUrl)
        .post('/api/dyno-runs')
        .set('Cookie', tech)
        .send({
          buildId: BUILD_ID,
          phase,
          ...AIR,
          curve,
          runAt: hoursAgo(when),
          ...(phase === 'after' ? { camId } : {}),
        })
        .expect(201);
      created.push(res.body.id);
    }
    // Filed in the same transaction as the run: the row is there as soon as the answer is.
    const row = (await DynoGain.findOne({ where: { buildId: BUILD_ID, camId } }))!;
    expect(row.gainPctByRpm!.find((p) => p.rpm === lowRpm)!.gainPct).toBeCloseTo(20, 6); // 396 / 330 − 1, same air both days
    expect(row.gainPctByRpm!.find((p) => p.rpm === 5000)!.gainPct).toBeCloseTo(0, 6);

    const withHistory = (await rank({ build: profile, camIds: [camId] })).body.rankings[0] as RankedCam;
    expect(withHistory.history?.matches).toBe(1);
    // The blend (src/lib/advisor/history.ts): gain = (2 · model + 1 · 20 %) / 3 at full similarity, so the
    // low end rises by a third of the gap between the model's gain and the measured 20 %.
    const base = (await rank({ build: profile, camIds: [camId] })).body.baseline as {
      curve: { rpm: number; torqueLbFt: number }[];
    };
    const baseAt = base.curve.find((p) => p.rpm === lowRpm)!.torqueLbFt;
    const modelGain = (at(without, lowRpm) / baseAt - 1) * 100;
    const blended = (at(withHistory, lowRpm) / baseAt - 1) * 100;
    expect(blended).toBeCloseTo((2 * modelGain + 20) / 3, 1);

    // The job page draws the prediction over this build's own pulls: asked to leave the build out, the
    // ranking has no history and gives the model's own curve again.
    const leftOut = (await rank({ build: profile, camIds: [camId], excludeBuildId: BUILD_ID })).body
      .rankings[0] as RankedCam;
    expect(leftOut.history).toBeNull();
    expect(at(leftOut, lowRpm)).toBeCloseTo(at(without, lowRpm), 6);
  });

  it('follows the build: a new engine refiles its history, a deleted run takes it away', async () => {
    const build = (await request(appUrl).get(`/api/builds/${BUILD_ID}`).set('Cookie', counter).expect(200)).body as {
      version: number;
      profile: BuildProfile;
    };
    const edit = (engine: BuildProfile['engine'], version: number) =>
      request(appUrl)
        .patch(`/api/builds/${BUILD_ID}`)
        .set('Cookie', counter)
        .send({ version, profile: { ...build.profile, engine } });
    const bored = await edit({ ...build.profile.engine, boreIn: build.profile.engine.boreIn + 0.03 }, build.version);
    expect(bored.status).toBe(200);
    const refiled = (await DynoGain.findOne({ where: { buildId: BUILD_ID, camId } }))!;
    expect(refiled.displacementCi).toBeCloseTo(
      (Math.PI / 4) * (profile.engine.boreIn + 0.03) ** 2 * profile.engine.strokeIn * profile.engine.cylinders,
      6,
    );
    expect((await edit(build.profile.engine, bored.body.version)).status).toBe(200);

    await request(appUrl).delete(`/api/dyno-runs/${created.pop()}`).set('Cookie', tech).expect(200);
    expect(await DynoGain.count({ where: { buildId: BUILD_ID } })).toBe(0);
  });
});
