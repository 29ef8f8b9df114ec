import request from 'supertest';
import { Op } from 'sequelize';
import { AuditEntry, DynoRun } from '@/lib/db/models';
import { signIn } from '../support/auth';
import { connectTestDatabase, disconnectTestDatabase } from '../support/database';
import { readRuntime } from '../support/runtime';
import { removeDynoRuns } from '../support/dyno-runs';
import { DEMO } from '../support/demo';

// POST /api/dyno-runs asks for the air readings the chosen correction's formula uses, and no others:
// SAE J1349 and J607 use temperature, pressure and humidity; DIN 70020 temperature and total pressure;
// "none" nothing. Runs go on demo build 3 and are deleted afterwards with their audit rows.
const { appUrl } = readRuntime();
const CURVE = [
  { rpm: 3000, torqueLbFt: 300 },
  { rpm: 4000, torqueLbFt: 320 },
  { rpm: 5000, torqueLbFt: 310 },
];

describe('dyno run air readings by correction standard', () => {
  let tech: string;
  const created: number[] = [];
  beforeAll(async () => {
    connectTestDatabase();
    tech = await signIn('tech');
  });
  afterAll(async () => {
    if (created.length) {
      await removeDynoRuns(created);
      await AuditEntry.destroy({ where: { entityType: 'dyno-run', entityId: { [Op.in]: created.map(String) } } });
    }
    await disconnectTestDatabase();
  });
  const post = (body: object) =>
    request(appUrl)
      .post('/api/dyno-runs')
      .set('Cookie', tech)
      .send({ buildId: DEMO.builds.vranesStripCoupe, phase: 'before', curve: CURVE, ...body });

  it('records an uncorrected run without any air readings (factor 1, observed = corrected)', async () => {
    const res = await post({ correctionStandard: 'none' }).expect(201);
    created.push(res.body.id);
    expect(res.body.air).toEqual({ airTempC: null, baroKpa: null, humidityPct: null });
    expect(res.body.correction).toMatchObject({ standard: 'none', factor: 1 });
    // Corrected figures are shown to 0.1 hp; with a factor of 1 they are the observed ones, rounded.
    expect(res.body.corrected.peakHp).toBe(Math.round(res.body.observed.peakHp * 10) / 10);
  });

  it('corrects a DIN 70020 run without humidity: 1013 / 1000 mbar · √(293 / 293) = 1.013', async () => {
    // DIN 70020 (from memory): cf = (1013 / p) · √((273 + t) / 293); 100 kPa = 1000 mbar, 20 °C.
    const res = await post({ correctionStandard: 'din-70020', airTempC: 20, baroKpa: 100 }).expect(201);
    created.push(res.body.id);
    expect(res.body.air.humidityPct).toBeNull();
    expect(res.body.correction.factor).toBeCloseTo(1.013, 6);
  });

  it('answers 422 naming each reading the SAE standards need, in °C and kPa', async () => {
    const res = await post({ correctionStandard: 'sae-j1349', airTempC: 25 }).expect(422);
    expect(res.body.errors).toEqual([
      { field: 'baroKpa', message: 'barometric pressure is required for SAE J1349 (kPa)' },
      { field: 'humidityPct', message: 'relative humidity is required for SAE J1349 (%)' },
    ]);
    const din = await post({ correctionStandard: 'din-70020', humidityPct: 40 }).expect(422);
    expect(din.body.errors.map((e: { field: string }) => e.field)).toEqual(['airTempC', 'baroKpa']);
    // Left out, the standard is SAE J1349 as before, so an old caller sending no air still hears why.
    const bare = await post({}).expect(422);
    expect(bare.body.errors.map((e: { field: string }) => e.field)).toEqual(['airTempC', 'baroKpa', 'humidityPct']);
    expect(await DynoRun.count({ where: { buildId: DEMO.builds.vranesStripCoupe, id: { [Op.notIn]: created } } })).toBe(
      0,
    );
  });
});
