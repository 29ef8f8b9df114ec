import argon2 from 'argon2';
import { OptimisticLockError } from 'sequelize';
import { Customer, User } from '@/lib/db/models';
import { connectTestDatabase, disconnectTestDatabase } from '../support/database';

describe('Sequelize models against the real MariaDB', () => {
  beforeAll(() => connectTestDatabase());
  afterAll(() => disconnectTestDatabase());

  it('writes and reads back a row, bumping its version on update', async () => {
    const created = await Customer.create({ name: 'Round Trip Tester', email: 'round.trip@example.com', phone: null, notes: 'x' });
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
