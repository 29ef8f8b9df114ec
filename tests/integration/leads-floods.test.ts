import crypto from 'node:crypto';
import http from 'node:http';
import { QueryTypes, type Sequelize } from 'sequelize';
import request from 'supertest';
import { connectTestDatabase, disconnectTestDatabase } from '../support/database';
import { postDeclaringSize } from '../support/early-refusal';
import { mailsTo } from '../support/mail';
import { clearRateLimits } from '../support/rate-limits';
import { readRuntime } from '../support/runtime';

// Flood guards on the public lead form (issue 13 items 6 and 7): contacts counted as people, not
// spellings; the limit holds under concurrency; a per-address limit; a honeypot; and a body limit
// that refuses a huge post before reading it.
const { appUrl } = readRuntime();
const SHOP_EMAIL = 'counter@tallgrass-dyno.example'; // the demo shop's settings e-mail (seeded)
const run = crypto.randomBytes(4).toString('hex');
const NAME = `Flood Tester ${run}`;

const answers = (contact: { email?: string; phone?: string }) => ({
  engine: '5.3',
  use: 'daily',
  idle: 'smooth',
  emissions: 'no',
  transmission: 'automatic',
  driveline: 'stock',
  exhaust: 'stock',
  budget: 'unsure',
  name: NAME,
  consent: true,
  ...contact,
});
const post = (body: unknown) =>
  request(appUrl)
    .post('/api/leads')
    .send(body as object);

let sequelize: Sequelize;
const leadCount = async () =>
  (
    await sequelize.query<{ n: number }>('SELECT COUNT(*) AS n FROM leads WHERE name = ?', {
      replacements: [NAME],
      type: QueryTypes.SELECT,
    })
  )[0].n;

beforeAll(() => {
  sequelize = connectTestDatabase();
});
beforeEach(async () => {
  await clearRateLimits('lead-');
});
afterAll(async () => {
  const ids = (
    await sequelize.query<{ id: number }>('SELECT id FROM leads WHERE name = ?', {
      replacements: [NAME],
      type: QueryTypes.SELECT,
    })
  ).map((r) => r.id);
  if (ids.length) {
    await sequelize.query("DELETE FROM audit_log WHERE entity_type = 'lead' AND entity_id IN (?)", {
      replacements: [ids.map(String)],
    });
    await sequelize.query('DELETE FROM leads WHERE id IN (?)', { replacements: [ids] });
  }
  await clearRateLimits('lead-');
  await disconnectTestDatabase();
});

describe('lead flood limits', () => {
  it('counts an e-mail address in any case and with any +tag as one contact', async () => {
    const spellings = [
      `wren-${run}@example.com`,
      `Wren-${run}+ask1@Example.com`,
      `WREN-${run}+cams@EXAMPLE.COM`,
      `wren-${run}+again@example.com`,
    ];
    const statuses = [];
    for (const email of spellings) statuses.push((await post(answers({ email }))).status);
    expect(statuses).toEqual([201, 201, 201, 429]);
  });

  it('counts a phone number by its digits, however it is written', async () => {
    const line = String(1000 + (parseInt(run.slice(0, 4), 16) % 9000));
    const spellings = [`555-010-${line}`, `(555) 010 ${line}`, `555.010.${line}`, `+1 555 010 ${line}`];
    const statuses = [];
    for (const phone of spellings)
      statuses.push(
        (await post(answers({ phone, email: `ph-${crypto.randomBytes(3).toString('hex')}-${run}@example.com` })))
          .status,
      );
    expect(statuses).toEqual([201, 201, 201, 429]);
  });

  it('lets only 3 of 8 concurrent posts from one contact through', async () => {
    const before = await leadCount();
    const email = `burst-${run}@example.com`;
    const statuses = (await Promise.all(Array.from({ length: 8 }, () => post(answers({ email }))))).map(
      (r) => r.status,
    );
    expect(statuses.filter((s) => s === 201)).toHaveLength(3);
    expect(statuses.filter((s) => s === 429)).toHaveLength(5);
    expect((await leadCount()) - before).toBe(3);
  });

  it('holds back more than 20 leads an hour from one address, whatever the contacts', async () => {
    for (let i = 0; i < 20; i += 1)
      expect((await post(answers({ email: `addr-${i}-${run}@example.com` }))).status).toBe(201);
    const refused = await post(answers({ email: `addr-last-${run}@example.com` }));
    expect(refused.status).toBe(429);
    expect(Number(refused.headers['retry-after'])).toBeGreaterThan(0);
  });

  it('answers a filled honeypot like a success, but stores no lead and e-mails nobody', async () => {
    const before = await leadCount();
    const mailsBefore = (await mailsTo(SHOP_EMAIL)).length;
    const res = await post({ ...answers({ email: `robot-${run}@example.com` }), website: 'http://cheap-cams.example' });
    expect(res.status).toBe(201);
    expect(res.body.resultUrl).toMatch(/^\/ask\/result\//);
    await new Promise((r) => setTimeout(r, 500));
    expect(await leadCount()).toBe(before);
    expect((await mailsTo(SHOP_EMAIL)).length).toBe(mailsBefore);
  });
});

describe('body size limits', () => {
  it('refuses a 60 MB JSON post to the lead route with 413 before reading it', async () => {
    // Only the start is sent: the answer must come from the declared size alone (see early-refusal.ts).
    const start = Buffer.from(
      JSON.stringify(answers({ email: `huge-${run}@example.com` })).slice(0, -1) + ',"name":"xxxx',
    );
    const started = Date.now();
    const res = await postDeclaringSize(
      `${appUrl}/api/leads`,
      { 'Content-Type': 'application/json' },
      start,
      60 * 1024 * 1024,
    );
    expect(res.status).toBe(413);
    expect(Date.now() - started).toBeLessThan(20_000);
  });

  it('refuses a chunked JSON post without a length as soon as it passes 256 kB', async () => {
    const written = await new Promise<{ status: number; bytes: number }>((resolve, reject) => {
      let bytes = 0;
      let answered = false;
      const req = http.request(
        `${appUrl}/api/leads`,
        { method: 'POST', headers: { 'Content-Type': 'application/json', 'Transfer-Encoding': 'chunked' } },
        (res) => {
          answered = true;
          res.resume();
          resolve({ status: res.statusCode ?? 0, bytes });
          req.destroy();
        },
      );
      req.on('error', (error) => (answered ? undefined : reject(error)));
      const chunk = Buffer.alloc(64 * 1024, 'x');
      req.write('{"name":"');
      const pump = () => {
        while (!answered && bytes < 40 * 1024 * 1024) {
          bytes += chunk.length;
          if (!req.write(chunk)) return void req.once('drain', pump);
        }
        if (!answered) req.end('"}');
      };
      pump();
    });
    expect(written.status).toBe(413);
    expect(written.bytes).toBeLessThan(16 * 1024 * 1024);
  });

  it('refuses a webhook body over 1 MB with 413 before checking its signature', async () => {
    const res = await postDeclaringSize(
      `${appUrl}/api/payments/webhook`,
      { 'Stripe-Signature': 't=1,v1=00', 'Content-Type': 'application/json' },
      Buffer.from('{"pad":"xxxxxxxx'),
      2 * 1024 * 1024,
    );
    expect(res.status).toBe(413);
    expect(res.json.message).toMatch(/1 MB/);
    const small = await request(appUrl)
      .post('/api/payments/webhook')
      .set('Stripe-Signature', 't=1,v1=00')
      .set('content-type', 'application/json')
      .send('{}');
    expect(small.status).toBe(400);
  });
});
