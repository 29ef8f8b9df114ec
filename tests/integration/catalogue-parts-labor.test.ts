import request from 'supertest';
import { Op } from 'sequelize';
import { AuditEntry, LaborOperation, Part } from '@/lib/db/models';
import { signIn } from '../support/auth';
import { connectTestDatabase, disconnectTestDatabase } from '../support/database';
import { readRuntime } from '../support/runtime';
import { DEMO } from '../support/demo';

const PREFIX = `TP${Date.now().toString(36).toUpperCase()}`;
const app = () => request(readRuntime().appUrl);
let manager: string;
let counter: string;
let tech: string;

beforeAll(async () => {
  connectTestDatabase();
  [manager, counter, tech] = await Promise.all([signIn('manager'), signIn('counter'), signIn('tech')]);
});

afterAll(async () => {
  await Part.destroy({ where: { sku: { [Op.like]: `${PREFIX}%` } } });
  await LaborOperation.destroy({ where: { code: { [Op.like]: `${PREFIX}%` } } });
  await disconnectTestDatabase();
});

describe('parts', () => {
  const part = (overrides: Record<string, unknown> = {}) => ({
    sku: `${PREFIX}-SPR`,
    name: 'Test beehive spring kit',
    category: 'springs',
    supplierId: DEMO.suppliers.foundryNine,
    priceCents: 31900,
    costCents: 19000,
    stockOnHand: 4,
    spec: { maxLiftIn: 0.6 },
    ...overrides,
  });

  it('creates, lists, changes with the version and answers 409 to a stale change', async () => {
    const created = await app().post('/api/parts').set('Cookie', manager).send(part());
    expect(created.status).toBe(201);
    expect(created.body).toMatchObject({
      sku: `${PREFIX}-SPR`,
      category: 'springs',
      spec: { maxLiftIn: 0.6 },
      version: 1,
      supplierName: 'Foundry Nine Valvetrain',
    });

    const list = await app().get('/api/parts').query({ category: 'springs', q: PREFIX }).set('Cookie', counter);
    expect(list.body).toMatchObject({ total: 1, page: 1 });

    const changed = await app()
      .patch(`/api/parts/${created.body.id}`)
      .set('Cookie', manager)
      .send({ version: 1, stockOnHand: 6 });
    expect(changed.status).toBe(200);
    expect(changed.body).toMatchObject({ stockOnHand: 6, version: 2 });
    const stale = await app()
      .patch(`/api/parts/${created.body.id}`)
      .set('Cookie', manager)
      .send({ version: 1, stockOnHand: 0 });
    expect(stale.status).toBe(409);
    expect(stale.body.current).toMatchObject({ stockOnHand: 6, version: 2 });
    expect(await AuditEntry.count({ where: { entityType: 'part', entityId: String(created.body.id) } })).toBe(2);
  });

  it('names the wrong fields', async () => {
    const response = await app()
      .post('/api/parts')
      .set('Cookie', manager)
      .send(part({ sku: 'has spaces', category: 'wheels', priceCents: -1, spec: { maxLiftIn: { deep: 1 } } }));
    expect(response.status).toBe(422);
    expect(response.body.errors.map((e: { field: string }) => e.field)).toEqual(
      expect.arrayContaining(['sku', 'category', 'priceCents', 'spec.maxLiftIn']),
    );
  });

  it('keeps cost from technicians and refuses their changes', async () => {
    const list = await app().get('/api/parts').set('Cookie', tech);
    expect(list.status).toBe(200);
    for (const p of list.body.items) expect(p).not.toHaveProperty('costCents');
    expect(
      (
        await app()
          .post('/api/parts')
          .set('Cookie', tech)
          .send(part({ sku: `${PREFIX}-T` }))
      ).status,
    ).toBe(403);
    expect(
      (
        await app()
          .patch(`/api/parts/${DEMO.parts.springs570}`)
          .set('Cookie', counter)
          .send({ version: 1, priceCents: 1 })
      ).status,
    ).toBe(403);
  });

  it('refuses to delete a part a need rule uses, and deletes an unused one', async () => {
    const used = await app().delete(`/api/parts/${DEMO.parts.ovateSprings600}`).set('Cookie', manager); // in the seeded springs rule
    expect(used.status).toBe(409);
    expect(used.body.message).toMatch(/need rule/);
    expect(await Part.findByPk(DEMO.parts.ovateSprings600)).not.toBeNull();
    const spare = await app()
      .post('/api/parts')
      .set('Cookie', manager)
      .send(part({ sku: `${PREFIX}-DEL` }));
    const gone = await app().delete(`/api/parts/${spare.body.id}`).set('Cookie', manager);
    expect(gone.body.outcome).toBe('deleted');
  });

  it('makes a part on a quote line inactive instead of deleting it', async () => {
    const response = await app().delete(`/api/parts/${DEMO.parts.doubleRollerTiming}`).set('Cookie', manager); // on a seeded quote, in no rule
    expect(response.status).toBe(200);
    expect(response.body.outcome).toBe('deactivated');
    const restored = await app()
      .patch(`/api/parts/${DEMO.parts.doubleRollerTiming}`)
      .set('Cookie', manager)
      .send({ version: response.body.part.version, active: true });
    expect(restored.body.active).toBe(true);
  });
});

describe('labour operations', () => {
  it('creates one with hours and engines, normalising the engine list', async () => {
    const created = await app()
      .post('/api/labor')
      .set('Cookie', manager)
      .send({ code: `${PREFIX}-LS`, name: 'Lifter swap only', hours: 6.25, engines: 'Truck,car' });
    expect(created.status).toBe(201);
    expect(created.body).toMatchObject({ hours: 6.25, engines: 'truck, car', version: 1 });
    const stale = await app()
      .patch(`/api/labor/${created.body.id}`)
      .set('Cookie', manager)
      .send({ version: 7, hours: 5 });
    expect(stale.status).toBe(409);
    const ok = await app()
      .patch(`/api/labor/${created.body.id}`)
      .set('Cookie', manager)
      .send({ version: 1, hours: 5.5 });
    expect(ok.body).toMatchObject({ hours: 5.5, version: 2 });
  });

  it('names the wrong fields', async () => {
    const response = await app()
      .post('/api/labor')
      .set('Cookie', manager)
      .send({ code: '', name: 'x', hours: 0, engines: 'big block!' });
    expect(response.status).toBe(422);
    expect(response.body.errors.map((e: { field: string }) => e.field).sort()).toEqual(['code', 'engines', 'hours']);
  });

  it('lets staff read and only managers write', async () => {
    expect((await app().get('/api/labor').set('Cookie', tech)).body.total).toBeGreaterThanOrEqual(7);
    expect(
      (
        await app()
          .post('/api/labor')
          .set('Cookie', counter)
          .send({ code: `${PREFIX}-X`, name: 'x', hours: 1 })
      ).status,
    ).toBe(403);
    expect((await app().delete(`/api/labor/${DEMO.labor.camSwapTruck}`).set('Cookie', tech)).status).toBe(403);
  });
});
