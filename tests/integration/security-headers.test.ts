import request from 'supertest';
import { signIn } from '../support/auth';
import { readRuntime } from '../support/runtime';
import { DEMO } from '../support/demo';

// Issue 13, item 8: an attachment download keeps its own strict policy (a sandbox for an uploaded
// file shown inline); JSON API answers are never cached; pages may post forms only to this site and
// to the payments host (the deposit form is answered with a 303 to the provider's pay page).
const { appUrl, paymentsUrl } = readRuntime();
const PAYMENTS_ORIGIN = new URL(paymentsUrl).origin;
const DOWNLOAD_POLICY = "default-src 'none'; img-src 'self'; object-src 'self'; sandbox";
const png = Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), Buffer.alloc(64, 0)]);

let manager: string;
const made: string[] = [];

beforeAll(async () => {
  manager = await signIn('manager');
});

afterAll(async () => {
  for (const url of made) await request(appUrl).delete(url).set('Cookie', manager);
});

function directive(policy: string | undefined, name: string): string | undefined {
  return policy
    ?.split(';')
    .map((part) => part.trim())
    .find((part) => part.startsWith(`${name} `));
}

describe('attachment downloads', () => {
  it('keep their own sandboxed policy and private, no-store caching', async () => {
    const upload = await request(appUrl)
      .post(`/api/cams/${DEMO.cams.lowRise204}/attachments`)
      .set('Cookie', manager)
      .attach('file', png, { filename: 'headers.png', contentType: 'image/png' });
    expect(upload.status).toBe(201);
    const url = `/api/cams/${DEMO.cams.lowRise204}/attachments/${upload.body.id}`;
    made.push(url);
    const served = await request(appUrl).get(url).set('Cookie', manager).buffer(true);
    expect(served.status).toBe(200);
    expect(served.headers['content-security-policy']).toBe(DOWNLOAD_POLICY);
    expect(served.headers['cache-control']).toBe('private, no-store');
    expect(served.headers['x-content-type-options']).toBe('nosniff');
  });
});

describe('JSON API answers', () => {
  it.each([
    ['GET /api/health', () => request(appUrl).get('/api/health')],
    ['GET /api/auth/me signed out (401)', () => request(appUrl).get('/api/auth/me')],
    ['GET /api/users as a manager', () => request(appUrl).get('/api/users').set('Cookie', manager)],
    ['GET /api/cams as a manager', () => request(appUrl).get('/api/cams').set('Cookie', manager)],
    [
      'GET /api/cams/<id>/attachments (a list, not a download)',
      () => request(appUrl).get(`/api/cams/${DEMO.cams.lowRise204}/attachments`).set('Cookie', manager),
    ],
    [
      'POST /api/auth/forgot-password with bad input (422)',
      () => request(appUrl).post('/api/auth/forgot-password').send({ email: 'nope' }),
    ],
  ])('%s carries Cache-Control: no-store and a policy that renders nothing', async (_name, call) => {
    const res = await call();
    expect(res.status).toBeLessThan(500);
    expect(res.headers['content-type']).toMatch(/application\/json/);
    expect(res.headers['cache-control']).toBe('no-store');
    expect(directive(res.headers['content-security-policy'], 'default-src')).toBe("default-src 'none'");
  });
});

describe('pages', () => {
  it.each(['/', '/sign-in', '/ask', '/forgot-password'])(
    '%s may post forms only to this site and the payments host',
    async (page) => {
      const res = await request(appUrl).get(page);
      expect(res.status).toBe(200);
      expect(directive(res.headers['content-security-policy'], 'form-action')).toBe(
        `form-action 'self' ${PAYMENTS_ORIGIN}`,
      );
      expect(directive(res.headers['content-security-policy'], 'frame-ancestors')).toBe("frame-ancestors 'none'");
      expect(res.headers['x-frame-options']).toBe('DENY');
    },
  );

  it('keeps the policy on the early redirect of a signed-out visitor away from a staff page', async () => {
    const res = await request(appUrl).get('/dashboard').redirects(0);
    expect(res.status).toBe(307);
    expect(directive(res.headers['content-security-policy'], 'form-action')).toBe(
      `form-action 'self' ${PAYMENTS_ORIGIN}`,
    );
  });
});
