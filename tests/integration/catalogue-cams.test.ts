import request from 'supertest';
import { Op } from 'sequelize';
import { AuditEntry, Cam, Customer, Quote } from '@/lib/db/models';
import { signIn } from '../support/auth';
import { connectTestDatabase, disconnectTestDatabase } from '../support/database';
import { readRuntime } from '../support/runtime';
import { DEMO } from '../support/demo';

// Cams over HTTP against the real build and the real MariaDB. Every cam made here has a SKU starting
// with the run's prefix and is removed at the end, so the demo data stays as seeded.
const PREFIX = `TC${Date.now().toString(36).toUpperCase()}`;
const app = () => request(readRuntime().appUrl);
let manager: string;
let counter: string;
let tech: string;

function camBody(overrides: Record<string, unknown> = {}) {
  return {
    sku: `${PREFIX}-214`,
    name: 'Test Grind Street 214',
    supplierId: DEMO.suppliers.ridgeback,
    intakeDuration050: 214,
    exhaustDuration050: 220,
    intakeAdvertised: 266,
    exhaustAdvertised: 272,
    intakeLiftIn: 0.57,
    exhaustLiftIn: 0.57,
    lsa: 113,
    intakeCenterline: 109,
    priceCents: 41900,
    costCents: 26000,
    stockOnHand: 3,
    notes: 'made by catalogue-cams.test.ts',
    ...overrides,
  };
}

beforeAll(async () => {
  connectTestDatabase();
  [manager, counter, tech] = await Promise.all([signIn('manager'), signIn('counter'), signIn('tech')]);
});

afterAll(async () => {
  await Cam.destroy({ where: { sku: { [Op.like]: `${PREFIX}%` } } });
  await disconnectTestDatabase();
});

describe('cams: create, read, change', () => {
  it('creates a cam for a manager, answers it with its supplier and version 1, and writes an audit row', async () => {
    const response = await app().post('/api/cams').set('Cookie', manager).send(camBody());
    expect(response.status).toBe(201);
    expect(response.body).toMatchObject({
      sku: `${PREFIX}-214`,
      supplierName: 'Ridgeback Grind Co.',
      version: 1,
      rockerRatio: 1.7,
      active: true,
      archivedAt: null,
    });
    const audit = await AuditEntry.findOne({
      where: { entityType: 'cam', entityId: String(response.body.id), action: 'cam.created' },
    });
    expect(audit?.actor).toBe('manager@lobewise.test');
    expect(audit?.after).toMatchObject({ sku: `${PREFIX}-214` });

    const read = await app().get(`/api/cams/${response.body.id}`).set('Cookie', counter);
    expect(read.status).toBe(200);
    expect(read.body.costCents).toBe(26000);
  });

  it('names every wrong field in a 422, and writes nothing', async () => {
    const response = await app()
      .post('/api/cams')
      .set('Cookie', manager)
      .send(
        camBody({
          sku: `${PREFIX}-BAD`,
          intakeDuration050: 2140,
          lsa: 'wide',
          intakeAdvertised: 200,
          priceCents: 419.5,
          colour: 'red',
        }),
      );
    expect(response.status).toBe(422);
    const fields = (response.body.errors as { field: string; message: string }[]).map((e) => e.field);
    expect(fields).toEqual(expect.arrayContaining(['intakeDuration050', 'lsa', 'priceCents', 'colour']));
    expect(response.body.errors.find((e: { field: string }) => e.field === 'intakeDuration050').message).toMatch(
      /at most 300 deg/,
    );
    expect(await Cam.count({ where: { sku: `${PREFIX}-BAD` } })).toBe(0);
  });

  it('refuses a duplicate SKU by field and an unknown supplier by field', async () => {
    const duplicate = await app().post('/api/cams').set('Cookie', manager).send(camBody());
    expect(duplicate.status).toBe(422);
    expect(duplicate.body.errors[0].field).toBe('sku');
    const supplier = await app()
      .post('/api/cams')
      .set('Cookie', manager)
      .send(camBody({ sku: `${PREFIX}-SUP`, supplierId: 999 }));
    expect(supplier.status).toBe(422);
    expect(supplier.body.errors).toEqual([{ field: 'supplierId', message: 'there is no supplier with id 999' }]);
  });

  it('applies a PATCH with the current version and answers 409 with the current cam for a stale one', async () => {
    const created = await app()
      .post('/api/cams')
      .set('Cookie', manager)
      .send(camBody({ sku: `${PREFIX}-LOCK` }));
    const id = created.body.id as number;
    const first = await app().patch(`/api/cams/${id}`).set('Cookie', manager).send({ version: 1, priceCents: 43900 });
    expect(first.status).toBe(200);
    expect(first.body).toMatchObject({ priceCents: 43900, version: 2 });

    const stale = await app().patch(`/api/cams/${id}`).set('Cookie', manager).send({ version: 1, priceCents: 39900 });
    expect(stale.status).toBe(409);
    expect(stale.body.current).toMatchObject({ id, priceCents: 43900, version: 2 });
    expect((await Cam.findByPk(id))?.priceCents).toBe(43900);

    const missingVersion = await app().patch(`/api/cams/${id}`).set('Cookie', manager).send({ priceCents: 1 });
    expect(missingVersion.status).toBe(422);
    expect(missingVersion.body.errors[0].field).toBe('version');

    const crossField = await app()
      .patch(`/api/cams/${id}`)
      .set('Cookie', manager)
      .send({ version: 2, intakeAdvertised: 210 });
    expect(crossField.status).toBe(422);
    expect(crossField.body.errors[0].field).toBe('intakeAdvertised');
  });

  it('clears an optional field with null', async () => {
    const created = await app()
      .post('/api/cams')
      .set('Cookie', manager)
      .send(camBody({ sku: `${PREFIX}-NULL` }));
    const cleared = await app()
      .patch(`/api/cams/${created.body.id}`)
      .set('Cookie', manager)
      .send({ version: 1, intakeAdvertised: null, notes: null });
    expect(cleared.status).toBe(200);
    expect(cleared.body).toMatchObject({ intakeAdvertised: null, notes: null, exhaustAdvertised: 272 });
  });
});

