import { Op, QueryTypes } from 'sequelize';
import request from 'supertest';
import { User } from '@/lib/db/models';
import { signInWith } from '../support/auth';
import { connectTestDatabase, disconnectTestDatabase } from '../support/database';
import { readRuntime } from '../support/runtime';
import { clearSignInAttempts, createThrowawayUser, removeThrowawayUsers, type Throwaway } from '../support/staff';

// Issue 13, item 9: two managers demoting each other at the same moment must not both succeed, or
// the shop is left without a manager. The test holds a table lock on audit_log, which every role
// change writes just before it commits, so both requests are in flight together, deterministically.
const { appUrl } = readRuntime();
const sequelize = connectTestDatabase();
const usedEmails: string[] = [];

async function manager(): Promise<Throwaway> {
  const person = await createThrowawayUser('manager');
  usedEmails.push(person.email);
  return person;
}

/** App statements running (blocked) in the test database right now, other than this query itself. */
async function statementsInFlight(): Promise<number> {
  const [row] = await sequelize.query<{ n: number }>(
    "SELECT COUNT(*) AS n FROM information_schema.PROCESSLIST WHERE COMMAND = 'Query' AND ID <> CONNECTION_ID() AND DB = DATABASE()",
    { type: QueryTypes.SELECT },
  );
  return Number(row.n);
}

async function waitFor(check: () => Promise<boolean>, timeoutMs: number): Promise<boolean> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    if (await check()) return true;
    await new Promise((resolve) => setTimeout(resolve, 50));
  }
  return false;
}

afterAll(async () => {
  await removeThrowawayUsers(usedEmails);
  await clearSignInAttempts(usedEmails);
  await disconnectTestDatabase();
});

describe('PATCH /api/users/[id]: the last active manager', () => {
  it('lets only one of two managers demoting each other at once succeed', async () => {
    const [a, b] = [await manager(), await manager()];
    const [cookieA, cookieB] = [await signInWith(a.email, a.password), await signInWith(b.email, b.password)];
    // Only these two are active managers while the test runs; the others are switched back on after.
    const others = (
      await User.findAll({ where: { role: 'manager', active: true, id: { [Op.notIn]: [a.id, b.id] } } })
    ).map((u) => u.id);
    if (others.length) await sequelize.query('UPDATE users SET active = 0 WHERE id IN (?)', { replacements: [others] });
    const hold = await sequelize.transaction();
    let held = false;
    try {
      await sequelize.query('LOCK TABLES audit_log WRITE', { transaction: hold });
      held = true;
      const [rowA, rowB] = [await User.findByPk(a.id), await User.findByPk(b.id)];
      const aDemotesB = request(appUrl)
        .patch(`/api/users/${b.id}`)
        .set('Cookie', cookieA)
        .send({ version: rowB!.version, role: 'counter' })
        .then((r) => r);
      const bDemotesA = request(appUrl)
        .patch(`/api/users/${a.id}`)
        .set('Cookie', cookieB)
        .send({ version: rowA!.version, role: 'counter' })
        .then((r) => r);
      // Both requests must be inside the database (waiting on a lock) before either may finish.
      expect(await waitFor(async () => (await statementsInFlight()) >= 2, 15_000)).toBe(true);
      await sequelize.query('UNLOCK TABLES', { transaction: hold });
      held = false;
      const answers = await Promise.all([aDemotesB, bDemotesA]);

      const statuses = answers.map((r) => r.status).sort();
      expect(statuses.filter((s) => s === 200)).toHaveLength(1);
      const refused = answers.find((r) => r.status !== 200)!;
      // Refused in the transaction (422 naming role), or by the guard when its author was demoted first (403).
      expect([403, 422]).toContain(refused.status);
      if (refused.status === 422)
        expect(refused.body.errors).toEqual([{ field: 'role', message: 'the shop needs at least one active manager' }]);
      const stillManagers = await User.count({ where: { id: [a.id, b.id], role: 'manager', active: true } });
      expect(stillManagers).toBe(1);
    } finally {
      if (held) await sequelize.query('UNLOCK TABLES', { transaction: hold });
      await hold.commit();
      if (others.length)
        await sequelize.query('UPDATE users SET active = 1 WHERE id IN (?)', { replacements: [others] });
    }
  });

  it('still lets a manager demote another while a third remains', async () => {
    const [a, b] = [await manager(), await manager()];
    const cookieA = await signInWith(a.email, a.password);
    const rowB = await User.findByPk(b.id);
    const answer = await request(appUrl)
      .patch(`/api/users/${b.id}`)
      .set('Cookie', cookieA)
      .send({ version: rowB!.version, role: 'tech' })
      .expect(200);
    expect(answer.body.user).toMatchObject({ id: b.id, role: 'tech' });
  });
});
