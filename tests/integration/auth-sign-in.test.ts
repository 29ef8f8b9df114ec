import crypto from 'node:crypto';
import argon2 from 'argon2';
import request from 'supertest';
import { AuditEntry, User } from '@/lib/db/models';
import { DEMO_EMAILS, DEMO_PASSWORD, sessionCookieFrom, signIn, signInWith } from '../support/auth';
import { connectTestDatabase, disconnectTestDatabase } from '../support/database';
import { waitForMailsTo } from '../support/mail';
import { clearRateLimits, expireRateLimits } from '../support/rate-limits';
import { readRuntime } from '../support/runtime';
import { clearSignInAttempts, createThrowawayUser, removeThrowawayUsers, testAddress } from '../support/staff';

const { appUrl } = readRuntime();
const WRONG_PAIR = 'The e-mail or the password is wrong.';
const usedEmails: string[] = [];
const usedAddresses: string[] = [];

function address() {
  const ip = testAddress();
  usedAddresses.push(ip);
  return ip;
}

function attempt(email: string, password: string, ip = address()) {
  usedEmails.push(email);
  return request(appUrl).post('/api/auth/sign-in').set('X-Forwarded-For', ip).send({ email, password });
}

async function latestAudit(action: string, where: Record<string, unknown> = {}) {
  return AuditEntry.findOne({ where: { action, ...where }, order: [['id', 'DESC']] });
}

beforeAll(() => {
  connectTestDatabase();
});

afterAll(async () => {
  await removeThrowawayUsers();
  await clearSignInAttempts(usedEmails, usedAddresses);
  await disconnectTestDatabase();
});

