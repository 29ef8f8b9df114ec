import fs from 'node:fs';
import request from 'supertest';
import { hashToken, randomToken } from '@/lib/auth/tokens';
import { createPasswordToken } from '@/lib/db/queries/password-tokens';
import { signInWith } from '../support/auth';
import { connectTestDatabase, disconnectTestDatabase } from '../support/database';
import { mailsTo, waitForMailsTo } from '../support/mail';
import { readRuntime } from '../support/runtime';
import { clearSignInAttempts, createThrowawayUser, removeThrowawayUsers } from '../support/staff';

// Issue 13, item 4: forgot-password must not reveal staff addresses by its timing, a password change
// spends every outstanding reset link, and reset-password checks the link before hashing.
const { appUrl, pids } = readRuntime();
const [mailFakePid, , appPid] = pids;
const usedEmails: string[] = [];

async function throwaway() {
  const person = await createThrowawayUser('counter');
  usedEmails.push(person.email);
  return person;
}

/** CPU time (user + system, in clock ticks) the app server has used so far: argon2 runs in its threads. */
function appCpuTicks(): number {
  const stat = fs.readFileSync(`/proc/${appPid}/stat`, 'utf8');
  const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
  return Number(fields[11]) + Number(fields[12]);
}

async function insertResetToken(userId: number): Promise<string> {
  const token = randomToken();
  await createPasswordToken({
    userId,
    tokenHash: hashToken(token),
    purpose: 'reset',
    expiresAt: new Date(Date.now() + 60 * 60 * 1000),
  });
  return token;
}

beforeAll(() => {
  connectTestDatabase();
});

afterAll(async () => {
  await removeThrowawayUsers(usedEmails);
  await clearSignInAttempts(usedEmails);
  await disconnectTestDatabase();
});

describe('POST /api/auth/forgot-password', () => {
  it('answers before any lookup or e-mail: a staff address answers at once even while the mail service hangs, and the link still arrives', async () => {
    const person = await throwaway();
    const stranger = `nobody-${Date.now()}@lobewise.test`;
    process.kill(mailFakePid, 'SIGSTOP');
    let staff: request.Response;
    let unknown: request.Response;
    try {
      // With the e-mail sent before the answer, the staff request would wait on the frozen mail service.
      staff = await request(appUrl)
        .post('/api/auth/forgot-password')
        .timeout({ response: 3000 })
        .send({ email: person.email });
      unknown = await request(appUrl)
        .post('/api/auth/forgot-password')
        .timeout({ response: 3000 })
        .send({ email: stranger });
    } finally {
      process.kill(mailFakePid, 'SIGCONT');
    }
    expect(staff.status).toBe(202);
    expect(unknown.status).toBe(202);
    expect(staff.text).toBe(unknown.text);
    const [mail] = await waitForMailsTo(person.email);
    expect(mail.text).toMatch(/\/reset-password\?token=[A-Za-z0-9_-]{43}/);
    expect(await mailsTo(stranger)).toEqual([]);
  });
});

describe('every password change spends outstanding reset links', () => {
  it('a link e-mailed before a change on the account page no longer works after it', async () => {
    const person = await throwaway();
    const cookie = await signInWith(person.email, person.password);
    const early = await insertResetToken(person.id);
    await request(appUrl)
      .post('/api/account/password')
      .set('Cookie', cookie)
      .send({ currentPassword: person.password, newPassword: 'changed-on-account-page' })
      .expect(200);

    const reuse = await request(appUrl)
      .post('/api/auth/reset-password')
      .send({ token: early, password: 'taken-over-by-link' })
      .expect(400);
    expect(reuse.body.errors).toEqual([{ field: 'token', message: expect.stringMatching(/already used/) }]);
    await signInWith(person.email, 'changed-on-account-page');
  });

  it('a reset spends the other outstanding links too', async () => {
    const person = await throwaway();
    const [first, second] = [await insertResetToken(person.id), await insertResetToken(person.id)];
    await request(appUrl)
      .post('/api/auth/reset-password')
      .send({ token: second, password: 'reset-by-second-link' })
      .expect(200);
    await request(appUrl)
      .post('/api/auth/reset-password')
      .send({ token: first, password: 'reset-by-first-link' })
      .expect(400);
    await signInWith(person.email, 'reset-by-second-link');
  });
});

describe('POST /api/auth/reset-password checks the link before hashing', () => {
  it('spends far less server CPU on a made-up link than on a real reset (which runs argon2)', async () => {
    const person = await throwaway();
    const madeUp = () => randomToken();
    // Warm both paths first so module loading and JIT do not count.
    await request(appUrl)
      .post('/api/auth/reset-password')
      .send({ token: madeUp(), password: 'warm-up-password-1' })
      .expect(400);
    await request(appUrl)
      .post('/api/auth/reset-password')
      .send({ token: await insertResetToken(person.id), password: 'warm-up-password-2' })
      .expect(200);

    const badRounds = 12;
    let start = appCpuTicks();
    for (let i = 0; i < badRounds; i++) {
      await request(appUrl)
        .post('/api/auth/reset-password')
        .send({ token: madeUp(), password: `made-up-link-password-${i}` })
        .expect(400);
    }
    const badPerRequest = (appCpuTicks() - start) / badRounds;

    const goodRounds = 4;
    const tokens: string[] = [];
    let goodTicks = 0;
    for (let i = 0; i < goodRounds; i++) {
      tokens.push(await insertResetToken(person.id));
      start = appCpuTicks();
      await request(appUrl)
        .post('/api/auth/reset-password')
        .send({ token: tokens[i], password: `real-link-password-${i}` })
        .expect(200);
      goodTicks += appCpuTicks() - start;
    }
    const goodPerRequest = goodTicks / goodRounds;

    // argon2id at 19 MiB, t = 2 costs tens of milliseconds of CPU; one indexed read costs a few.
    expect(goodPerRequest).toBeGreaterThan(0);
    expect(badPerRequest).toBeLessThan(goodPerRequest / 3);
  });
});
