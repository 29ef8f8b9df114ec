import request from 'supertest';
import { AuditEntry, NeedRule, ShopSettings } from '@/lib/db/models';
import { signIn } from '../support/auth';
import { connectTestDatabase, disconnectTestDatabase } from '../support/database';
import { readRuntime } from '../support/runtime';
import { DEMO, MISSING_ID } from '../support/demo';

const app = () => request(readRuntime().appUrl);
let manager: string;
let counter: string;
let tech: string;
const madeRules: number[] = [];

beforeAll(async () => {
  connectTestDatabase();
  [manager, counter, tech] = await Promise.all([signIn('manager'), signIn('counter'), signIn('tech')]);
});

afterAll(async () => {
  for (const id of madeRules) await NeedRule.destroy({ where: { id } });
  await disconnectTestDatabase();
});

describe('shop settings', () => {
  it('lets a manager read and change the labour rate, tax rate and deposit policy, with a 409 on a stale version', async () => {
    const current = await app().get('/api/settings').set('Cookie', manager);
    expect(current.status).toBe(200);
    expect(current.body).toMatchObject({
      laborRateCents: expect.any(Number),
      taxRateBp: expect.any(Number),
      depositPercentBp: expect.any(Number),
    });
    const original = current.body;
    try {
      const changed = await app()
        .patch('/api/settings')
        .set('Cookie', manager)
        .send({ version: original.version, laborRateCents: original.laborRateCents + 500, depositPercentBp: 2500 });
      expect(changed.status).toBe(200);
      expect(changed.body).toMatchObject({
        laborRateCents: original.laborRateCents + 500,
        depositPercentBp: 2500,
        version: original.version + 1,
      });
      const stale = await app()
        .patch('/api/settings')
        .set('Cookie', manager)
        .send({ version: original.version, taxRateBp: 0 });
      expect(stale.status).toBe(409);
      expect(stale.body.current.laborRateCents).toBe(original.laborRateCents + 500);
      expect(await AuditEntry.count({ where: { action: 'settings.updated' } })).toBeGreaterThan(0);
    } finally {
      const settings = await ShopSettings.findOne({ order: [['id', 'ASC']] });
      await settings!.update({
        laborRateCents: original.laborRateCents,
        depositPercentBp: original.depositPercentBp,
        taxRateBp: original.taxRateBp,
      });
    }
  });

  it('names wrong fields, including a maximum deposit below the minimum', async () => {
    const { body } = await app().get('/api/settings').set('Cookie', manager);
    const response = await app()
      .patch('/api/settings')
      .set('Cookie', manager)
      .send({ version: body.version, taxRateBp: 8.25, depositPolicyText: '', laborRateCents: -1 });
    expect(response.status).toBe(422);
    expect(response.body.errors.map((e: { field: string }) => e.field).sort()).toEqual([
      'depositPolicyText',
      'laborRateCents',
      'taxRateBp',
    ]);
    const range = await app()
      .patch('/api/settings')
      .set('Cookie', manager)
      .send({ version: body.version, depositMinCents: 50000, depositMaxCents: 10000 });
    expect(range.status).toBe(422);
    expect(range.body.errors).toEqual([
      { field: 'depositMaxCents', message: 'deposit maximum must not be below the deposit minimum' },
    ]);
    expect((await ShopSettings.findOne({ order: [['id', 'ASC']] }))?.version).toBe(body.version);
  });

  it('is for managers only', async () => {
    expect((await app().get('/api/settings').set('Cookie', counter)).status).toBe(403);
    expect((await app().patch('/api/settings').set('Cookie', tech).send({ version: 1, taxRateBp: 0 })).status).toBe(
      403,
    );
  });
});

