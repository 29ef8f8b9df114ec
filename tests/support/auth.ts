import request from 'supertest';
import { readRuntime } from './runtime';

// Signing in the demo staff (seeded by database/seeders/*demo-shop.js) for integration tests.
export type TestRole = 'manager' | 'counter' | 'tech';
export const DEMO_PASSWORD = 'lobewise-demo';
export const DEMO_EMAILS: Record<TestRole, string> = {
  manager: 'manager@lobewise.test',
  counter: 'counter@lobewise.test',
  tech: 'tech@lobewise.test',
};

/** The session cookie pair ("lobewise_session=...") from a sign-in answer, ready for a Cookie header. */
export function sessionCookieFrom(setCookie: string[] | string | undefined): string {
  const list = Array.isArray(setCookie) ? setCookie : setCookie ? [setCookie] : [];
  const found = list.find((cookie) => cookie.startsWith('lobewise_session='));
  if (!found) throw new Error(`no session cookie in the answer (Set-Cookie: ${JSON.stringify(list)})`);
  return found.split(';')[0];
}

/** Signs in with any e-mail and password; throws unless the app answers 200. Returns the Cookie header value. */
export async function signInWith(email: string, password: string): Promise<string> {
  const { appUrl } = readRuntime();
  const response = await request(appUrl).post('/api/auth/sign-in').send({ email, password });
  if (response.status !== 200)
    throw new Error(`sign-in as ${email} answered ${response.status}: ${JSON.stringify(response.body)}`);
  return sessionCookieFrom(response.headers['set-cookie']);
}

/**
 * Signs in a demo user and returns the Cookie header value. Use it as
 * `request(appUrl).get('/api/x').set('Cookie', await signIn('manager'))`.
 */
export function signIn(role: TestRole): Promise<string> {
  return signInWith(DEMO_EMAILS[role], DEMO_PASSWORD);
}

/** A supertest agent that keeps the signed-in demo user's cookie for every request. */
export async function signedInAgent(role: TestRole) {
  const { appUrl } = readRuntime();
  const agent = request.agent(appUrl);
  const response = await agent.post('/api/auth/sign-in').send({ email: DEMO_EMAILS[role], password: DEMO_PASSWORD });
  if (response.status !== 200)
    throw new Error(`sign-in as ${role} answered ${response.status}: ${JSON.stringify(response.body)}`);
  return agent;
}
