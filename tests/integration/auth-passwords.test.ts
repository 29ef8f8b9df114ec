import request from 'supertest';
import { AuditEntry, User } from '@/lib/db/models';
import { signIn, signInWith } from '../support/auth';
import { connectTestDatabase, disconnectTestDatabase } from '../support/database';
import { mailsTo, waitForMailsTo, type Mail } from '../support/mail';
import { readRuntime } from '../support/runtime';
import { clearSignInAttempts, createThrowawayUser, removeThrowawayUsers, type Throwaway } from '../support/staff';

const { appUrl } = readRuntime();
const usedEmails: string[] = [];

/** Asks for a reset and returns the token from the link in the newest e-mail to that person. */
async function requestReset(person: Throwaway): Promise<{ token: string; link: string; mail: Mail }> {
  const before = (await mailsTo(person.email)).length;
  await request(appUrl).post('/api/auth/forgot-password').send({ email: person.email }).expect(202);
  // The link is sent after the answer (so timing cannot tell staff addresses apart): wait for it.
  const [mail] = await waitForMailsTo(person.email, before + 1);
  expect(mail).toBeDefined();
  const link = /https?:\/\/\S+\/reset-password\?token=[A-Za-z0-9_-]+/.exec(mail.text)?.[0];
  expect(link).toBeDefined();
  return { token: new URL(link!).searchParams.get('token')!, link: link!, mail };
}

async function throwaway(role: 'manager' | 'counter' | 'tech' = 'counter') {
  const person = await createThrowawayUser(role);
  usedEmails.push(person.email);
  return person;
}

beforeAll(() => {
  connectTestDatabase();
});

afterAll(async () => {
  await removeThrowawayUsers(usedEmails);
  await clearSignInAttempts(usedEmails);
  await disconnectTestDatabase();
});

describe('forgot and reset password', () => {
  it('e-mails the right person a working link; the new password works and the old one does not', async () => {
    const person = await throwaway();
    const { link, mail, token } = await requestReset(person);
    expect(mail.to).toEqual([person.email]);
    expect(mail.subject).toMatch(/reset/i);
    expect(mail.html).toContain(link.replace(/&/g, '&amp;'));
    expect(link.startsWith(appUrl)).toBe(true);

    const page = await request(appUrl)
      .get(new URL(link).pathname + new URL(link).search)
      .expect(200);
    expect(page.text).toContain('Choose a new password');

    const response = await request(appUrl)
      .post('/api/auth/reset-password')
      .send({ token, password: 'a-brand-new-password' })
      .expect(200);
    expect(response.body.email).toBe(person.email);
    await signInWith(person.email, 'a-brand-new-password');
    await request(appUrl)
      .post('/api/auth/sign-in')
      .send({ email: person.email, password: person.password })
      .expect(401);
    expect(
      await AuditEntry.findOne({ where: { action: 'auth.password-reset', entityId: String(person.id) } }),
    ).not.toBeNull();
  });

  it('stores only a hash of the token', async () => {
    const person = await throwaway();
    const { token } = await requestReset(person);
    const [rows] = await connectTestDatabase().query('SELECT token_hash FROM password_reset_tokens WHERE user_id = ?', {
      replacements: [person.id],
    });
    const hashes = (rows as { token_hash: string }[]).map((r) => r.token_hash);
    expect(hashes).toHaveLength(1);
    expect(hashes[0]).toMatch(/^[0-9a-f]{64}$/);
    expect(hashes).not.toContain(token);
  });

  it('refuses a link used once already', async () => {
    const person = await throwaway();
    const { token } = await requestReset(person);
    await request(appUrl).post('/api/auth/reset-password').send({ token, password: 'first-new-password' }).expect(200);
    const again = await request(appUrl)
      .post('/api/auth/reset-password')
      .send({ token, password: 'second-new-password' })
      .expect(400);
    expect(again.body.errors).toEqual([{ field: 'token', message: expect.stringMatching(/already used/) }]);
    await signInWith(person.email, 'first-new-password');
  });

  it('refuses an expired link', async () => {
    const person = await throwaway();
    const { token } = await requestReset(person);
    await connectTestDatabase().query(
      'UPDATE password_reset_tokens SET expires_at = NOW() - INTERVAL 1 MINUTE WHERE user_id = ?',
      { replacements: [person.id] },
    );
    const response = await request(appUrl)
      .post('/api/auth/reset-password')
      .send({ token, password: 'too-late-password' })
      .expect(400);
    expect(response.body.errors[0]).toEqual({ field: 'token', message: expect.stringMatching(/expired/) });
    await signInWith(person.email, person.password);
  });

  it('refuses a made-up token and names the fields of bad input', async () => {
    const madeUp = 'A'.repeat(43);
    const response = await request(appUrl)
      .post('/api/auth/reset-password')
      .send({ token: madeUp, password: 'long-enough-password' })
      .expect(400);
    expect(response.body.errors[0].field).toBe('token');
    const bad = await request(appUrl)
      .post('/api/auth/reset-password')
      .send({ token: 'short', password: 'short' })
      .expect(422);
    expect((bad.body.errors as { field: string }[]).map((e) => e.field).sort()).toEqual(['password', 'token']);
  });

  it('ends the sessions the account had before the reset', async () => {
    const person = await throwaway();
    const cookie = await signInWith(person.email, person.password);
    const { token } = await requestReset(person);
    await request(appUrl)
      .post('/api/auth/reset-password')
      .send({ token, password: 'after-reset-password' })
      .expect(200);
    await request(appUrl).get('/api/auth/me').set('Cookie', cookie).expect(401);
  });

  it('answers an unknown address the same way and sends nothing', async () => {
    const email = `no-such-person-${Date.now()}@lobewise.test`;
    const known = await throwaway();
    const a = await request(appUrl).post('/api/auth/forgot-password').send({ email }).expect(202);
    const b = await request(appUrl).post('/api/auth/forgot-password').send({ email: known.email }).expect(202);
    expect(a.body).toEqual(b.body);
    // The known person's mail was queued after the unknown request's work: once it is in, that is done.
    expect(await waitForMailsTo(known.email)).toHaveLength(1);
    expect(await mailsTo(email)).toEqual([]);
  });
});

