import request from 'supertest';
import { AuditEntry, User } from '@/lib/db/models';
import { DEMO_EMAILS, signIn, signInWith } from '../support/auth';
import { connectTestDatabase, disconnectTestDatabase } from '../support/database';
import { readRuntime } from '../support/runtime';
import { clearSignInAttempts, createThrowawayUser, removeThrowawayUsers } from '../support/staff';
import { DEMO } from '../support/demo';
import type { StaffListRow } from '@/lib/db/queries/users';

const { appUrl, mailUrl } = readRuntime();
type Mail = { id: string; to: string[]; subject: string; html: string; text: string };
type Row = StaffListRow;
const usedEmails: string[] = [];
let manager: string;

beforeAll(async () => {
  connectTestDatabase();
  manager = await signIn('manager');
});

afterAll(async () => {
  await removeThrowawayUsers(usedEmails);
  await clearSignInAttempts(usedEmails);
  await disconnectTestDatabase();
});

describe('the staff list', () => {
  it('lists every account with its role, state and version for the manager', async () => {
    const response = await request(appUrl).get('/api/users').set('Cookie', manager).expect(200);
    const users = response.body.users as Row[];
    for (const role of ['manager', 'counter', 'tech'] as const) {
      expect(users).toEqual(
        expect.arrayContaining([
          expect.objectContaining({
            email: DEMO_EMAILS[role],
            role,
            active: true,
            hasPassword: true,
            version: expect.any(Number),
          }),
        ]),
      );
    }
    expect(JSON.stringify(response.body)).not.toMatch(/argon2|passwordHash/);
  });
});

describe('inviting staff', () => {
  it('creates the account, e-mails a set-password link that works, and audits the invitation', async () => {
    const email = `new-hire-${Date.now()}@lobewise.test`;
    usedEmails.push(email);
    const created = await request(appUrl)
      .post('/api/users')
      .set('Cookie', manager)
      .send({ email, name: 'Noor Ettinger', role: 'tech' })
      .expect(201);
    expect(created.body.user).toMatchObject({ email, role: 'tech', active: true, hasPassword: false });

    const messages = (await (await fetch(`${mailUrl}/messages`)).json()) as Mail[];
    const mail = messages.find((m) => m.to.includes(email));
    expect(mail).toBeDefined();
    expect(mail!.to).toEqual([email]);
    const link = /https?:\/\/\S+\/reset-password\?token=[A-Za-z0-9_-]+&welcome=1/.exec(mail!.text)?.[0];
    expect(link).toBeDefined();

    await request(appUrl).post('/api/auth/sign-in').send({ email, password: 'anything-at-all' }).expect(401);
    await request(appUrl)
      .post('/api/auth/reset-password')
      .send({ token: new URL(link!).searchParams.get('token'), password: 'my-first-password' })
      .expect(200);
    const cookie = await signInWith(email, 'my-first-password');
    const me = await request(appUrl).get('/api/auth/me').set('Cookie', cookie).expect(200);
    expect(me.body.user.role).toBe('tech');
    expect(
      await AuditEntry.findOne({ where: { action: 'user.invited', entityId: String(created.body.user.id) } }),
    ).not.toBeNull();
    expect(
      await AuditEntry.findOne({ where: { action: 'auth.password-set', entityId: String(created.body.user.id) } }),
    ).not.toBeNull();
  });

  it('refuses an address that already has an account, and names bad fields', async () => {
    const taken = await request(appUrl)
      .post('/api/users')
      .set('Cookie', manager)
      .send({ email: DEMO_EMAILS.counter.toUpperCase(), name: 'Someone', role: 'counter' })
      .expect(422);
    expect(taken.body.errors).toEqual([{ field: 'email', message: 'already has a staff account' }]);
    const bad = await request(appUrl)
      .post('/api/users')
      .set('Cookie', manager)
      .send({ email: 'x', name: '', role: 'owner' })
      .expect(422);
    expect((bad.body.errors as { field: string }[]).map((e) => e.field).sort()).toEqual(['email', 'name', 'role']);
  });
});

