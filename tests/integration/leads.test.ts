import crypto from 'node:crypto';
import { QueryTypes, type Sequelize } from 'sequelize';
import request from 'supertest';
import { signedInAgent } from '../support/auth';
import { connectTestDatabase, disconnectTestDatabase } from '../support/database';
import { clearRateLimits } from '../support/rate-limits';
import { readRuntime } from '../support/runtime';
import type { ShortlistEntry } from '@/lib/leads/shortlist';
import type { LeadRecord } from '@/lib/leads/types';

// The at-home questionnaire end to end over HTTP against the real build, the real MariaDB and the mail
// fake: answers → a stored lead with the top-3 shortlist, the shop's e-mail, the private result page,
// then the staff side (list by status, status change with the version check) and who may do what.
const { appUrl, mailUrl } = readRuntime();
const SHOP_EMAIL = 'counter@tallgrass-dyno.example'; // the demo shop's settings e-mail (seeded)
const sha256 = (s: string) => crypto.createHash('sha256').update(s).digest('hex');
const run = crypto.randomBytes(4).toString('hex');
const email = (tag: string) => `ask-${tag}-${run}@example.com`;

const fullAnswers = {
  engine: '5.3',
  vehicle: 'suv',
  use: 'towing',
  idle: 'smooth',
  emissions: 'no',
  transmission: 'automatic',
  driveline: 'stock',
  exhaust: 'stock',
  budget: '1500-3000',
  name: 'Wren Halvorsen',
  email: email('full'),
  phone: '555-0107',
  consent: true,
};

let sequelize: Sequelize;
const createdEmails: string[] = [];