describe('changing one’s own password on the account page', () => {
  it('checks the current password, then ends the other sessions and keeps this one', async () => {
    const person = await throwaway('tech');
    const here = await signInWith(person.email, person.password);
    const elsewhere = await signInWith(person.email, person.password);

    const wrong = await request(appUrl)
      .post('/api/account/password')
      .set('Cookie', here)
      .send({ currentPassword: 'not-it', newPassword: 'a-changed-password' })
      .expect(422);
    expect(wrong.body.errors).toEqual([{ field: 'currentPassword', message: 'is not your current password' }]);
    const short = await request(appUrl)
      .post('/api/account/password')
      .set('Cookie', here)
      .send({ currentPassword: person.password, newPassword: 'short' })
      .expect(422);
    expect(short.body.errors[0]).toEqual({ field: 'newPassword', message: 'at least 12 characters' });

    const ok = await request(appUrl)
      .post('/api/account/password')
      .set('Cookie', here)
      .send({ currentPassword: person.password, newPassword: 'a-changed-password' })
      .expect(200);
    expect(ok.body.otherSessionsEnded).toBe(1);
    await request(appUrl).get('/api/auth/me').set('Cookie', here).expect(200);
    await request(appUrl).get('/api/auth/me').set('Cookie', elsewhere).expect(401);
    await signInWith(person.email, 'a-changed-password');
    const row = await User.findByPk(person.id);
    expect(row!.passwordHash).toMatch(/^\$argon2id\$/);
  });

  it('is for signed-in staff only', async () => {
    await request(appUrl)
      .post('/api/account/password')
      .send({ currentPassword: 'x', newPassword: 'a-changed-password' })
      .expect(401);
    await request(appUrl)
      .post('/api/account/password')
      .set('Cookie', await signIn('counter'))
      .set('Origin', 'http://elsewhere.example')
      .send({})
      .expect(403);
  });
});
