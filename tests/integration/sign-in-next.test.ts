import request from 'supertest';
import { signIn } from '../support/auth';
import { readRuntime } from '../support/runtime';

// Issue 13, item 2: /sign-in?next=… must never send anyone off-site, and a CR or LF in `next` must
// not turn into a 500. Signed in, the page redirects at once (Location); signed out, the form gets
// `next` as a prop and navigates there after signing in, so that prop is checked in the page.
const { appUrl } = readRuntime();
const APP_ORIGIN = new URL(appUrl).origin;

const HOSTILE_NEXT = [
  '%2F%09%2Fevil.example%2Fx',
  '%2F%0A%2Fevil.example%2Fx',
  '%2F%0D%0A%2Fevil.example%2Fx',
  '%2F%2Fevil.example%2Fx',
  '%2F%5Cevil.example%2Fx',
  '%5C%5Cevil.example%2Fx',
  '%2F%252F%252Fevil.example',
  '%2F.%2F%2Fevil.example',
  'https%3A%2F%2Fevil.example',
  '%2F%0D%0ASet-Cookie%3A%20x%3D1',
  '%2F%00',
];

let cookie: string;

beforeAll(async () => {
  cookie = await signIn('counter');
});

describe('GET /sign-in?next=… signed in (redirects at once)', () => {
  it.each(HOSTILE_NEXT)('next=%s stays on this site, never 500', async (next) => {
    const res = await request(appUrl).get(`/sign-in?next=${next}`).set('Cookie', cookie).redirects(0);
    expect(res.status).toBeGreaterThanOrEqual(300);
    expect(res.status).toBeLessThan(400);
    const target = new URL(res.headers.location, appUrl);
    expect(target.origin).toBe(APP_ORIGIN);
    expect(target.pathname).toBe('/dashboard');
  });

  it('follows a same-site next', async () => {
    const res = await request(appUrl).get('/sign-in?next=%2Fquotes%3Fstatus%3Dsent').set('Cookie', cookie).redirects(0);
    const target = new URL(res.headers.location, appUrl);
    expect(target.origin).toBe(APP_ORIGIN);
    expect(`${target.pathname}${target.search}`).toBe('/quotes?status=sent');
  });
});

describe('GET /sign-in?next=… signed out (the form gets next)', () => {
  it.each(HOSTILE_NEXT)('next=%s hands the form the staff home, never 500', async (next) => {
    const res = await request(appUrl).get(`/sign-in?next=${next}`);
    expect(res.status).toBe(200);
    // The form's props travel in the page's flight data as {\"next\":\"…\"}.
    expect(res.text).toContain('{\\"next\\":\\"/dashboard\\"}');
  });
});
