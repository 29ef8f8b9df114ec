import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { Op } from 'sequelize';
import request from 'supertest';
import { Customer } from '@/lib/db/models';
import { signIn } from '../support/auth';
import { connectTestDatabase, disconnectTestDatabase } from '../support/database';
import { readRuntime } from '../support/runtime';

// Issue 13, item 5: text the database cannot store (an unpaired surrogate), NUL and control
// characters are refused at the schema with a 422 naming the field, never a 500; line breaks never
// reach a single-line field (names end up in e-mail subjects); and a path segment that is not valid
// percent-encoded UTF-8 answers 404 with the usual security headers on every dynamic route.
const { appUrl } = readRuntime();
const APP_DIR = path.resolve(__dirname, '../../src/app');
const MARK = `Hostile-${crypto.randomBytes(3).toString('hex')}`;
const run = crypto.randomBytes(4).toString('hex');

const lead = (change: Record<string, unknown>, tag: string) => ({
  engine: '5.3',
  use: 'daily',
  idle: 'smooth',
  emissions: 'no',
  transmission: 'automatic',
  driveline: 'stock',
  exhaust: 'stock',
  budget: 'unsure',
  name: 'Ines Marrow',
  email: `hostile-${tag}-${run}@example.com`,
  consent: true,
  ...change,
});

type FieldError = { field: string; message: string };
const fields = (body: { errors?: FieldError[] }) => (body.errors ?? []).map((e) => e.field);

let counter: string;
let manager: string;

beforeAll(async () => {
  connectTestDatabase();
  [counter, manager] = [await signIn('counter'), await signIn('manager')];
});

afterAll(async () => {
  await Customer.destroy({ where: { name: { [Op.startsWith]: MARK } } });
  await disconnectTestDatabase();
});

const HOSTILE: [string, string][] = [
  ['an unpaired surrogate', 'Ines \ud800 Marrow'],
  ['a trailing unpaired low surrogate', 'Ines Marrow\udc00'],
  ['NUL', 'Ines\u0000Marrow'],
  ['an escape sequence', 'Ines \u001b[31mMarrow'],
  ['a C1 control', 'Ines\u0085Marrow'],
  ['CR/LF (header injection)', 'Ines Marrow\r\nBcc: everyone@example.com'],
];

describe('POST /api/leads (public)', () => {
  it.each(HOSTILE)('refuses a name with %s: 422 naming name', async (_what, name) => {
    const res = await request(appUrl).post('/api/leads').send(lead({ name }, 'name'));
    expect(res.status).toBe(422);
    expect(fields(res.body)).toContain('name');
  });

  it('refuses an unpaired surrogate in the e-mail and phone with 422 naming each', async () => {
    const res = await request(appUrl)
      .post('/api/leads')
      .send(lead({ email: `a\ud800@example.com`, phone: '555\ud8000107' }, 'contact'));
    expect(res.status).toBe(422);
    expect(fields(res.body)).toEqual(expect.arrayContaining(['email', 'phone']));
  });
});

describe('POST /api/customers', () => {
  it.each(HOSTILE)('refuses a name with %s: 422 naming name', async (_what, name) => {
    const res = await request(appUrl)
      .post('/api/customers')
      .set('Cookie', counter)
      .send({ name: `${MARK} ${name}` });
    expect(res.status).toBe(422);
    expect(fields(res.body)).toEqual(['name']);
  });

  it('refuses NUL and unpaired surrogates in notes, naming notes', async () => {
    for (const notes of ['before\u0000after', 'broken \udfff text']) {
      const res = await request(appUrl)
        .post('/api/customers')
        .set('Cookie', counter)
        .send({ name: `${MARK} Notes`, notes });
      expect(res.status).toBe(422);
      expect(fields(res.body)).toEqual(['notes']);
    }
  });

  it('keeps tabs, line breaks and real non-ASCII text in notes, with CRLF stored as LF', async () => {
    const res = await request(appUrl)
      .post('/api/customers')
      .set('Cookie', counter)
      .send({ name: `${MARK} Zoë Ång 🚗`, notes: 'line one\r\nline two\tend\rline three' });
    expect(res.status).toBe(201);
    const stored = await Customer.findOne({ where: { name: `${MARK} Zoë Ång 🚗` } });
    expect(stored?.notes).toBe('line one\nline two\tend\nline three');
  });
});

describe('POST /api/users (managers invite staff)', () => {
  it.each(HOSTILE)('refuses a name with %s: 422 naming name', async (_what, name) => {
    const res = await request(appUrl)
      .post('/api/users')
      .set('Cookie', manager)
      .send({ email: `hostile-${run}@lobewise.test`, name, role: 'counter' });
    expect(res.status).toBe(422);
    expect(fields(res.body)).toEqual(['name']);
  });
});

/** Every dynamic route (page or API) with each [param] replaced by `segment`. */
function dynamicPaths(segment: string): string[] {
  const out: string[] = [];
  const walk = (dir: string, parts: string[]) => {
    for (const entry of fs.readdirSync(dir, { withFileTypes: true })) {
      if (entry.isDirectory()) {
        const name = entry.name;
        const part = /^\(.*\)$/.test(name) ? null : /^\[.*\]$/.test(name) ? segment : name;
        walk(path.join(dir, name), part === null ? parts : [...parts, part]);
      } else if (/^(page|route)\.(tsx?|m?js)$/.test(entry.name) && parts.includes(segment)) {
        out.push(`/${parts.join('/')}`);
      }
    }
  };
  walk(APP_DIR, []);
  return [...new Set(out)].sort();
}

describe('a path segment that is not valid percent-encoded UTF-8', () => {
  const surrogate = dynamicPaths('%ED%A0%80');

  it('finds the dynamic routes (the walk itself works)', () => {
    expect(surrogate).toEqual(
      expect.arrayContaining([
        '/q/%ED%A0%80',
        '/api/quotes/%ED%A0%80',
        '/api/users/%ED%A0%80',
        '/catalogue/cams/%ED%A0%80/edit',
      ]),
    );
    expect(surrogate.length).toBeGreaterThanOrEqual(13);
  });

  it.each([...surrogate, ...dynamicPaths('%E0%A4%A'), '/q/%ED%A0%80.txt', '/api/%ff'])(
    'GET %s answers 404 with the security headers',
    async (target) => {
      const res = await request(appUrl).get(target).set('Cookie', manager).redirects(0);
      expect(res.status).toBe(404);
      expect(res.headers['x-content-type-options']).toBe('nosniff');
      expect(res.headers['x-frame-options']).toBe('DENY');
      expect(res.headers['content-security-policy']).toMatch(/default-src '(?:self|none)'/);
    },
  );

  it('answers a POST to such a path with 404 too (the customer checkout and the quote send)', async () => {
    for (const target of ['/api/q/%ED%A0%80/checkout', '/api/quotes/%ED%A0%80/send']) {
      const res = await request(appUrl).post(target).set('Cookie', manager).send({});
      expect(res.status).toBe(404);
    }
  });

  it('still serves a well-formed encoded path as before', async () => {
    await request(appUrl)
      .get('/api/users/%31')
      .set('Cookie', manager)
      .expect((res) => expect(res.status).not.toBe(500));
    const page = await request(appUrl).get('/q/%41%42').redirects(0);
    expect(page.status).toBeLessThan(500);
  });
});
