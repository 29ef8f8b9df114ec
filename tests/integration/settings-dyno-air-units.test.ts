import request from 'supertest';
import { AuditEntry, ShopSettings } from '@/lib/db/models';
import type { ShopSettingsRecord } from '@/lib/db/queries/settings';
import { signIn } from '../support/auth';
import { connectTestDatabase, disconnectTestDatabase } from '../support/database';
import { readRuntime } from '../support/runtime';

// The shop's dyno air units (issue 9, item 1): 'imperial' (°F and inHg) from the migration's default, 'metric'
// (°C and kPa) by a manager's choice; anything else is a 422 naming the field; a save that leaves it out keeps
// it. Only the screens change: POST /api/dyno-runs keeps taking °C and kPa. The stored value is put back.
const app = () => request(readRuntime().appUrl);
let manager: string;
let tech: string;
let original: ShopSettingsRecord;

// MariaDB hands JSON columns back as text.
const parsed = (v: unknown) => (typeof v === 'string' ? JSON.parse(v) : v) as Record<string, unknown>;
const settings = async () => (await app().get('/api/settings').set('Cookie', manager)).body as ShopSettingsRecord;

beforeAll(async () => {
  connectTestDatabase();
  [manager, tech] = await Promise.all([signIn('manager'), signIn('tech')]);
  original = await settings();
});
afterAll(async () => {
  await ShopSettings.update(
    { dynoAirUnits: original.dynoAirUnits, leadStaleDays: original.leadStaleDays },
    { where: { id: original.id } },
  );
  await disconnectTestDatabase();
});

describe('the dyno air units setting', () => {
  it('starts as °F and inHg (the migration’s default for the seeded shop)', () => {
    expect(original.dynoAirUnits).toBe('imperial');
  });

  it('lets a manager switch to °C and kPa and back, keeps it when a save leaves it out, and audits the change', async () => {
    const metric = await app()
      .patch('/api/settings')
      .set('Cookie', manager)
      .send({ version: original.version, dynoAirUnits: 'metric' });
    expect(metric.status).toBe(200);
    expect(metric.body).toMatchObject({ dynoAirUnits: 'metric', version: original.version + 1 });
    expect((await ShopSettings.findByPk(original.id))!.dynoAirUnits).toBe('metric');

    // A caller that predates the setting (no dynoAirUnits in the body) leaves it as it is.
    const days = original.leadStaleDays === 60 ? 59 : original.leadStaleDays + 1;
    const other = await app()
      .patch('/api/settings')
      .set('Cookie', manager)
      .send({ version: metric.body.version, leadStaleDays: days });
    expect(other.status).toBe(200);
    expect(other.body).toMatchObject({ leadStaleDays: days, dynoAirUnits: 'metric' });

    const back = await app()
      .patch('/api/settings')
      .set('Cookie', manager)
      .send({ version: other.body.version, dynoAirUnits: 'imperial', leadStaleDays: original.leadStaleDays });
    expect(back.status).toBe(200);
    expect(back.body).toMatchObject({ dynoAirUnits: 'imperial', leadStaleDays: original.leadStaleDays });
    const audits = await AuditEntry.findAll({
      where: { action: 'settings.updated', entityId: String(original.id) },
      order: [['id', 'DESC']],
      limit: 3,
    });
    expect(audits.map((a) => [parsed(a.before).dynoAirUnits, parsed(a.after).dynoAirUnits])).toEqual([
      ['metric', 'imperial'],
      ['metric', 'metric'],
      ['imperial', 'metric'],
    ]);
  });

  it('refuses units it does not know with a 422 naming the field, and changes nothing', async () => {
    const before = await settings();
    for (const dynoAirUnits of ['kelvin', '', 1, null]) {
      const answer = await app()
        .patch('/api/settings')
        .set('Cookie', manager)
        .send({ version: before.version, dynoAirUnits });
      expect(answer.status).toBe(422);
      expect(answer.body.errors).toEqual([
        { field: 'dynoAirUnits', message: 'dyno air units must be one of: imperial, metric' },
      ]);
    }
    expect(await settings()).toEqual(before);
  });

  it('is the manager’s to change: a technician may not', async () => {
    const answer = await app()
      .patch('/api/settings')
      .set('Cookie', tech)
      .send({ version: original.version, dynoAirUnits: 'metric' });
    expect(answer.status).toBe(403);
    expect((await settings()).dynoAirUnits).toBe('imperial');
  });
});
