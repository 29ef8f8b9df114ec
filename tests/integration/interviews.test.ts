import { Op } from 'sequelize';
import request from 'supertest';
import { AuditEntry, Build, Customer } from '@/lib/db/models';
import { towingTruck } from '@/lib/builds/sample-trucks';
import { BuildProfileSchema } from '@/lib/schemas/build-profile';
import { signIn } from '../support/auth';
import { connectTestDatabase, disconnectTestDatabase } from '../support/database';
import { readRuntime } from '../support/runtime';
import { DEMO, MISSING_ID } from '../support/demo';

// The counter interview's API: customers and builds over HTTP against the real build and MariaDB.
// Every customer this file creates carries MARK in its name and is deleted afterwards (builds go with
// their customer), so the demo rows stay as they were.
const { appUrl } = readRuntime();
const MARK = `Interview Test ${process.pid}`;

// A stock 5.3 L towing truck, as the interview form sends it.
const truckProfile = towingTruck;

describe('customers and builds API (counter interview)', () => {
  let counter: string;
  let manager: string;
  let tech: string;

  beforeAll(async () => {
    connectTestDatabase();
    [counter, manager, tech] = await Promise.all([signIn('counter'), signIn('manager'), signIn('tech')]);
  });

  afterAll(async () => {
    const created = (await Customer.findAll({ where: { name: { [Op.startsWith]: MARK } }, attributes: ['id'] })).map(
      (c) => c.id,
    );
    if (created.length) {
      await Build.destroy({ where: { customerId: created } });
      await Customer.destroy({ where: { id: created } });
    }
    await disconnectTestDatabase();
  });

  const post = (url: string, cookie: string, body: unknown) =>
    request(appUrl)
      .post(url)
      .set('Cookie', cookie)
      .send(body as object);
  const patch = (url: string, cookie: string, body: unknown) =>
    request(appUrl)
      .patch(url)
      .set('Cookie', cookie)
      .send(body as object);

  it('creates a customer and a build in one request, reads both back, and writes audit rows', async () => {
    const created = await post('/api/builds', counter, {
      customer: { name: `${MARK} Walk-in`, phone: '555-0100', email: 'walk.in@example.com' },
      vehicleLabel: '2014 crew-cab pickup, 5.3 L',
      profile: truckProfile(),
    }).expect(201);
    expect(created.body).toMatchObject({
      vehicleLabel: '2014 crew-cab pickup, 5.3 L',
      customerName: `${MARK} Walk-in`,
      profileSchemaVersion: 2,
      version: 1,
      baselineCamId: null,
    });
    const id = created.body.id as number;

    const read = await request(appUrl).get(`/api/builds/${id}`).set('Cookie', tech).expect(200);
    expect(BuildProfileSchema.parse(read.body.profile)).toEqual(BuildProfileSchema.parse(truckProfile()));
    expect(read.body.profile.baselineCam.rockerRatio).toBe(1.7); // the schema's default, stored

    const row = await Build.findByPk(id);
    expect(row!.profileSchemaVersion).toBe(2);
    const customer = await request(appUrl)
      .get(`/api/customers/${read.body.customerId}`)
      .set('Cookie', tech)
      .expect(200);
    expect(customer.body).toMatchObject({ name: `${MARK} Walk-in`, phone: '555-0100', email: 'walk.in@example.com' });
    expect(customer.body.builds.map((b: { id: number }) => b.id)).toEqual([id]);

    const audit = await AuditEntry.findAll({
      where: {
        [Op.or]: [
          { entityType: 'build', entityId: String(id) },
          { entityType: 'customer', entityId: String(read.body.customerId) },
        ],
      },
    });
    expect(audit.map((a) => `${a.action} by ${a.actor}`).sort()).toEqual([
      'build.created by counter@lobewise.test',
      'customer.created by counter@lobewise.test',
    ]);
  });

  it('finds customers by name, e-mail or phone, paged', async () => {
    const made = await post('/api/customers', manager, {
      name: `${MARK} Searchable`,
      email: 'findme.interview@example.com',
      phone: '555-0987',
    }).expect(201);
    for (const q of ['Searchable', 'findme.interview', '0987']) {
      const found = await request(appUrl)
        .get(`/api/customers?q=${encodeURIComponent(q)}`)
        .set('Cookie', counter)
        .expect(200);
      expect(found.body.items.map((c: { id: number }) => c.id)).toContain(made.body.id);
    }
    const paged = await request(appUrl).get('/api/customers?pageSize=1&page=2').set('Cookie', counter).expect(200);
    expect(paged.body).toMatchObject({ page: 2, pageSize: 1 });
    expect(paged.body.items).toHaveLength(1);
    expect(paged.body.total).toBeGreaterThanOrEqual(4);
    // A % in the search is a literal, not a wildcard.
    const none = await request(appUrl).get('/api/customers?q=%25%25%25').set('Cookie', counter).expect(200);
    expect(none.body.items).toEqual([]);
  });

  it('adds a build for an existing customer, listed newest first and found by the customer’s phone', async () => {
    const customer = await post('/api/customers', counter, { name: `${MARK} Returning`, phone: '555-0444' }).expect(
      201,
    );
    const build = await post('/api/builds', counter, {
      customerId: customer.body.id,
      vehicleLabel: '2009 regular-cab, 4.8 L',
      profile: truckProfile(),
      baselineCamId: DEMO.cams.factory48,
    }).expect(201);
    expect(build.body.baselineCamId).toBe(1);
    const list = await request(appUrl).get('/api/builds?q=555-0444').set('Cookie', tech).expect(200);
    expect(list.body.items.map((b: { id: number }) => b.id)).toEqual([build.body.id]);
    const newest = await request(appUrl).get('/api/builds?pageSize=1').set('Cookie', tech).expect(200);
    expect(newest.body.items[0].id).toBe(build.body.id);
    expect(newest.body.items[0]).not.toHaveProperty('profile');
  });

  it('answers 422 naming the field for a bad profile, and saves nothing', async () => {
    const before = await Customer.count();
    const profile = truckProfile();
    profile.engine.boreIn = 46;
    const answer = await post('/api/builds', counter, {
      customer: { name: `${MARK} Typo` },
      vehicleLabel: 'Typo truck',
      profile,
    }).expect(422);
    expect(answer.body.errors).toEqual([{ field: 'profile.engine.boreIn', message: 'bore must be at most 4.6 in' }]);
    expect(await Customer.count()).toBe(before);
  });

  it('answers 422 for other bad input: no customer, unknown customer, unknown baseline cam, bad e-mail, unknown field, not JSON', async () => {
    const fields = async (body: unknown) =>
      (await post('/api/builds', counter, body).expect(422)).body.errors.map((e: { field: string }) => e.field);
    expect(await fields({ vehicleLabel: 'x', profile: truckProfile() })).toEqual(['customerId']);
    expect(await fields({ customerId: MISSING_ID, vehicleLabel: 'x', profile: truckProfile() })).toEqual([
      'customerId',
    ]);
    expect(
      await fields({
        customerId: DEMO.customers.whitlock,
        vehicleLabel: 'x',
        profile: truckProfile(),
        baselineCamId: MISSING_ID,
      }),
    ).toEqual(['baselineCamId']);
    expect(
      await fields({
        customer: { name: `${MARK} Bad mail`, email: 'not-an-address' },
        vehicleLabel: 'x',
        profile: truckProfile(),
      }),
    ).toEqual(['customer.email']);
    const automaticNoStall = truckProfile();
    delete automaticNoStall.drivetrain.stallRpm;
    expect(await fields({ customerId: DEMO.customers.whitlock, vehicleLabel: 'x', profile: automaticNoStall })).toEqual(
      ['profile.drivetrain.stallRpm'],
    );
    expect(
      await fields({
        customerId: DEMO.customers.whitlock,
        vehicleLabel: 'x',
        profile: { ...truckProfile(), turbo: true },
      }),
    ).toEqual(['profile.turbo']);
    const notJson = await request(appUrl)
      .post('/api/builds')
      .set('Cookie', counter)
      .set('Content-Type', 'application/json')
      .send('{nope');
    expect(notJson.status).toBe(400);
    expect((await post('/api/customers', counter, { name: '' }).expect(422)).body.errors[0].field).toBe('name');
  });

  it('changes a build with the version it read, and answers 409 to a stale version without overwriting', async () => {
    const created = await post('/api/builds', counter, {
      customer: { name: `${MARK} Versioned` },
      vehicleLabel: 'Before',
      profile: truckProfile(),
    }).expect(201);
    const id = created.body.id as number;
    const changedProfile = truckProfile();
    changedProfile.drivetrain.axleRatio = 3.73;
    const saved = await patch(`/api/builds/${id}`, counter, {
      version: 1,
      vehicleLabel: 'After',
      profile: changedProfile,
    }).expect(200);
    expect(saved.body).toMatchObject({ version: 2, vehicleLabel: 'After' });
    expect(saved.body.profile.drivetrain.axleRatio).toBe(3.73);

    const stale = await patch(`/api/builds/${id}`, manager, { version: 1, vehicleLabel: 'Lost write' }).expect(409);
    expect(stale.body.current).toMatchObject({ version: 2, vehicleLabel: 'After' });
    expect((await Build.findByPk(id))!.vehicleLabel).toBe('After');

    const bad = await patch(`/api/builds/${id}`, counter, {
      version: 2,
      profile: { ...changedProfile, engine: { ...changedProfile.engine, strokeIn: 'long' } },
    }).expect(422);
    expect(bad.body.errors.map((e: { field: string }) => e.field)).toEqual(['profile.engine.strokeIn']);
    expect(
      (await patch(`/api/builds/${id}`, counter, { vehicleLabel: 'No version' }).expect(422)).body.errors[0].field,
    ).toBe('version');
  });

  it('changes a customer with the version it read, and answers 409 to a stale one', async () => {
    const made = await post('/api/customers', counter, { name: `${MARK} Rename me` }).expect(201);
    const url = `/api/customers/${made.body.id}`;
    await patch(url, counter, { version: 1, name: `${MARK} Renamed`, phone: '555-0111' }).expect(200);
    const stale = await patch(url, manager, { version: 1, name: `${MARK} Stale` }).expect(409);
    expect(stale.body.current).toMatchObject({ name: `${MARK} Renamed`, version: 2 });
    expect((await Customer.findByPk(made.body.id))!.name).toBe(`${MARK} Renamed`);
  });

  it('lets technicians read but not write, and signed-out callers nothing', async () => {
    const body = { customer: { name: `${MARK} Refused` }, vehicleLabel: 'x', profile: truckProfile() };
    await post('/api/builds', tech, body).expect(403);
    await post('/api/customers', tech, { name: `${MARK} Refused` }).expect(403);
    await patch(`/api/builds/${DEMO.builds.whitlockTowingTruck}`, tech, { version: 1, vehicleLabel: 'x' }).expect(403);
    await patch(`/api/customers/${DEMO.customers.whitlock}`, tech, { version: 1, name: 'x' }).expect(403);
    await request(appUrl).post('/api/builds').send(body).expect(401);
    await request(appUrl).get('/api/builds').expect(401);
    await request(appUrl).get(`/api/customers/${DEMO.customers.whitlock}`).expect(401);
    await request(appUrl).get(`/api/builds/${DEMO.builds.whitlockTowingTruck}`).set('Cookie', tech).expect(200);
    expect(await Customer.count({ where: { name: `${MARK} Refused` } })).toBe(0);
  });

  it('serves the list and edit pages to counter staff, and keeps technicians off the edit page', async () => {
    const created = await post('/api/builds', counter, {
      customer: { name: `${MARK} Pages` },
      vehicleLabel: 'Page check van, 6.0 L',
      profile: truckProfile(),
    }).expect(201);
    const list = await request(appUrl).get('/interviews?q=Page%20check').set('Cookie', counter).expect(200);
    expect(list.text).toContain('Page check van, 6.0 L');
    expect(list.text).toContain(`/advisor?build=${created.body.id}`);
    const edit = await request(appUrl).get(`/interviews/${created.body.id}/edit`).set('Cookie', counter).expect(200);
    expect(edit.text).toContain('Edit build: Page check van, 6.0 L');
    const techEdit = await request(appUrl).get(`/interviews/${created.body.id}/edit`).set('Cookie', tech).redirects(0);
    expect(techEdit.status).toBeGreaterThanOrEqual(300);
    expect(techEdit.status).toBeLessThan(400);
    expect(techEdit.headers.location).toContain('/dashboard?denied=');
    const shortlist = await request(appUrl).get(`/advisor?build=${created.body.id}`).set('Cookie', tech).expect(200);
    expect(shortlist.text).toContain(`${MARK} Pages — Page check van, 6.0 L`);
  });

  it('ranks a new build through POST /api/advisor/rank', async () => {
    const created = await post('/api/builds', counter, {
      customer: { name: `${MARK} Ranked` },
      vehicleLabel: '2016 pickup, 5.3 L',
      profile: truckProfile(),
    }).expect(201);
    const stored = await request(appUrl).get(`/api/builds/${created.body.id}`).set('Cookie', counter).expect(200);
    const ranked = await post('/api/advisor/rank', counter, { build: stored.body.profile }).expect(200);
    expect(ranked.body.rankings.length).toBeGreaterThanOrEqual(10);
    expect(ranked.body.baseline.camName).toBe('Stock card as typed');
    // Road-legal emissions needed: a cam that is not certified scores below 100 on emissions.
    expect(ranked.body.rankings.some((r: { subscores: { emissions: number } }) => r.subscores.emissions < 100)).toBe(
      true,
    );
  });
});
