import crypto from 'node:crypto';
import request from 'supertest';
import { AuditEntry, Lead, LeadNote, ShopSettings } from '@/lib/db/models';
import { signIn } from '../support/auth';
import { connectTestDatabase, disconnectTestDatabase } from '../support/database';
import { clearRateLimits } from '../support/rate-limits';
import { postTestLead } from '../support/leads';
import { readRuntime } from '../support/runtime';

// GET /api/leads says which leads have gone cold, as the leads page does: `staleDays` on each new lead
// nobody has contacted or noted for the shop's number of days, and `staleTotal` over every page. Dates
// are set relative to now; the setting is put back and the leads removed afterwards.
const { appUrl } = readRuntime();
const tag = crypto.randomBytes(3).toString('hex');
const DAY_MS = 86_400_000;

type ListedLead = { id: number; status: string; staleDays: number | null };
type LeadList = { items: ListedLead[]; total: number; staleTotal: number; staleAfterDays: number };

describe('GET /api/leads flags leads that went cold', () => {
  let cookie: string;
  let settingsBefore = 2;
  const ids = { old: 0, young: 0 };

  const postLead = (name: string) => postTestLead(name, `stale-api-${tag}`);

  /** Walks the pages of new leads until it has seen the one asked for. */
  async function listed(id: number): Promise<{ lead: ListedLead; list: LeadList }> {
    for (let page = 1; page <= 50; page++) {
      const res = await request(appUrl).get(`/api/leads?status=new&pageSize=50&page=${page}`).set('Cookie', cookie);
      expect(res.status).toBe(200);
      const list = res.body as LeadList;
      const lead = list.items.find((l) => l.id === id);
      if (lead) return { lead, list };
      if (page * 50 >= list.total) break;
    }
    throw new Error(`lead ${id} is not in the list of new leads`);
  }

  beforeAll(async () => {
    const sequelize = connectTestDatabase();
    await clearRateLimits('lead-');
    settingsBefore = (await ShopSettings.findOne({ order: [['id', 'ASC']] }))!.leadStaleDays;
    await ShopSettings.update({ leadStaleDays: 3 }, { where: {} });
    cookie = await signIn('counter');
    ids.old = await postLead(`Oldacre ${tag}`);
    ids.young = await postLead(`Youngblood ${tag}`);
    await sequelize.query('UPDATE leads SET created_at = ? WHERE id = ?', {
      replacements: [new Date(Date.now() - 5 * DAY_MS - 3_600_000), ids.old],
    });
    await sequelize.query('UPDATE leads SET created_at = ? WHERE id = ?', {
      replacements: [new Date(Date.now() - 26 * 3_600_000), ids.young],
    });
  }, 30_000);

  afterAll(async () => {
    const leadIds = [ids.old, ids.young].filter(Boolean);
    await LeadNote.destroy({ where: { leadId: leadIds } });
    await AuditEntry.destroy({ where: { entityType: 'lead', entityId: leadIds.map(String) } });
    await Lead.destroy({ where: { id: leadIds } });
    await ShopSettings.update({ leadStaleDays: settingsBefore }, { where: {} });
    await clearRateLimits('lead-');
    await disconnectTestDatabase();
  });

  it('gives the days waited on a lead past the limit, null on a younger one, and the count over all pages', async () => {
    const { lead: old, list } = await listed(ids.old);
    expect(old.staleDays).toBe(5);
    expect(list.staleAfterDays).toBe(3);
    expect(list.staleTotal).toBeGreaterThanOrEqual(1);
    const { lead: young } = await listed(ids.young);
    expect(young.staleDays).toBeNull();
  });

  it('clears the flag once someone writes a note on the lead', async () => {
    const before = (await listed(ids.old)).list.staleTotal;
    const note = await request(appUrl)
      .post(`/api/leads/${ids.old}/notes`)
      .set('Cookie', cookie)
      .send({ body: 'Called, left a message.' });
    expect(note.status).toBe(201);
    const { lead, list } = await listed(ids.old);
    expect(lead.staleDays).toBeNull();
    expect(list.staleTotal).toBe(before - 1);
  });
});