beforeAll(() => {
  sequelize = connectTestDatabase();
});
afterAll(async () => {
  // Leave the database as we found it: our leads and their audit rows.
  const ids = (
    await sequelize.query<{ id: number }>('SELECT id FROM leads WHERE email LIKE ?', {
      replacements: [`ask-%-${run}@example.com`],
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

type Entry = ShortlistEntry;

describe('POST /api/leads with a full answer set', () => {
  let body: { id: number; token: string; resultUrl: string; shortlist: { entries: Entry[]; notice: string } };

  beforeAll(async () => {
    const res = await request(appUrl).post('/api/leads').send(fullAnswers);
    expect(res.status).toBe(201);
    body = res.body;
    createdEmails.push(fullAnswers.email);
  });

  it('answers with three ranked cams and a private result token', () => {
    expect(body.shortlist.entries.map((e) => e.rank)).toEqual([1, 2, 3]);
    for (const entry of body.shortlist.entries) {
      expect(entry.camName).toEqual(expect.any(String));
      expect(entry.reasons.length).toBeGreaterThan(0);
      expect(Number.isInteger(entry.jobPriceCents) && entry.jobPriceCents! > 0).toBe(true);
    }
    expect(new Set(body.shortlist.entries.map((e) => e.camId)).size).toBe(3);
    // Plain words for the customer: no exact prices, no counter jargon like inHg or dynamic compression.
    const words = JSON.stringify(body.shortlist.entries.map((e) => [e.reasons, e.alsoNeeds, e.cautions]));
    expect(words).not.toMatch(/\$\d|inHg|dynamic compression|LSA|0\.050/);
    expect(body.shortlist.entries.every((e) => e.alsoNeeds.some((n) => /re-tune/.test(n)))).toBe(true);
    expect(body.token).toMatch(/^[A-Za-z0-9_-]{43}$/);
    expect(body.resultUrl).toBe(`/ask/result/${body.token}`);
  });

  it('stores the lead with the answers, the same shortlist and only the token’s hash', async () => {
    const [row] = await sequelize.query<{
      name: string;
      email: string;
      phone: string;
      status: string;
      answers: string | object;
      shortlist: string | object;
      public_token_hash: string;
      version: number;
    }>('SELECT name, email, phone, status, answers, shortlist, public_token_hash, version FROM leads WHERE id = ?', {
      replacements: [body.id],
      type: QueryTypes.SELECT,
    });
    const json = (v: string | object) => (typeof v === 'string' ? JSON.parse(v) : v);
    expect(row).toMatchObject({
      name: 'Wren Halvorsen',
      email: fullAnswers.email,
      phone: '555-0107',
      status: 'new',
      version: 1,
    });
    expect(json(row.answers)).toMatchObject({ engine: '5.3', use: 'towing', consent: true });
    expect(json(row.shortlist).entries.map((e: Entry) => e.camId)).toEqual(body.shortlist.entries.map((e) => e.camId));
    expect(row.public_token_hash).toBe(sha256(body.token));
    const audit = await sequelize.query("SELECT id FROM audit_log WHERE action = 'lead.created' AND entity_id = ?", {
      replacements: [String(body.id)],
      type: QueryTypes.SELECT,
    });
    expect(audit).toHaveLength(1);
  });

  it('e-mails the shop that a lead arrived, with the answers in plain words', async () => {
    const messages = (await request(mailUrl).get('/messages').query({ to: SHOP_EMAIL })).body as {
      subject: string;
      text: string;
      reply_to?: unknown;
    }[];
    const mail = messages.find((m) => m.subject === `New questionnaire lead #${body.id}: Wren Halvorsen`);
    expect(mail).toBeDefined();
    expect(mail!.text).toContain('What do you mostly use it for? Towing or hauling');
    expect(mail!.text).toContain(fullAnswers.email);
    expect(mail!.text).toContain(body.shortlist.entries[0].camName);
    expect(mail!.text).not.toContain(body.token);
  });

  it('renders the result page by its token, labelled an estimate, with the cautions', async () => {
    const res = await request(appUrl).get(body.resultUrl);
    expect(res.status).toBe(200);
    expect(res.text).toContain('Your indicative shortlist');
    expect(res.text).toContain('This is an estimate, not a quote');
    expect(res.text).toContain('The shop will contact you');
    for (const entry of body.shortlist.entries) expect(res.text).toContain(entry.camName.replace(/&/g, '&amp;'));
    expect(res.text).toMatch(/certified/);
    expect(res.text).toContain('qualified technician');
    expect(res.text).toContain('re-tuned');
    expect(res.headers['cache-control']).toMatch(/no-store|private|no-cache/);
  });

  it('answers a wrong or malformed token with a 404', async () => {
    expect((await request(appUrl).get(`/ask/result/${crypto.randomBytes(32).toString('base64url')}`)).status).toBe(404);
    expect((await request(appUrl).get('/ask/result/short')).status).toBe(404);
  });

  it('a vehicle that must pass emissions ("not sure" counts as yes) is shown certified cams only; one that need not pass is not limited', async () => {
    const certified = (
      await sequelize.query<{ id: number }>(
        'SELECT id FROM cams WHERE emissions_certified = 1 AND is_factory_baseline = 0 AND active = 1 AND archived_at IS NULL',
        { type: QueryTypes.SELECT },
      )
    ).map((r) => r.id);
    // The demo shop stocks fewer certified cams than a full shortlist: without the filter an uncertified one would be listed.
    expect(certified.length).toBeLessThan(3);
    for (const emissions of ['unsure', 'yes']) {
      const res = await request(appUrl)
        .post('/api/leads')
        .send({
          ...fullAnswers,
          emissions,
          engine: 'unsure',
          email: email(`emissions-${emissions}`),
          phone: undefined,
        });
      expect(res.status).toBe(201);
      const entries = res.body.shortlist.entries as Entry[];
      expect(entries.map((e) => e.rank)).toEqual(certified.map((_, i) => i + 1));
      expect(entries.map((e) => Number(e.camId)).sort()).toEqual([...certified].sort());
      for (const entry of entries) {
        expect(entry.emissionsCertified).toBe(true);
        expect(entry.reasons.join(' ')).toContain('It is certified for emissions-tested road use');
      }
      expect(res.body.shortlist.engineLiters).toBe(5.3);
      const page = await request(appUrl).get(res.body.resultUrl).expect(200);
      expect(page.text).toContain('only cams certified for emissions-tested road use are listed');
      expect(page.text).not.toContain('not certified for emissions-tested road use');
    }
    // The full answer set above said "no": its three choices are not limited to certified cams.
    const stored = await sequelize.query<{ shortlist: string | { entries: Entry[] } }>(
      'SELECT shortlist FROM leads WHERE email = ?',
      { replacements: [fullAnswers.email], type: QueryTypes.SELECT },
    );
    const list =
      typeof stored[0].shortlist === 'string'
        ? (JSON.parse(stored[0].shortlist) as { entries: Entry[] })
        : stored[0].shortlist;
    expect(list.entries).toHaveLength(3);
    expect(list.entries.some((e) => !e.emissionsCertified)).toBe(true);
  });
});

describe('POST /api/leads with bad answers', () => {
  it.each([
    ['engine', { engine: '7.4' }, /engine must be one of/],
    ['idle', { idle: undefined }, /idle is required/],
    ['consent', { consent: false }, /consent must be given/],
    ['email', { email: 'not-an-address' }, /email must be an e-mail address/],
    ['phone', { phone: 'call me' }, /phone must be digits/],
    ['name', { name: '   ' }, /name must not be empty/],
    ['email', { email: undefined, phone: undefined }, /e-mail address or a phone number/],
    ['extra', { extra: 1 }, /unknown field/],
  ])('422 naming %s', async (field, change, message) => {
    const res = await request(appUrl)
      .post('/api/leads')
      .send({ ...fullAnswers, email: email('bad'), ...change });
    expect(res.status).toBe(422);
    const hit = (res.body.errors as { field: string; message: string }[]).find((e) => e.field === field);
    expect(hit?.message).toMatch(message);
  });

  it('answers a body that is not JSON with a 400, never a 500', async () => {
    const res = await request(appUrl).post('/api/leads').set('Content-Type', 'application/json').send('{"engine":');
    expect(res.status).toBe(400);
  });

  it('refuses a post from another site', async () => {
    const res = await request(appUrl)
      .post('/api/leads')
      .set('Origin', 'https://elsewhere.example')
      .send({ ...fullAnswers, email: email('xsite') });
    expect(res.status).toBe(403);
  });

  it('holds back a flood from one e-mail address within the hour (429)', async () => {
    const flood = { ...fullAnswers, email: email('flood'), phone: undefined };
    for (let i = 0; i < 3; i++) expect((await request(appUrl).post('/api/leads').send(flood)).status).toBe(201);
    createdEmails.push(flood.email);
    const res = await request(appUrl).post('/api/leads').send(flood);
    expect(res.status).toBe(429);
    expect(Number(res.headers['retry-after'])).toBeGreaterThan(0);
    expect(Number(res.headers['retry-after'])).toBeLessThanOrEqual(3600);
  });
});

describe('the staff side of leads', () => {
  let leadId: number;
  let version: number;

  beforeAll(async () => {
    const res = await request(appUrl)
      .post('/api/leads')
      .send({ ...fullAnswers, name: 'Odile Brannock', email: email('staff') });
    expect(res.status).toBe(201);
    leadId = res.body.id;
  });

  it('lists leads for counter staff, paged and by status', async () => {
    const counter = await signedInAgent('counter');
    const res = await counter.get('/api/leads').query({ status: 'new', pageSize: 100 });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ page: 1, pageSize: 100 });
    const lead = (res.body.items as LeadRecord[]).find((l) => l.id === leadId);
    expect(lead).toMatchObject({ status: 'new', answers: { engine: '5.3' } });
    expect(lead!.shortlist?.entries).toHaveLength(3);
    version = lead!.version;
    expect((res.body.items as LeadRecord[]).every((l) => l.status === 'new')).toBe(true);
    const paged = await counter.get('/api/leads').query({ pageSize: 1 });
    expect(paged.body.items).toHaveLength(1);
    expect(paged.body.total).toBeGreaterThanOrEqual(1);
    expect((await counter.get('/api/leads').query({ status: 'lost' })).status).toBe(422);
    expect((await counter.get('/api/leads').query({ pageSize: 1000 })).body.errors[0].field).toBe('pageSize');
  });

  it('moves a lead on with its version, and a stale version answers 409 with the current lead', async () => {
    const manager = await signedInAgent('manager');
    const moved = await manager.patch(`/api/leads/${leadId}`).send({ version, status: 'contacted' });
    expect(moved.status).toBe(200);
    expect(moved.body).toMatchObject({ id: leadId, status: 'contacted', version: version + 1 });
    const stale = await manager.patch(`/api/leads/${leadId}`).send({ version, status: 'closed' });
    expect(stale.status).toBe(409);
    expect(stale.body.current).toMatchObject({ status: 'contacted', version: version + 1 });
    const bad = await manager.patch(`/api/leads/${leadId}`).send({ version: version + 1, status: 'won' });
    expect(bad.status).toBe(422);
    expect(bad.body.errors[0].field).toBe('status');
    expect((await manager.patch('/api/leads/999999').send({ version: 1, status: 'closed' })).status).toBe(404);
    const audit = await sequelize.query(
      "SELECT id FROM audit_log WHERE action = 'lead.status-changed' AND entity_id = ?",
      { replacements: [String(leadId)], type: QueryTypes.SELECT },
    );
    expect(audit).toHaveLength(1);
  });

  it('shows the lead on the staff page with the answers in words and a way to start an interview', async () => {
    const counter = await signedInAgent('counter');
    const res = await counter.get('/leads');
    expect(res.status).toBe(200);
    expect(res.text).toContain('Odile Brannock');
    expect(res.text).toContain('Towing or hauling');
    expect(res.text).toContain('Start an interview');
    expect(res.text).toContain(`href="/interviews/new?lead=${leadId}"`);
  });

  it('starts an interview prefilled from the lead: contact details and the assumed 5.3 L build', async () => {
    const counter = await signedInAgent('counter');
    const res = await counter.get(`/interviews/new?lead=${leadId}`);
    expect(res.status).toBe(200);
    expect(res.text).toContain('Started from Odile Brannock’s questionnaire answers');
    expect(res.text).toMatch(/value="Odile Brannock"/);
    expect(res.text).toContain(`value="${email('staff')}"`);
    expect(res.text).toMatch(/value="3\.622"/); // the 5.3 L preset's stroke, from memory
    const plain = await counter.get('/interviews/new?lead=999999');
    expect(plain.status).toBe(200);
    expect(plain.text).not.toContain('questionnaire answers');
  });

  it('keeps technicians out (403) and signed-out visitors out (401 / sign-in)', async () => {
    const tech = await signedInAgent('tech');
    expect((await tech.get('/api/leads')).status).toBe(403);
    expect((await tech.patch(`/api/leads/${leadId}`).send({ version: 1, status: 'closed' })).status).toBe(403);
    expect((await request(appUrl).get('/api/leads')).status).toBe(401);
    expect((await request(appUrl).patch(`/api/leads/${leadId}`).send({ version: 1, status: 'closed' })).status).toBe(
      401,
    );
    const page = await request(appUrl).get('/leads').redirects(0);
    expect([302, 303, 307, 308]).toContain(page.status);
    expect(page.headers.location).toMatch(/\/sign-in/);
  });
});