describe('cams: delete archives when quotes refer to the cam', () => {
  it('deletes a cam nothing refers to', async () => {
    const created = await app()
      .post('/api/cams')
      .set('Cookie', manager)
      .send(camBody({ sku: `${PREFIX}-DEL` }));
    const response = await app().delete(`/api/cams/${created.body.id}`).set('Cookie', manager);
    expect(response.status).toBe(200);
    expect(response.body.outcome).toBe('deleted');
    expect(await Cam.findByPk(created.body.id)).toBeNull();
  });

  it('archives a cam a quote refers to, keeping the row and hiding it from the default list', async () => {
    const created = await app()
      .post('/api/cams')
      .set('Cookie', manager)
      .send(camBody({ sku: `${PREFIX}-ARC` }));
    const customer = await Customer.create({ name: 'Archive Test Customer', email: null, phone: null, notes: null });
    const quote = await Quote.create({
      number: `${PREFIX}-Q`.slice(0, 20),
      customerId: customer.id,
      buildId: null,
      camId: created.body.id,
      createdByUserId: null,
      publicTokenHash: null,
      subtotalCents: 0,
      taxRateBp: 0,
      taxCents: 0,
      totalCents: 0,
      depositCents: 0,
      validUntil: null,
      sentAt: null,
      acceptedAt: null,
    });
    try {
      const response = await app().delete(`/api/cams/${created.body.id}`).set('Cookie', manager);
      expect(response.status).toBe(200);
      expect(response.body.outcome).toBe('archived');
      expect(response.body.cam.archivedAt).not.toBeNull();
      expect((await Cam.findByPk(created.body.id))?.active).toBe(false);

      const list = await app()
        .get('/api/cams')
        .query({ q: `${PREFIX}-ARC` })
        .set('Cookie', manager);
      expect(list.body.total).toBe(0);
      const archived = await app()
        .get('/api/cams')
        .query({ q: `${PREFIX}-ARC`, archived: 'only' })
        .set('Cookie', manager);
      expect(archived.body.items.map((c: { sku: string }) => c.sku)).toEqual([`${PREFIX}-ARC`]);
    } finally {
      await quote.destroy();
      await customer.destroy();
    }
  });
});

