import { QueryTypes, type Sequelize } from 'sequelize';
import { listBuilds } from '@/lib/db/queries/builds';
import { loadDynoHistory } from '@/lib/db/queries/dyno-history';
import { listCustomers } from '@/lib/db/queries/customers';
import { listLeads } from '@/lib/db/queries/leads';
import { quoteExportChunks } from '@/lib/db/queries/quote-export';
import { listQuotes } from '@/lib/db/queries/quote-list';
import { reportSummary } from '@/lib/db/queries/reports';
import { BuildListQuerySchema } from '@/lib/schemas/build';
import { BuildProfileSchema } from '@/lib/schemas/build-profile';
import { CustomerListQuerySchema } from '@/lib/schemas/customer';
import { LeadListQuerySchema } from '@/lib/schemas/lead';
import { QuoteListQuerySchema } from '@/lib/schemas/quote-list';
import { addDays, daysInRange, utcDay } from '@/lib/schemas/report';
import { BULK, insertBulkRows, removeBulkRows } from '../support/bulk-rows';
import { connectTestDatabase, disconnectTestDatabase } from '../support/database';
import { DEMO } from '../support/demo';

// Every list and report query, exactly as the app sends it (captured from Sequelize's log while the
// real query function runs), goes through EXPLAIN against thousands of invented rows. A plan that reads
// a whole large table, or sorts more than a page of rows, fails — which is what every one of these did
// before database/migrations/20261204000100-list-and-report-indexes.js.

/** More rows than this in a full scan is a scan of a large table (the catalogue's cams are fewer). */
const FULL_SCAN_MAX_ROWS = 500;
/** The largest page a list hands out; sorting more than this means sorting the table, not a page. */
const SORT_MAX_ROWS = 200;

type PlanRow = {
  id: number | null;
  select_type: string;
  table: string | null;
  type: string | null;
  key: string | null;
  rows: unknown;
  Extra: string | null;
};

let sequelize: Sequelize;

/** The SELECTs a function sends (queries go through the routes' own schemas, defaults and all), with values inlined as the driver received them. */
async function selectsOf(run: () => Promise<unknown>): Promise<string[]> {
  const sent: string[] = [];
  // Sequelize reads options.logging at every query; its type leaves the field out.
  const options = (sequelize as unknown as { options: { logging?: unknown } }).options;
  const before = options.logging;
  options.logging = (message: string) => void sent.push(message.replace(/^Executing \([^)]*\): /, ''));
  try {
    await run();
  } finally {
    options.logging = before;
  }
  return sent.filter((sql) => /^\s*SELECT/i.test(sql));
}

/** The plan lines that read a large table whole or sort beyond a page, described for the failure message. */
async function offenders(sql: string): Promise<string[]> {
  const plan = await sequelize.query<PlanRow>(`EXPLAIN ${sql}`, { type: QueryTypes.SELECT });
  return plan.flatMap((row) => {
    // Derived tables and unions are judged by their own lines (the SELECTs inside them).
    if (!row.table || row.table.startsWith('<')) return [];
    const rows = Number(row.rows ?? 0);
    const found: string[] = [];
    if (row.type === 'ALL' && rows > FULL_SCAN_MAX_ROWS) found.push(`full scan of ${row.table} (${rows} rows)`);
    if ((row.Extra ?? '').includes('Using filesort') && rows > SORT_MAX_ROWS)
      found.push(`filesort of ${rows} rows of ${row.table} (${row.key ?? 'no index'})`);
    return found.map((f) => `${f} in: ${sql.slice(0, 200)}`);
  });
}

async function expectIndexedPlans(run: () => Promise<unknown>) {
  const selects = await selectsOf(run);
  expect(selects.length).toBeGreaterThan(0); // a query that was never captured proves nothing
  const bad = (await Promise.all(selects.map(offenders))).flat();
  expect(bad).toEqual([]);
}

const today = utcDay(new Date());
const oneYear = { from: addDays(today, -364), to: today, days: daysInRange(addDays(today, -364), today) };

beforeAll(async () => {
  sequelize = connectTestDatabase();
  const made = await insertBulkRows(sequelize);
  expect(made.quotes).toBe(BULK.customers * BULK.quotesPerCustomer);
}, 120_000);

afterAll(async () => {
  await removeBulkRows(sequelize);
  await sequelize.query('ANALYZE TABLE customers, builds, quotes, quote_lines, payments, leads');
  await disconnectTestDatabase();
});