describe('POST /api/auth/sign-in', () => {
  it.each(['manager', 'counter', 'tech'] as const)('signs in the demo %s and answers with the role', async (role) => {
    const response = await request(appUrl)
      .post('/api/auth/sign-in')
      .send({ email: DEMO_EMAILS[role], password: DEMO_PASSWORD })
      .expect(200);
    expect(response.body.user).toMatchObject({ email: DEMO_EMAILS[role], role });
    const me = await request(appUrl)
      .get('/api/auth/me')
      .set('Cookie', sessionCookieFrom(response.headers['set-cookie']))
      .expect(200);
    expect(me.body.user).toMatchObject({ email: DEMO_EMAILS[role], role });
  });

  it('treats the e-mail without regard to case or surrounding spaces', async () => {
    await request(appUrl)
      .post('/api/auth/sign-in')
      .send({ email: '  Counter@Lobewise.TEST ', password: DEMO_PASSWORD })
      .expect(200);
  });

  it('sets an HttpOnly, SameSite=Lax session cookie for the whole site, Secure only over https', async () => {
    const plain = await request(appUrl)
      .post('/api/auth/sign-in')
      .send({ email: DEMO_EMAILS.tech, password: DEMO_PASSWORD })
      .expect(200);
    const cookie = ([] as string[]).concat(plain.headers['set-cookie']).find((c) => c.startsWith('lobewise_session='))!;
    expect(cookie).toMatch(/;\s*HttpOnly/i);
    expect(cookie).toMatch(/;\s*SameSite=Lax/i);
    expect(cookie).toMatch(/;\s*Path=\//i);
    expect(cookie).not.toMatch(/;\s*Secure/i);

    const overHttps = await request(appUrl)
      .post('/api/auth/sign-in')
      .set('X-Forwarded-Proto', 'https')
      .send({ email: DEMO_EMAILS.tech, password: DEMO_PASSWORD })
      .expect(200);
    const secureCookie = ([] as string[])
      .concat(overHttps.headers['set-cookie'])
      .find((c) => c.startsWith('lobewise_session='))!;
    expect(secureCookie).toMatch(/;\s*Secure/i);
  });

  it('answers a wrong password and an unknown e-mail with the same 401 and message, and audits both', async () => {
    const wrongPassword = await attempt(DEMO_EMAILS.manager, 'not-the-password').expect(401);
    const unknownEmail = await attempt('nobody-here@lobewise.test', DEMO_PASSWORD).expect(401);
    expect(wrongPassword.body).toEqual({ message: WRONG_PAIR });
    expect(unknownEmail.body).toEqual(wrongPassword.body);
    expect(wrongPassword.headers['set-cookie']).toBeUndefined();
    const audit = await latestAudit('auth.sign-in-failed', { actor: 'nobody-here@lobewise.test' });
    expect(audit).not.toBeNull();
    expect(audit!.userId).toBeNull();
    const auditKnown = await latestAudit('auth.sign-in-failed', { actor: DEMO_EMAILS.manager });
    expect(auditKnown?.entityType).toBe('user');
  });

  it('names the field and the reason for bad input, and refuses a body that is not JSON', async () => {
    const response = await request(appUrl)
      .post('/api/auth/sign-in')
      .send({ email: 'not-an-address', password: '' })
      .expect(422);
    const fields = (response.body.errors as { field: string; message: string }[]).map((e) => e.field).sort();
    expect(fields).toEqual(['email', 'password']);
    const extra = await request(appUrl)
      .post('/api/auth/sign-in')
      .send({ email: DEMO_EMAILS.tech, password: 'x', admin: true })
      .expect(422);
    expect(extra.body.errors).toEqual(expect.arrayContaining([expect.objectContaining({ field: 'admin' })]));
    await request(appUrl)
      .post('/api/auth/sign-in')
      .set('Content-Type', 'application/json')
      .send('{"email":')
      .expect(400);
  });

  it('refuses a sign-in posted from another site', async () => {
    const response = await request(appUrl)
      .post('/api/auth/sign-in')
      .set('Origin', 'http://elsewhere.example')
      .send({ email: DEMO_EMAILS.tech, password: DEMO_PASSWORD })
      .expect(403);
    expect(response.headers['set-cookie']).toBeUndefined();
    await request(appUrl)
      .post('/api/auth/sign-in')
      .set('Origin', appUrl)
      .send({ email: DEMO_EMAILS.tech, password: DEMO_PASSWORD })
      .expect(200);
  });

  it('audits a successful sign-in', async () => {
    const before = await AuditEntry.max<number, AuditEntry>('id');
    await signIn('counter');
    const row = await latestAudit('auth.signed-in', { actor: DEMO_EMAILS.counter });
    expect(row!.id).toBeGreaterThan(before ?? 0);
  });
});

describe('the session cookie', () => {
  it('stops working when tampered with, and a garbage cookie reads as signed out', async () => {
    const cookie = await signIn('manager');
    const [name, value] = cookie.split('=');
    const flipped = value.slice(0, 30) + (value[30] === 'a' ? 'b' : 'a') + value.slice(31);
    await request(appUrl).get('/api/auth/me').set('Cookie', `${name}=${flipped}`).expect(401);
    await request(appUrl)
      .get('/api/auth/me')
      .set('Cookie', `${name}=${value.slice(0, -4)}`)
      .expect(401);
    await request(appUrl).get('/api/auth/me').set('Cookie', `${name}=hello`).expect(401);
    await request(appUrl).get('/api/users').set('Cookie', `${name}=Fe26.2**x*y*z`).expect(401);
    await request(appUrl).get('/api/auth/me').set('Cookie', cookie).expect(200);
  });

  it('ends at sign-out, for that browser only, and the sign-out is audited', async () => {
    const first = await signIn('tech');
    const second = await signIn('tech');
    const out = await request(appUrl).post('/api/auth/sign-out').set('Cookie', first).expect(200);
    expect(
      ([] as string[]).concat(out.headers['set-cookie'] ?? []).some((c) => /^lobewise_session=;|Max-Age=0/i.test(c)),
    ).toBe(true);
    await request(appUrl).get('/api/auth/me').set('Cookie', first).expect(401);
    await request(appUrl).get('/api/auth/me').set('Cookie', second).expect(200);
    expect(await latestAudit('auth.signed-out', { actor: DEMO_EMAILS.tech })).not.toBeNull();
  });

  it('refuses a cross-site sign-out', async () => {
    const cookie = await signIn('tech');
    await request(appUrl)
      .post('/api/auth/sign-out')
      .set('Cookie', cookie)
      .set('Origin', 'https://elsewhere.example')
      .expect(403);
    await request(appUrl)
      .post('/api/auth/sign-out')
      .set('Cookie', cookie)
      .set('Sec-Fetch-Site', 'cross-site')
      .expect(403);
    await request(appUrl).get('/api/auth/me').set('Cookie', cookie).expect(200);
  });
});

describe('accounts that change while signed in', () => {
  it('a deactivated account stops at once: its session answers 401 and it cannot sign in again', async () => {
    const person = await createThrowawayUser('counter');
    usedEmails.push(person.email);
    const cookie = await signInWith(person.email, person.password);
    await request(appUrl).get('/api/auth/me').set('Cookie', cookie).expect(200);

    const manager = await signIn('manager');
    const row = await User.findByPk(person.id);
    await request(appUrl)
      .patch(`/api/users/${person.id}`)
      .set('Cookie', manager)
      .send({ version: row!.version, active: false })
      .expect(200);

    await request(appUrl).get('/api/auth/me').set('Cookie', cookie).expect(401);
    const again = await attempt(person.email, person.password).expect(401);
    expect(again.body.message).toBe(WRONG_PAIR);
  });

  it('a role change counts on the next request, without signing in again', async () => {
    const person = await createThrowawayUser('tech');
    usedEmails.push(person.email);
    const cookie = await signInWith(person.email, person.password);
    await request(appUrl).get('/api/users').set('Cookie', cookie).expect(403);

    const manager = await signIn('manager');
    const row = await User.findByPk(person.id);
    await request(appUrl)
      .patch(`/api/users/${person.id}`)
      .set('Cookie', manager)
      .send({ version: row!.version, role: 'manager' })
      .expect(200);
    await request(appUrl).get('/api/users').set('Cookie', cookie).expect(200);
    const me = await request(appUrl).get('/api/auth/me').set('Cookie', cookie).expect(200);
    expect(me.body.user.role).toBe('manager');
    // leave the shop with only the demo manager as a manager
    const now = await User.findByPk(person.id);
    await request(appUrl)
      .patch(`/api/users/${person.id}`)
      .set('Cookie', manager)
      .send({ version: now!.version, active: false })
      .expect(200);
  });

  it('rehashes a password stored with weaker argon2 settings at the next sign-in', async () => {
    const password = 'an-older-password-hash';
    const weak = await argon2.hash(password, { type: argon2.argon2id, memoryCost: 4096, timeCost: 1, parallelism: 1 });
    const person = await createThrowawayUser('tech', { passwordHash: weak, password });
    usedEmails.push(person.email);
    await signInWith(person.email, password);
    const after = await User.findByPk(person.id);
    expect(after!.passwordHash).not.toBe(weak);
    expect(after!.passwordHash).toMatch(/^\$argon2id\$v=19\$/);
    const params = Object.fromEntries(
      after!
        .passwordHash!.split('$')[3]
        .split(',')
        .map((kv) => kv.split('=')),
    );
    expect(params).toEqual({ m: '19456', t: '2', p: '1' });
    expect(await argon2.verify(after!.passwordHash!, password)).toBe(true);
    await signInWith(person.email, password);
  });
});

describe('sign-in throttling (rate-limiter-flexible counters in MariaDB)', () => {
  const accountKey = (email: string) => crypto.createHash('sha256').update(email.toLowerCase()).digest('hex');
  const deviceCookieFrom = (setCookie: string[] | string | undefined) =>
    ([] as string[])
      .concat(setCookie ?? [])
      .find((c) => c.startsWith('lobewise_device_'))!
      .split(';')[0];

  afterEach(async () => {
    await clearRateLimits('signin-');
  });

  it('answers 429 with Retry-After after 10 failures for one account from an unknown browser, even with the right password', async () => {
    const person = await createThrowawayUser('counter');
    for (let i = 0; i < 10; i += 1) {
      const response = await attempt(person.email, `wrong-${i}`);
      expect(response.status).toBe(401);
    }
    const blocked = await attempt(person.email, person.password).expect(429);
    const retryAfter = Number(blocked.headers['retry-after']);
    expect(retryAfter).toBeGreaterThan(0);
    expect(retryAfter).toBeLessThanOrEqual(15 * 60);
    expect(blocked.body.message).toMatch(/too many/i);
    expect(blocked.headers['set-cookie']).toBeUndefined();
    // another account from the same address is not affected by this account's pause
    await request(appUrl)
      .post('/api/auth/sign-in')
      .send({ email: DEMO_EMAILS.tech, password: DEMO_PASSWORD })
      .expect(200);
  });

  it('lets the owner in from a browser that signed in before, and e-mails the owner when the pause starts', async () => {
    const person = await createThrowawayUser('tech');
    const first = await attempt(person.email, person.password).expect(200);
    const device = deviceCookieFrom(first.headers['set-cookie']);
    expect(([] as string[]).concat(first.headers['set-cookie']).find((c) => c.startsWith('lobewise_device_'))).toMatch(
      /HttpOnly/i,
    );
    for (let i = 0; i < 10; i += 1) await attempt(person.email, `guess-${i}`).expect(401);
    await attempt(person.email, person.password).expect(429);
    const notice = await waitForMailsTo(person.email);
    expect(notice[0].subject).toMatch(/paused/i);
    expect(notice[0].text).toMatch(/15 minutes/);
    // the owner's own browser: the right password still works, the pause stays for everyone else
    await request(appUrl)
      .post('/api/auth/sign-in')
      .set('Cookie', device)
      .send({ email: person.email, password: person.password })
      .expect(200);
    await attempt(person.email, person.password).expect(429);
    // a device cookie for another account counts for nothing here
    const other = await createThrowawayUser('tech');
    const otherDevice = deviceCookieFrom(
      (await attempt(other.email, other.password).expect(200)).headers['set-cookie'],
    );
    await request(appUrl)
      .post('/api/auth/sign-in')
      .set('Cookie', otherDevice.replace(/^lobewise_device_[^=]+/, device.split('=')[0]))
      .send({ email: person.email, password: person.password })
      .expect(429);
  });

  it('lifts the pause once the owner sets a new password from an e-mailed link', async () => {
    const person = await createThrowawayUser('counter');
    for (let i = 0; i < 10; i += 1) await attempt(person.email, `guess-${i}`).expect(401);
    await attempt(person.email, person.password).expect(429);
    await request(appUrl).post('/api/auth/forgot-password').send({ email: person.email }).expect(202);
    const link = (await waitForMailsTo(person.email, 2))
      .map((m) => /\/reset-password\?token=([A-Za-z0-9_-]{43})/.exec(m.text))
      .find(Boolean)!;
    const fresh = `a-fresh-password-${crypto.randomBytes(4).toString('hex')}`;
    await request(appUrl).post('/api/auth/reset-password').send({ token: link[1], password: fresh }).expect(200);
    await attempt(person.email, fresh).expect(200);
  });

  it('does not lock a colleague out because ten colleagues at the same shop address mistyped', async () => {
    // One shop, one public address: no forwarded header, every attempt from the same socket address.
    const fromTheShop = (email: string, password: string) =>
      request(appUrl).post('/api/auth/sign-in').send({ email, password });
    for (let i = 0; i < 10; i += 1) {
      const colleague = await createThrowawayUser('counter');
      usedEmails.push(colleague.email);
      await fromTheShop(colleague.email, 'a-typo-at-the-counter').expect(401);
      await fromTheShop(colleague.email, 'another-typo-at-the-counter').expect(401);
    }
    const colleague = await createThrowawayUser('counter');
    await fromTheShop(colleague.email, colleague.password).expect(200);
  });

  it('checks at most 10 of 15 concurrent wrong guesses for one account', async () => {
    const person = await createThrowawayUser('counter');
    const answers = await Promise.all(Array.from({ length: 15 }, (_, i) => attempt(person.email, `concurrent-${i}`)));
    const statuses = answers.map((r) => r.status).sort();
    expect(statuses.filter((s) => s === 401)).toHaveLength(10);
    expect(statuses.filter((s) => s === 429)).toHaveLength(5);
    const audited = await AuditEntry.count({ where: { action: 'auth.sign-in-failed', actor: person.email } });
    expect(audited).toBe(10);
  });

  it('pauses twice as long the second time, and lifts each pause when it ends', async () => {
    const person = await createThrowawayUser('tech');
    for (let i = 0; i < 10; i += 1) await attempt(person.email, 'nope-nope').expect(401);
    expect(Number((await attempt(person.email, person.password).expect(429)).headers['retry-after'])).toBe(15 * 60);
    await expireRateLimits(`signin-account:${accountKey(person.email)}`);
    for (let i = 0; i < 10; i += 1) await attempt(person.email, 'nope-again').expect(401);
    expect(Number((await attempt(person.email, person.password).expect(429)).headers['retry-after'])).toBe(30 * 60);
    await expireRateLimits(`signin-account:${accountKey(person.email)}`);
    await attempt(person.email, person.password).expect(200);
  });

  it('counts failures per socket address: a changed X-Forwarded-For (or our own address header) does not dodge the limit', async () => {
    for (let i = 0; i < 100; i += 1) {
      await request(appUrl)
        .post('/api/auth/sign-in')
        .set('X-Forwarded-For', testAddress())
        .set('X-Lobewise-Client-Address', testAddress())
        .send({
          email: `nobody-${i}-${crypto.randomBytes(3).toString('hex')}@lobewise.test`,
          password: 'whatever-it-is',
        })
        .expect(401);
    }
    const person = await createThrowawayUser('counter');
    const blocked = await request(appUrl)
      .post('/api/auth/sign-in')
      .set('X-Forwarded-For', testAddress())
      .send({ email: person.email, password: person.password })
      .expect(429);
    expect(Number(blocked.headers['retry-after'])).toBeGreaterThan(0);
    // the audit names the socket's address, not what the caller wrote
    const audit = await latestAudit('auth.sign-in-failed');
    expect(audit!.ip).toBe('127.0.0.1');
  });
});
