import { QueryTypes, type Sequelize } from 'sequelize';
import { signedInAgent } from '../support/auth';
import { BULK_MARK, insertBulkRows, removeBulkRows } from '../support/bulk-rows';
import { connectTestDatabase, disconnectTestDatabase } from '../support/database';
import { expectedReport } from '../support/report-expected';
import type { QuoteSummary } from '@/lib/db/queries/quote-list';

// Lists and the CSV over HTTP with thousands of invented rows: every quote is reachable a page at a
// time, the search finds a quote by number, customer and vehicle, and the export has every row of a
// range well past one chunk (it used to stop at 10,000 without saying so).

type Agent = Awaited<ReturnType<typeof signedInAgent>>;
type QuotePage = { items: QuoteSummary[]; total: number; page: number; pageSize: number };

let sequelize: Sequelize;
let counter: Agent;
let manager: Agent;
const rows = <T extends object>(sql: string, replacements: Record<string, unknown> = {}) =>
  sequelize.query<T>(sql, { type: QueryTypes.SELECT, replacements });

beforeAll(async () => {
  sequelize = connectTestDatabase();
  await insertBulkRows(sequelize);
  counter = await signedInAgent('counter');
  manager = await signedInAgent('manager');
}, 120_000);

afterAll(async () => {
  await removeBulkRows(sequelize);
  await disconnectTestDatabase();
});

describe('GET /api/quotes, paged', () => {
  it('pages through every sent quote exactly once, newest change first, with the total', async () => {
    const [{ count }] = await rows<{ count: unknown }>("SELECT COUNT(*) AS count FROM quotes WHERE status = 'sent'");
    const seen: number[] = [];
    let last = '9999';
    for (let page = 1; ; page++) {
      const res = await counter.get(`/api/quotes?status=sent&pageSize=200&page=${page}`).expect(200);
      const body = res.body as QuotePage;
      expect(body).toMatchObject({ total: Number(count), page, pageSize: 200 });
      for (const q of body.items) {
        expect(q.updatedAt <= last).toBe(true);
        last = q.updatedAt;
        seen.push(q.id);
      }
      if (body.items.length < 200) break;
    }
    expect(seen.length).toBe(Number(count));
    expect(new Set(seen).size).toBe(seen.length);
  });

  it('answers without paging parameters as before: items, now with 50 of them and the total', async () => {
    const res = await counter.get('/api/quotes').expect(200);
    expect(res.body.items).toHaveLength(50);
    expect(res.body.total).toBeGreaterThan(6_000);
    expect(res.body.items[0]).toEqual(
      expect.objectContaining({
        number: expect.any(String),
        customerName: expect.any(String),
        status: expect.any(String),
      }),
    );
    expect(res.body.items[0]).toHaveProperty('paymentStatus');
  });

  it('finds a quote by its number, its customer’s name or e-mail, and its vehicle', async () => {
    const [one] = await rows<{
      id: number;
      number: string;
      name: string;
      email: string;
      vehicle: string;
      buildId: number;
    }>(
      `SELECT q.id, q.number, c.name, c.email, b.vehicle_label AS vehicle, b.id AS buildId FROM quotes q JOIN customers c ON c.id = q.customer_id JOIN builds b ON b.id = q.build_id
        WHERE c.name LIKE :mark ORDER BY q.id LIMIT 1 OFFSET 77`,
      { mark: `${BULK_MARK} %` },
    );
    const find = async (q: string) =>
      (await counter.get(`/api/quotes?pageSize=200&q=${encodeURIComponent(q)}`).expect(200)).body as QuotePage;
    expect((await find(one.number)).items.map((i) => i.id)).toEqual([one.id]);
    const surname = one.name.split(' ').at(-1)!; // the row number is part of it: few customers share its start
    const byName = await find(surname);
    expect(byName.items.map((i) => i.id)).toContain(one.id);
    expect(byName.items.every((i) => i.customerName.split(' ').some((w) => w.startsWith(surname)))).toBe(true);
    expect((await find(one.email)).items.map((i) => i.id)).toContain(one.id);
    const byVehicle = await find(one.vehicle);
    expect(byVehicle.items.map((i) => i.id)).toContain(one.id);
    // Every word with three letters or more must start a word of the label: "2003 wagon, 5.3 L" finds 2003 wagons.
    expect(byVehicle.items.every((i) => i.vehicleLabel?.startsWith(one.vehicle.split(',')[0]))).toBe(true);
    // Wildcards are literal, and text with no word in it finds nothing rather than everything.
    expect((await find('%%%')).total).toBe(0);
  });

  it('refuses bad paging with 422 naming the field', async () => {
    for (const [query, field] of [
      ['pageSize=0', 'pageSize'],
      ['pageSize=201', 'pageSize'],
      ['pageSize=2.5', 'pageSize'],
      ['page=0', 'page'],
      ['page=abc', 'page'],
      ['status=open', 'status'],
    ]) {
      const res = await counter.get(`/api/quotes?${query}`).expect(422);
      expect(res.body.errors.map((e: { field: string }) => e.field)).toContain(field);
    }
  });
});