describe('changing staff accounts', () => {
  async function current(id: number) {
    return (await User.findByPk(id))!;
  }

  it('changes a role with the current version, audits it, and answers 409 to a stale version', async () => {
    const person = await createThrowawayUser('counter');
    const { version } = await current(person.id);
    const changed = await request(appUrl)
      .patch(`/api/users/${person.id}`)
      .set('Cookie', manager)
      .send({ version, role: 'tech' })
      .expect(200);
    expect(changed.body.user).toMatchObject({ role: 'tech', version: version + 1 });
    const audit = await AuditEntry.findOne({ where: { action: 'user.role-changed', entityId: String(person.id) } });
    expect(audit).not.toBeNull();
    expect(audit!.before).toEqual({ role: 'counter' });
    expect(audit!.after).toEqual({ role: 'tech' });
    expect(audit!.actor).toBe(DEMO_EMAILS.manager);

    const stale = await request(appUrl)
      .patch(`/api/users/${person.id}`)
      .set('Cookie', manager)
      .send({ version, role: 'counter' })
      .expect(409);
    expect(stale.body.current).toMatchObject({ role: 'tech', version: version + 1 });
    expect((await current(person.id)).role).toBe('tech');
  });

  it('deactivates and reactivates, auditing both', async () => {
    const person = await createThrowawayUser('tech');
    usedEmails.push(person.email);
    let { version } = await current(person.id);
    await request(appUrl)
      .patch(`/api/users/${person.id}`)
      .set('Cookie', manager)
      .send({ version, active: false })
      .expect(200);
    expect(
      await AuditEntry.findOne({ where: { action: 'user.deactivated', entityId: String(person.id) } }),
    ).not.toBeNull();
    ({ version } = await current(person.id));
    await request(appUrl)
      .patch(`/api/users/${person.id}`)
      .set('Cookie', manager)
      .send({ version, active: true })
      .expect(200);
    expect(
      await AuditEntry.findOne({ where: { action: 'user.reactivated', entityId: String(person.id) } }),
    ).not.toBeNull();
    await signInWith(person.email, person.password);
  });

  it('does not let the manager switch off or demote their own account, nor leave the shop without a manager', async () => {
    const me = await User.findOne({ where: { email: DEMO_EMAILS.manager } });
    const off = await request(appUrl)
      .patch(`/api/users/${me!.id}`)
      .set('Cookie', manager)
      .send({ version: me!.version, active: false })
      .expect(422);
    expect(off.body.errors).toEqual(expect.arrayContaining([expect.objectContaining({ field: 'active' })]));
    const demote = await request(appUrl)
      .patch(`/api/users/${me!.id}`)
      .set('Cookie', manager)
      .send({ version: me!.version, role: 'counter' })
      .expect(422);
    expect(demote.body.errors).toEqual(expect.arrayContaining([expect.objectContaining({ field: 'role' })]));
    expect((await current(me!.id)).active).toBe(true);
  });

  it('answers 404 for an unknown id and 422 for a bad id or body', async () => {
    await request(appUrl)
      .patch('/api/users/999999')
      .set('Cookie', manager)
      .send({ version: 1, role: 'tech' })
      .expect(404);
    const badId = await request(appUrl)
      .patch('/api/users/abc')
      .set('Cookie', manager)
      .send({ version: 1, role: 'tech' })
      .expect(422);
    expect(badId.body.errors[0].field).toBe('id');
    const badBody = await request(appUrl)
      .patch(`/api/users/${DEMO.users.counter}`)
      .set('Cookie', manager)
      .send({ version: 'one', role: 'boss' })
      .expect(422);
    expect((badBody.body.errors as { field: string }[]).map((e) => e.field).sort()).toEqual(['role', 'version']);
  });
});

describe('staff pages', () => {
  it('sends signed-out visitors to sign in and back', async () => {
    for (const page of ['/dashboard', '/account', '/staff']) {
      const response = await request(appUrl).get(page).redirects(0);
      expect(response.status).toBeGreaterThanOrEqual(300);
      expect(response.status).toBeLessThan(400);
      expect(response.headers.location).toContain(`/sign-in?next=${encodeURIComponent(page)}`);
    }
  });

  it('shows each role its pages and keeps the staff page for managers', async () => {
    const counter = await signIn('counter');
    const dashboard = await request(appUrl).get('/dashboard').set('Cookie', counter).expect(200);
    expect(dashboard.text).toContain('Counter');
    expect(dashboard.text).toContain('Sign out');
    expect(dashboard.text).not.toContain('href="/staff"');
    const refused = await request(appUrl).get('/staff').set('Cookie', counter).redirects(0);
    expect(refused.headers.location).toContain('/dashboard?denied=');
    const staff = await request(appUrl).get('/staff').set('Cookie', manager).expect(200);
    expect(staff.text).toContain('Invite');
    const managerHome = await request(appUrl).get('/dashboard').set('Cookie', manager).expect(200);
    expect(managerHome.text).toContain('href="/staff"');
  });

  it('serves the sign-in, forgot-password and account pages', async () => {
    expect((await request(appUrl).get('/sign-in?next=%2Fstaff').expect(200)).text).toContain('Sign in');
    expect((await request(appUrl).get('/forgot-password').expect(200)).text).toContain('reset');
    expect(
      (
        await request(appUrl)
          .get('/account')
          .set('Cookie', await signIn('tech'))
          .expect(200)
      ).text,
    ).toContain('Change your password');
  });
});