describe('cams: the list', () => {
  it('pages, filters and sorts on the server', async () => {
    const response = await app()
      .get('/api/cams')
      .query({ durationMin: 210, durationMax: 226, sort: 'lsa', dir: 'desc', pageSize: 2, page: 1, supplier: 2 })
      .set('Cookie', counter);
    expect(response.status).toBe(200);
    expect(response.body).toMatchObject({ page: 1, pageSize: 2 });
    const all = await app()
      .get('/api/cams')
      .query({ durationMin: 210, durationMax: 226, supplier: 2, pageSize: 100 })
      .set('Cookie', counter);
    expect(response.body.total).toBe(all.body.total);
    expect(all.body.total).toBeGreaterThan(2);
    expect(response.body.items).toHaveLength(2);
    for (const cam of all.body.items) {
      expect(cam.intakeDuration050).toBeGreaterThanOrEqual(210);
      expect(cam.intakeDuration050).toBeLessThanOrEqual(226);
      expect(cam.supplierId).toBe(2);
    }
    const lsas = response.body.items.map((c: { lsa: number }) => c.lsa);
    expect(lsas).toEqual([...lsas].sort((a, b) => b - a));
  });

  it('filters by in stock and by search text', async () => {
    const inStock = await app().get('/api/cams').query({ inStock: 'true', pageSize: 200 }).set('Cookie', manager);
    expect(inStock.body.items.every((c: { stockOnHand: number }) => c.stockOnHand > 0)).toBe(true);
    const search = await app().get('/api/cams').query({ q: 'Hauler' }).set('Cookie', manager);
    expect(search.body.items.map((c: { sku: string }) => c.sku)).toEqual(['LV-208']);
  });

  it('answers 422 naming a bad query parameter', async () => {
    const response = await app().get('/api/cams').query({ sort: 'colour', pageSize: 5000 }).set('Cookie', manager);
    expect(response.status).toBe(422);
    expect(response.body.errors.map((e: { field: string }) => e.field).sort()).toEqual(['pageSize', 'sort']);
  });

  it('keeps costs from technicians', async () => {
    const list = await app().get('/api/cams').query({ pageSize: 5 }).set('Cookie', tech);
    expect(list.status).toBe(200);
    expect(list.body.items.length).toBeGreaterThan(0);
    for (const cam of list.body.items) expect(cam).not.toHaveProperty('costCents');
    const one = await app().get(`/api/cams/${DEMO.cams.towBoss198}`).set('Cookie', tech);
    expect(one.body).not.toHaveProperty('costCents');
    const exported = await app().get('/api/cams/export').set('Cookie', tech);
    expect(exported.text.split('\r\n')[0]).not.toContain('cost');
  });
});

describe('cams: only managers change anything', () => {
  it.each(['counter', 'tech'] as const)(
    'refuses %s with 403 on create, change and delete, leaving the cam as it was',
    async (role) => {
      const cookie = role === 'counter' ? counter : tech;
      const before = await Cam.findByPk(DEMO.cams.towBoss198);
      expect(
        (
          await app()
            .post('/api/cams')
            .set('Cookie', cookie)
            .send(camBody({ sku: `${PREFIX}-NO` }))
        ).status,
      ).toBe(403);
      expect(
        (
          await app()
            .patch(`/api/cams/${DEMO.cams.towBoss198}`)
            .set('Cookie', cookie)
            .send({ version: before!.version, priceCents: 1 })
        ).status,
      ).toBe(403);
      expect((await app().delete(`/api/cams/${DEMO.cams.towBoss198}`).set('Cookie', cookie)).status).toBe(403);
      const after = await Cam.findByPk(DEMO.cams.towBoss198);
      expect(after?.priceCents).toBe(before?.priceCents);
      expect(after?.version).toBe(before?.version);
      expect(await Cam.count({ where: { sku: `${PREFIX}-NO` } })).toBe(0);
    },
  );

  it('answers 401 to a signed-out caller', async () => {
    expect((await app().get('/api/cams')).status).toBe(401);
  });
});
