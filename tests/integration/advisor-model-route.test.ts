import request from 'supertest';
import { Build, Cam } from '@/lib/db/models';
import { BuildProfileSchema, type BuildProfile } from '@/lib/schemas/build-profile';
import { signIn } from '../support/auth';
import { connectTestDatabase, disconnectTestDatabase } from '../support/database';
import { readRuntime } from '../support/runtime';
import type { ModelDetail } from '@/lib/advisor/model-detail';

const { appUrl } = readRuntime();

type Detail = ModelDetail;

describe('POST /api/advisor/model (how the numbers were reached)', () => {
  let cookie: string;
  let truck: BuildProfile;
  let camId: number;

  beforeAll(async () => {
    connectTestDatabase();
    cookie = await signIn('tech');
    truck = BuildProfileSchema.parse((await Build.findByPk(1))!.profile);
    camId = (await Cam.findOne({ where: { sku: 'LV-212' } }))!.id;
  });
  afterAll(() => disconnectTestDatabase());

  const ask = (body: object) => request(appUrl).post('/api/advisor/model').set('Cookie', cookie).send(body);

  it('gives the model’s own figures for a catalogue cam, and they add up', async () => {
    const body = (await ask({ build: truck, camId }).expect(200)).body as Detail;
    expect(body.camName).toMatch(/212/);
    expect(body.simulated.length).toBeGreaterThanOrEqual(8);
    const e = truck.engine;
    const displacementIn3 = (Math.PI / 4) * e.boreIn * e.boreIn * e.strokeIn * e.cylinders;
    for (const p of body.simulated) {
      // BMEP = IMEP (net, pumping included) − friction (Heywood ch. 2); each figure is rounded to 0.1 psi.
      expect(Math.abs(p.imepPsi - p.frictionPsi - p.bmepPsi)).toBeLessThanOrEqual(0.15);
      // Torque of a four-stroke: T = BMEP · Vd / (4π) (Heywood ch. 2); psi · in³ / 12 = lb·ft.
      expect(Math.abs(p.torqueLbFt - (p.bmepPsi * displacementIn3) / (4 * Math.PI * 12))).toBeLessThanOrEqual(0.3);
      expect(p.volumetricEfficiencyPct).toBeGreaterThan(50);
      expect(p.volumetricEfficiencyPct).toBeLessThan(115);
    }
    const lifted = body.lift.filter((l) => l.intakeIn > 0);
    expect(Math.max(...lifted.map((l) => l.intakeIn))).toBeCloseTo(0.565, 2);
    expect(body.headFlow.at(-1)!.liftIn).toBeCloseTo(0.565, 3);
  });

  it('explains the build’s own cam too, and names a missing cam', async () => {
    const base = (await ask({ build: truck, camId: 'baseline' }).expect(200)).body as Detail;
    expect(base.camName).toBe(truck.baselineCam.name);
    const missing = await ask({ build: truck, camId: 999999 }).expect(422);
    expect(missing.body.errors).toEqual([{ field: 'camId', message: 'no cam in the catalogue has id 999999' }]);
    const bad = await ask({ build: truck, camId: 'most-popular' }).expect(422);
    expect(bad.body.errors[0].field).toBe('camId');
  });
});