describe('GET /api/customers search', () => {
  it('finds a customer by a word of the name, the e-mail or the phone, and by the start of the name', async () => {
    const [one] = await rows<{ id: number; name: string; email: string; phone: string }>(
      'SELECT id, name, email, phone FROM customers WHERE name LIKE :mark ORDER BY id LIMIT 1 OFFSET 123',
      { mark: `${BULK_MARK} %` },
    );
    for (const q of [
      one.name.split(' ').at(-1)!,
      one.email,
      one.phone,
      one.name.split(' ').slice(1).join(' ').toLowerCase(),
    ]) {
      const res = await counter.get(`/api/customers?pageSize=200&q=${encodeURIComponent(q)}`).expect(200);
      expect(res.body.items.map((c: { id: number }) => c.id)).toContain(one.id);
    }
    const short = await counter.get('/api/customers?pageSize=5&q=Bu').expect(200);
    expect(short.body.total).toBeGreaterThanOrEqual(3_000);
    expect(short.body.items.every((c: { name: string }) => c.name.startsWith('Bu'))).toBe(true);
  });
});

describe('GET /api/reports/quotes.csv', () => {
  it('streams every quote of a year, far more than one chunk', async () => {
    const to = new Date().toISOString().slice(0, 10);
    const from = new Date(Date.now() - 364 * 86_400_000).toISOString().slice(0, 10);
    const res = await manager
      .get(`/api/reports/quotes.csv?from=${from}&to=${to}`)
      .buffer(true)
      .parse((r, done) => {
        let text = '';
        r.setEncoding('utf8');
        r.on('data', (c: string) => (text += c));
        r.on('end', () => done(null, text));
      });
    expect(res.status).toBe(200);
    const lines = (res.body as string)
      .replace(/^\uFEFF/, '')
      .trim()
      .split('\r\n');
    const [{ count }] = await rows<{ count: unknown }>(
      'SELECT COUNT(*) AS count FROM quotes WHERE created_at >= :from AND created_at < DATE_ADD(:to, INTERVAL 1 DAY)',
      { from, to },
    );
    expect(Number(count)).toBeGreaterThan(1_500);
    expect(lines.length - 1).toBe(Number(count));
    const numbers = lines.slice(1).map((l) => l.split(',')[0]);
    expect(new Set(numbers).size).toBe(numbers.length); // no row twice at a chunk boundary
  });
});

describe('GET /api/reports/summary over thousands of rows', () => {
  it('answers for one year exactly what a plain computation over every row gives (demo and invented rows)', async () => {
    const to = new Date().toISOString().slice(0, 10);
    const from = new Date(Date.now() - 364 * 86_400_000).toISOString().slice(0, 10);
    const expected = await expectedReport(sequelize, from, to);
    expect(expected.created.count).toBeGreaterThan(1_500); // the invented rows are in the range
    expect(expected.margin.total.revenueCents).toBeGreaterThan(0);
    const res = await manager.get(`/api/reports/summary?from=${from}&to=${to}`).expect(200);
    expect(res.body).toEqual(expected);
  });
});