describe('need rules', () => {
  it('lists the rules with their parts and labour for any staff member: one per need kind, install by vehicle class', async () => {
    const response = await app().get('/api/rules').set('Cookie', tech);
    expect(response.status).toBe(200);
    const springs = response.body.items.find((r: { kind: string }) => r.kind === 'springs');
    expect(springs).toMatchObject({
      vehicleClass: null,
      items: [
        expect.objectContaining({
          part: expect.objectContaining({ sku: 'SPR-600' }),
          laborOperation: expect.objectContaining({ code: 'SPR-INST' }),
        }),
      ],
    });
    // No threshold of its own: the advisor's installed-springs limit decides when springs are needed.
    expect(springs).not.toHaveProperty('threshold');
    const installs = response.body.items.filter((r: { kind: string }) => r.kind === 'install');
    expect(
      installs.map((r: { vehicleClass: string | null; items: { laborOperation: { code: string } }[] }) => [
        r.vehicleClass,
        r.items[0].laborOperation.code,
      ]),
    ).toEqual([
      [null, 'CAM-TRUCK'],
      ['car', 'CAM-CAR'],
    ]);
  });

  it('creates, changes (items and version) and deletes a rule, auditing each step', async () => {
    const created = await app()
      .post('/api/rules')
      .set('Cookie', manager)
      .send({
        kind: 'springs',
        vehicleClass: 'van',
        label: 'Test: vans get the dual springs',
        items: [{ partId: DEMO.parts.dualSprings660, laborOperationId: DEMO.labor.springInstall }],
      });
    expect(created.status).toBe(201);
    madeRules.push(created.body.id);
    expect(created.body).toMatchObject({
      kind: 'springs',
      vehicleClass: 'van',
      version: 1,
      items: [{ partId: DEMO.parts.dualSprings660, laborOperationId: DEMO.labor.springInstall, quantity: 1 }],
    });

    const changed = await app()
      .patch(`/api/rules/${created.body.id}`)
      .set('Cookie', manager)
      .send({
        version: 1,
        items: [
          { partId: DEMO.parts.dualSprings660, laborOperationId: null, quantity: 1 },
          { partId: DEMO.parts.pushrodChecker, quantity: 1 },
        ],
      });
    expect(changed.status).toBe(200);
    expect(changed.body.version).toBe(2);
    expect(changed.body.items.map((i: { partId: number }) => i.partId)).toEqual([
      DEMO.parts.dualSprings660,
      DEMO.parts.pushrodChecker,
    ]);

    const stale = await app()
      .patch(`/api/rules/${created.body.id}`)
      .set('Cookie', manager)
      .send({ version: 1, label: 'late' });
    expect(stale.status).toBe(409);
    expect(stale.body.current.items).toHaveLength(2);

    const removed = await app().delete(`/api/rules/${created.body.id}`).set('Cookie', manager);
    expect(removed.status).toBe(200);
    expect(await NeedRule.findByPk(created.body.id)).toBeNull();
    const actions = (
      await AuditEntry.findAll({ where: { entityType: 'need_rule', entityId: String(created.body.id) } })
    ).map((a) => a.action);
    expect(actions).toEqual(['rule.created', 'rule.updated', 'rule.deleted']);
  });

  it('checks the kind, the vehicle class and the items against the catalogue; a threshold is refused', async () => {
    const oldKind = await app()
      .post('/api/rules')
      .set('Cookie', manager)
      .send({ kind: 'lift-over', label: 'x', items: [{ partId: DEMO.parts.springs570 }] });
    expect(oldKind.status).toBe(422);
    expect(oldKind.body.errors).toEqual([
      expect.objectContaining({ field: 'kind', message: expect.stringContaining('springs') }),
    ]);
    const threshold = await app()
      .post('/api/rules')
      .set('Cookie', manager)
      .send({ kind: 'springs', threshold: 0.57, label: 'x', items: [{ partId: DEMO.parts.springs570 }] });
    expect(threshold.body.errors).toEqual([
      expect.objectContaining({ field: 'threshold', message: expect.stringContaining('the advisor decides') }),
    ]);
    const badClass = await app()
      .post('/api/rules')
      .set('Cookie', manager)
      .send({ kind: 'install', vehicleClass: 'boat', label: 'x', items: [{ partId: DEMO.parts.springs570 }] });
    expect(badClass.body.errors).toEqual([expect.objectContaining({ field: 'vehicleClass' })]);
    const badItems = await app()
      .post('/api/rules')
      .set('Cookie', manager)
      .send({ kind: 'tune', label: 'x', items: [{ partId: MISSING_ID }, {}] });
    expect(badItems.status).toBe(422);
    expect(badItems.body.errors.map((e: { field: string }) => e.field)).toEqual(['items.1.partId']);
    const unknownPart = await app()
      .post('/api/rules')
      .set('Cookie', manager)
      .send({ kind: 'tune', label: 'x', items: [{ partId: MISSING_ID }] });
    expect(unknownPart.body.errors).toEqual([
      { field: 'items.0.partId', message: `there is no part with id ${MISSING_ID}` },
    ]);
  });

  it('refuses counter and tech changes', async () => {
    expect(
      (
        await app()
          .post('/api/rules')
          .set('Cookie', counter)
          .send({ kind: 'tune', label: 'x', items: [{ partId: DEMO.parts.springs570 }] })
      ).status,
    ).toBe(403);
    expect(
      (
        await app()
          .patch(`/api/rules/${DEMO.needRules.install}`)
          .set('Cookie', tech)
          .send({ version: 1, active: false })
      ).status,
    ).toBe(403);
    expect((await app().delete(`/api/rules/${DEMO.needRules.install}`).set('Cookie', counter)).status).toBe(403);
    expect((await NeedRule.findByPk(1))?.active).toBe(true);
  });
});
