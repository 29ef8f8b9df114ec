import crypto from 'node:crypto';
import { Op } from 'sequelize';
import request from 'supertest';
import { AuditEntry, Build, Customer, Lead, LeadNote } from '@/lib/db/models';
import { signedInAgent } from '../support/auth';
import { connectTestDatabase, disconnectTestDatabase } from '../support/database';
import { waitForMailsTo } from '../support/mail';
import { truckProfile } from '../support/quote-fixtures';
import { clearRateLimits } from '../support/rate-limits';
import { readRuntime } from '../support/runtime';

// Leads that are followed up (issue 9, item 4): the customer gets their result link by e-mail, a note log
// per lead, and an interview started from a lead links the lead to the interview's customer and marks it
// contacted, in the build's own transaction.
// Leads are made straight in the database (the public form's flood guard counts per address, and other
// files post leads too); everything made here is removed afterwards.
type Agent = Awaited<ReturnType<typeof signedInAgent>>;
let counter: Agent;
let tech: Agent;
const leads: number[] = [];
const customers: number[] = [];

async function lead(status: 'new' | 'quoted' = 'new') {
  const email = `follow-up-${crypto.randomBytes(4).toString('hex')}@example.com`;
  const row = await Lead.create({
    name: 'Fixture Follow-up',
    email,
    phone: null,
    answers: { engine: '5.3', name: 'Fixture Follow-up', email },
    shortlist: null,
    status,
    publicTokenHash: null,
    customerId: null,
  });
  leads.push(row.id);
  return row;
}

beforeAll(async () => {
  connectTestDatabase();
  [counter, tech] = await Promise.all([signedInAgent('counter'), signedInAgent('tech')]);
});
afterAll(async () => {
  await AuditEntry.destroy({ where: { entityType: 'lead', entityId: { [Op.in]: leads.map(String) } } });
  await Lead.destroy({ where: { id: { [Op.in]: leads } } });
  const builds = await Build.findAll({ where: { customerId: { [Op.in]: customers } } });
  await AuditEntry.destroy({ where: { entityType: 'build', entityId: { [Op.in]: builds.map((b) => String(b.id)) } } });
  await Build.destroy({ where: { id: { [Op.in]: builds.map((b) => b.id) } } });
  await Customer.destroy({ where: { id: { [Op.in]: customers } } });
  await disconnectTestDatabase();
});

describe("a lead's note log", () => {
  it('adds notes with who and when, refuses empty or unsafe text, and shows them on the leads page', async () => {
    const row = await lead();
    const first = await counter.post(`/api/leads/${row.id}/notes`).send({ body: 'Called at lunch, left a message.' });
    expect(first.status).toBe(201);
    expect(first.body).toMatchObject({
      leadId: row.id,
      body: 'Called at lunch, left a message.',
      author: expect.any(String),
      createdAt: expect.any(String),
    });
    expect(
      (
        await counter
          .post(`/api/leads/${row.id}/notes`)
          .send({ body: 'Rang back: wants a quote for the towing cam.\r\nBooked a visit.' })
      ).status,
    ).toBe(201);

    const empty = await counter.post(`/api/leads/${row.id}/notes`).send({ body: '   ' });
    expect(empty.status).toBe(422);
    expect(empty.body.errors).toEqual([expect.objectContaining({ field: 'body' })]);
    const nul = await counter.post(`/api/leads/${row.id}/notes`).send({ body: 'a\u0000b' });
    expect(nul.status).toBe(422);
    expect((await counter.post('/api/leads/999999/notes').send({ body: 'nobody' })).status).toBe(404);
    expect((await tech.post(`/api/leads/${row.id}/notes`).send({ body: 'not my job' })).status).toBe(403);

    const stored = await LeadNote.findAll({ where: { leadId: row.id }, order: [['id', 'ASC']] });
    expect(stored.map((n) => n.body)).toEqual([
      'Called at lunch, left a message.',
      'Rang back: wants a quote for the towing cam.\nBooked a visit.',
    ]);
    expect(
      await AuditEntry.count({ where: { action: 'lead.note-added', entityType: 'lead', entityId: String(row.id) } }),
    ).toBe(2);
    const page = await counter.get('/leads');
    expect(page.text).toContain('Called at lunch, left a message.');
  });
});

describe('an interview started from a lead', () => {
  const build = (leadId: number, label: string) =>
    counter.post('/api/builds').send({
      customer: { name: `Fixture ${label}`, email: `${label}-${crypto.randomBytes(4).toString('hex')}@example.com` },
      vehicleLabel: `Fixture truck (${label})`,
      profile: truckProfile(),
      leadId,
    });

  it('links the lead to the new customer and marks it contacted, with an audit row', async () => {
    const row = await lead();
    const made = await build(row.id, 'lead-link');
    expect(made.status).toBe(201);
    customers.push(made.body.customerId);
    await row.reload();
    expect(row).toMatchObject({ customerId: made.body.customerId, status: 'contacted', version: 2 });
    const audit = await AuditEntry.findOne({
      where: { action: 'lead.linked', entityType: 'lead', entityId: String(row.id) },
    });
    expect(audit?.after).toEqual({ customerId: made.body.customerId, status: 'contacted' });
  });

  it('keeps a quoted lead quoted, and refuses a lead that does not exist without saving the build', async () => {
    const quoted = await lead('quoted');
    const made = await build(quoted.id, 'lead-quoted');
    expect(made.status).toBe(201);
    customers.push(made.body.customerId);
    await quoted.reload();
    expect(quoted).toMatchObject({ customerId: made.body.customerId, status: 'quoted' });

    const missing = await build(999999, 'lead-missing');
    expect(missing.status).toBe(422);
    expect(missing.body.errors).toEqual([expect.objectContaining({ field: 'leadId' })]);
    expect(await Build.count({ where: { vehicleLabel: 'Fixture truck (lead-missing)' } })).toBe(0);
  });
});

describe("the customer's copy", () => {
  it('e-mails the customer their private result link and says the shop will call', async () => {
    const { appUrl } = readRuntime();
    await clearRateLimits('lead-'); // other files post leads from this address too
    const email = `follow-up-copy-${crypto.randomBytes(4).toString('hex')}@example.com`;
    const answers = {
      engine: '5.3',
      use: 'towing',
      idle: 'smooth',
      emissions: 'no',
      transmission: 'automatic',
      driveline: 'stock',
      exhaust: 'stock',
      budget: '1500-3000',
      name: 'Fixture <Copy>',
      email,
      consent: true,
    };
    const res = await request(appUrl).post('/api/leads').send(answers);
    expect(res.status).toBe(201);
    leads.push(res.body.id);
    expect(res.body.customerNotified).toBe(true);

    const [mail] = await waitForMailsTo(email);
    expect(mail.subject).toMatch(/your cam shortlist and what happens next$/);
    expect(mail.text).toContain(`${appUrl}/ask/result/${res.body.token}`);
    expect(mail.text).toMatch(/will contact you to check your actual engine/);
    expect(mail.text).toContain('an estimate from your answers, not a quote');
    expect(mail.html).toContain('Fixture &lt;Copy&gt;');
    expect(mail.html).not.toContain('<Copy>');
    const page = await request(appUrl).get(`/ask/result/${res.body.token}`);
    expect(page.status).toBe(200);
    expect(page.text).toContain('The shop will contact you');
  });
});
