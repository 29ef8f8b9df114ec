import argon2 from 'argon2';
import { OptimisticLockError } from 'sequelize';
import { QueryTypes } from 'sequelize';
import { Cam, Customer, db, User } from '@/lib/db/models';
import { connectTestDatabase, disconnectTestDatabase } from '../support/database';

describe('Sequelize models against the real MariaDB', () => {
  beforeAll(() => connectTestDatabase());
  afterAll(() => disconnectTestDatabase());

  it('writes and reads back a row, bumping its version on update', async () => {
    const created = await Customer.create({
      name: 'Round Trip Tester',
      email: 'round.trip@example.com',
      phone: null,
      notes: 'x',
    });
    const loaded = await Customer.findByPk(created.id);
    expect(loaded?.name).toBe('Round Trip Tester');
    expect(loaded?.version).toBe(1);
    loaded!.notes = 'updated';
    await loaded!.save();
    const reloaded = await Customer.findByPk(created.id);
    expect(reloaded?.notes).toBe('updated');
    expect(reloaded?.version).toBe(2);
    await reloaded!.destroy();
    expect(await Customer.findByPk(created.id)).toBeNull();
  });

  it('maps every cam-card attribute to its own column (checked against the raw row)', async () => {
    const values = {
      sku: 'RT-MAP-1',
      name: 'Column mapping check',
      intakeDuration050: 211,
      exhaustDuration050: 217,
      intakeAdvertised: 263,
      exhaustAdvertised: 269,
      intakeLiftIn: 0.561,
      exhaustLiftIn: 0.557,
      lsa: 112.5,
      intakeCenterline: 108.5,
      rockerRatio: 1.72,
      springMaxLiftIn: 0.6,
      priceCents: 41900,
      archivedAt: null,
      notes: null,
      supplierId: null,
      baselineForLiters: null,
    };
    const cam = await Cam.create(values);
    try {
      const [row] = await db().query<Record<string, number>>('SELECT * FROM cams WHERE id = ?', {
        replacements: [cam.id],
        type: QueryTypes.SELECT,
      });
      expect(row).toMatchObject({
        intake_duration_050: 211,
        exhaust_duration_050: 217,
        intake_advertised: 263,
        exhaust_advertised: 269,
        intake_lift_in: 0.561,
        exhaust_lift_in: 0.557,
        lsa: 112.5,
        intake_centerline: 108.5,
        rocker_ratio: 1.72,
        spring_max_lift_in: 0.6,
        price_cents: 41900,
      });
      const loaded = await Cam.findByPk(cam.id);
      expect(loaded?.get({ plain: true })).toMatchObject(values);
    } finally {
      await cam.destroy();
    }
  });

  it('refuses a save from a stale copy (optimistic locking)', async () => {
    const created = await Customer.create({ name: 'Stale Copy', email: null, phone: null, notes: null });
    const first = await Customer.findByPk(created.id);
    const second = await Customer.findByPk(created.id);
    first!.notes = 'first writer';
    await first!.save();
    second!.notes = 'second writer';
    await expect(second!.save()).rejects.toBeInstanceOf(OptimisticLockError);
    expect((await Customer.findByPk(created.id))?.notes).toBe('first writer');
    await created.destroy();
  });

  it('has the seeded demo staff with argon2id hashes, not plain text', async () => {
    const users = await User.findAll({ order: [['email', 'ASC']] });
    expect(users.map((u) => [u.email, u.role])).toEqual([
      ['counter@lobewise.test', 'counter'],
      ['manager@lobewise.test', 'manager'],
      ['tech@lobewise.test', 'tech'],
    ]);
    for (const user of users) {
      expect(user.passwordHash).toMatch(/^\$argon2id\$/);
      expect(user.passwordHash).not.toContain('lobewise-demo');
      await expect(argon2.verify(user.passwordHash!, 'lobewise-demo')).resolves.toBe(true);
      await expect(argon2.verify(user.passwordHash!, 'wrong-password')).resolves.toBe(false);
    }
  });
});