describe('EXPLAIN of the lists', () => {
  it('the quote list, newest change first, by state, a late page: no scan, no sort of the table', async () => {
    await expectIndexedPlans(() => listQuotes(QuoteListQuerySchema.parse({ page: '1', pageSize: '50' })));
    await expectIndexedPlans(() =>
      listQuotes(QuoteListQuerySchema.parse({ status: 'sent', page: '1', pageSize: '50' })),
    );
    await expectIndexedPlans(() => listQuotes(QuoteListQuerySchema.parse({ page: '40', pageSize: '50' })));
  });

  it('the quote search by number, customer and vehicle', async () => {
    await expectIndexedPlans(() =>
      listQuotes(QuoteListQuerySchema.parse({ q: 'Q-1993-0001', page: '1', pageSize: '50' })),
    );
    await expectIndexedPlans(() =>
      listQuotes(QuoteListQuerySchema.parse({ q: 'Tamsin Quillfeather12', page: '1', pageSize: '50' })),
    );
    await expectIndexedPlans(() =>
      listQuotes(QuoteListQuerySchema.parse({ q: 'wagon', status: 'draft', page: '1', pageSize: '50' })),
    );
  });

  it('customers by name and by search (full-text words, a short name prefix)', async () => {
    await expectIndexedPlans(() => listCustomers(CustomerListQuerySchema.parse({ page: '1', pageSize: '25' })));
    await expectIndexedPlans(() =>
      listCustomers(CustomerListQuerySchema.parse({ q: 'Ostrowind42', page: '1', pageSize: '25' })),
    );
    await expectIndexedPlans(() =>
      listCustomers(CustomerListQuerySchema.parse({ q: 'Ta', page: '1', pageSize: '25' })),
    );
  });

  it('builds, newest first, searched, and one customer’s', async () => {
    await expectIndexedPlans(() => listBuilds(BuildListQuerySchema.parse({ page: '1', pageSize: '25' })));
    await expectIndexedPlans(() =>
      listBuilds(BuildListQuerySchema.parse({ q: 'Kettleby7', page: '1', pageSize: '25' })),
    );
    await expectIndexedPlans(() =>
      listBuilds(BuildListQuerySchema.parse({ customerId: '1', page: '1', pageSize: '25' })),
    );
  });

  it('leads, newest first and by status', async () => {
    await expectIndexedPlans(() => listLeads(LeadListQuerySchema.parse({ page: '1', pageSize: '25' })));
    await expectIndexedPlans(() => listLeads(LeadListQuerySchema.parse({ status: 'new', page: '3', pageSize: '25' })));
  });
});

describe('EXPLAIN of the advisor’s measured history', () => {
  it('reads dyno_gains by similar displacement (and cam), in index order, never the whole table', async () => {
    const [demo] = await sequelize.query<{ profile: unknown }>('SELECT profile FROM builds WHERE id = :id', {
      replacements: { id: DEMO.builds.whitlockTowingTruck },
      type: QueryTypes.SELECT,
    });
    const profile = BuildProfileSchema.parse(
      typeof demo.profile === 'string' ? JSON.parse(demo.profile) : demo.profile,
    );
    const [cam] = await sequelize.query<{ camId: number }>(
      'SELECT cam_id AS camId FROM dyno_gains ORDER BY id LIMIT 1',
      { type: QueryTypes.SELECT },
    );
    await expectIndexedPlans(() => loadDynoHistory(profile));
    await expectIndexedPlans(() => loadDynoHistory(profile, [cam.camId]));
    const selects = await selectsOf(() => loadDynoHistory(profile));
    for (const sql of selects) {
      const plan = await sequelize.query<PlanRow>(`EXPLAIN ${sql}`, { type: QueryTypes.SELECT });
      expect(plan.map((row) => [row.type, row.key, (row.Extra ?? '').includes('filesort')])).toEqual([
        ['range', 'dyno_gains_similar', false],
      ]);
    }
  });
});

describe('EXPLAIN of the reports', () => {
  it('the one-year summary reads ranges on indexes', async () => {
    await expectIndexedPlans(() => reportSummary(oneYear));
  });

  it('the CSV export reads each chunk on the (created_at, id) index', async () => {
    await expectIndexedPlans(async () => {
      let chunks = 0;
      for await (const rows of quoteExportChunks(oneYear, 500)) {
        expect(rows.length).toBeGreaterThan(0);
        if (++chunks === 2) break;
      }
      expect(chunks).toBe(2);
    });
  });
});
