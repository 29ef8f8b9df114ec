import type { Sequelize } from 'sequelize';
import { seededRandom } from '@/lib/seeded-random';

// Enough invented rows that MariaDB's optimizer plans as it would for a busy shop: with the demo's
// three quotes a full scan is the cheapest plan and no EXPLAIN could tell a missing index. Every row
// is marked (customers and leads named "Bulkrow …", quotes Q-19xx-…) and removed again afterwards.

export const BULK = { customers: 3_000, quotesPerCustomer: 2, leads: 3_000, paidEvery: 4, years: 3 } as const;
export const BULK_MARK = 'Bulkrow';

const FIRST = [
  'Tamsin',
  'Orrin',
  'Bexley',
  'Corvina',
  'Idris',
  'Marlowe',
  'Sabeth',
  'Teodric',
  'Wrenna',
  'Halvard',
  'Ysolde',
  'Pellam',
];
const LAST = [
  'Quillfeather',
  'Brackenridge',
  'Ostrowind',
  'Tallowmere',
  'Dunfallow',
  'Serrick',
  'Ambervale',
  'Kettleby',
  'Morrowgate',
  'Vantreese',
];
const VEHICLES = ['crew-cab pickup', 'long-bed work truck', 'two-door coupe', 'wagon', 'club-cab pickup', 'sedan'];
const STATUSES = ['draft', 'sent', 'accepted', 'deposit-paid', 'declined', 'expired', 'cancelled'] as const;
const LEAD_STATUSES = ['new', 'contacted', 'quoted', 'closed'] as const;

const pad = (n: number) => String(n).padStart(2, '0');
const sqlTime = (ms: number) => {
  const d = new Date(ms);
  return `${d.getUTCFullYear()}-${pad(d.getUTCMonth() + 1)}-${pad(d.getUTCDate())} ${pad(d.getUTCHours())}:${pad(d.getUTCMinutes())}:${pad(d.getUTCSeconds())}`;
};

async function insertRows(sequelize: Sequelize, table: string, columns: string[], rows: unknown[][]) {
  const e = (v: unknown) => sequelize.escape(v as string);
  for (let i = 0; i < rows.length; i += 1_000) {
    const values = rows
      .slice(i, i + 1_000)
      .map((r) => `(${r.map(e).join(', ')})`)
      .join(',\n');
    await sequelize.query(`INSERT INTO ${table} (${columns.join(', ')}) VALUES ${values}`);
  }
}

async function ids(sequelize: Sequelize, sql: string): Promise<number[]> {
  const [rows] = await sequelize.query(sql);
  return (rows as { id: number }[]).map((r) => Number(r.id));
}

/** Removes every marked row (also what an interrupted earlier run left). */
export async function removeBulkRows(sequelize: Sequelize) {
  const customers = await ids(sequelize, `SELECT id FROM customers WHERE name LIKE '${BULK_MARK} %'`);
  if (customers.length) {
    const list = customers.join(',');
    await sequelize.query(
      `DELETE p FROM payments p JOIN quotes q ON q.id = p.quote_id WHERE q.customer_id IN (${list})`,
    );
    await sequelize.query(`DELETE FROM quotes WHERE customer_id IN (${list})`); // lines go with them (cascade)
    await sequelize.query(`DELETE FROM customers WHERE id IN (${list})`); // builds go with them (cascade)
  }
  await sequelize.query(`DELETE FROM leads WHERE name LIKE '${BULK_MARK} %'`);
}

/** Customers, builds, quotes over three years with cam and part lines, deposits, leads; then fresh statistics. */
export async function insertBulkRows(sequelize: Sequelize, now = Date.now()) {
  await removeBulkRows(sequelize);
  const rnd = seededRandom(11);
  const pick = <T>(list: readonly T[]) => list[Math.floor(rnd() * list.length)];
  const span = BULK.years * 365 * 86_400_000;
  const when = () => now - Math.floor(rnd() * span);
  const [cams] = (await sequelize.query('SELECT id FROM cams WHERE is_factory_baseline = 0 ORDER BY id')) as [
    { id: number }[],
    unknown,
  ];
  const [parts] = (await sequelize.query('SELECT id FROM parts ORDER BY id')) as [{ id: number }[], unknown];

  const people = Array.from({ length: BULK.customers }, (_, i) => {
    const first = pick(FIRST);
    const last = pick(LAST);
    const at = sqlTime(when());
    return [
      `${BULK_MARK} ${first} ${last}${i}`,
      `${first}.${last}${i}@bulkrow.example`.toLowerCase(),
      `555-${String(i).padStart(4, '0')}`,
      at,
      at,
    ];
  });
  await insertRows(sequelize, 'customers', ['name', 'email', 'phone', 'created_at', 'updated_at'], people);
  const customerIds = await ids(sequelize, `SELECT id FROM customers WHERE name LIKE '${BULK_MARK} %' ORDER BY id`);

  await insertRows(
    sequelize,
    'builds',
    ['customer_id', 'vehicle_label', 'profile', 'created_at', 'updated_at'],
    customerIds.map((id, i) => [
      id,
      `${2000 + (i % 24)} ${pick(VEHICLES)}, ${pick(['4.8', '5.3', '5.7', '6.2'])} L`,
      '{}',
      people[i][3],
      sqlTime(Date.parse(`${people[i][3]}Z`) + 86_400_000),
    ]),
  );
  const builds = await ids(
    sequelize,
    `SELECT b.id FROM builds b JOIN customers c ON c.id = b.customer_id WHERE c.name LIKE '${BULK_MARK} %' ORDER BY b.customer_id`,
  );
  // A measured result per build for the advisor's history, engines from 230 to 460 in³ (plans only: the
  // builds' profiles are empty, so these rows are written here rather than filed from dyno runs).
  await insertRows(
    sequelize,
    'dyno_gains',
    [
      'build_id',
      'cam_id',
      'dyno_type',
      'displacement_ci',
      'intake_flow_cfm',
      'headers',
      'exhaust_system',
      'intake_manifold',
      'gain_pct_peak_hp',
      'gain_pct_by_rpm',
    ],
    builds.map((id) => [
      id,
      pick(cams).id,
      'chassis',
      230 + rnd() * 230,
      190 + rnd() * 130,
      pick(['manifold', 'shorty', 'long-tube']),
      'full',
      'truck',
      rnd() * 15,
      JSON.stringify([
        { rpm: 3000, gainPct: 1 },
        { rpm: 3250, gainPct: 2 },
      ]),
    ]),
  );

  const quotes: unknown[][] = [];
  customerIds.forEach((customerId, i) => {
    for (let k = 0; k < BULK.quotesPerCustomer; k++) {
      const created = when();
      const status = pick(STATUSES);
      const total = 40_000 + Math.floor(rnd() * 200_000);
      const sent = status === 'draft' ? null : sqlTime(created + 3_600_000);
      const n = i * BULK.quotesPerCustomer + k;
      quotes.push([
        `Q-${1990 + (n % 9)}-${String(n).padStart(5, '0')}`,
        customerId,
        builds[i],
        pick(cams).id,
        status,
        total,
        0,
        total,
        Math.round(total / 5),
        sent,
        sqlTime(created),
        sqlTime(created + Math.floor(rnd() * 20) * 86_400_000),
      ]);
    }
  });
  await insertRows(
    sequelize,
    'quotes',
    [
      'number',
      'customer_id',
      'build_id',
      'cam_id',
      'status',
      'subtotal_cents',
      'tax_cents',
      'total_cents',
      'deposit_cents',
      'sent_at',
      'created_at',
      'updated_at',
    ],
    quotes,
  );
  const [made] = (await sequelize.query(
    `SELECT q.id, q.cam_id AS camId, q.status, q.deposit_cents AS deposit, q.created_at AS createdAt FROM quotes q JOIN customers c ON c.id = q.customer_id WHERE c.name LIKE '${BULK_MARK} %'`,
  )) as [{ id: number; camId: number; status: string; deposit: number; createdAt: Date }[], unknown];

  const lines: unknown[][] = [];
  const payments: unknown[][] = [];
  made.forEach((q, i) => {
    const at = sqlTime(new Date(q.createdAt).getTime());
    lines.push([q.id, 'cam', q.camId, null, 'Bulkrow cam line', '1.00', 30_000, 30_000, 0, at, at]);
    lines.push([q.id, 'part', null, pick(parts).id, 'Bulkrow part line', '16.00', 1_200, 19_200, 1, at, at]);
    if (q.status === 'deposit-paid' || i % BULK.paidEvery === 0) {
      const paidAt = sqlTime(new Date(q.createdAt).getTime() + 2 * 86_400_000);
      payments.push([
        q.id,
        `cs_bulkrow_${q.id}`,
        q.deposit,
        i % 7 === 0 ? 1_000 : 0,
        i % 7 === 0 ? 'partially-refunded' : 'paid',
        paidAt,
        at,
        at,
      ]);
    }
  });
  await insertRows(
    sequelize,
    'quote_lines',
    [
      'quote_id',
      'kind',
      'cam_id',
      'part_id',
      'description',
      'quantity',
      'unit_price_cents',
      'total_cents',
      'sort_order',
      'created_at',
      'updated_at',
    ],
    lines,
  );
  await insertRows(
    sequelize,
    'payments',
    [
      'quote_id',
      'provider_session_id',
      'amount_cents',
      'refunded_cents',
      'status',
      'paid_at',
      'created_at',
      'updated_at',
    ],
    payments,
  );

  const answers = JSON.stringify({
    engine: '5.3',
    use: 'towing',
    idle: 'smooth',
    emissions: 'yes',
    transmission: 'automatic',
    driveline: 'stock',
    exhaust: 'stock',
    budget: 'unsure',
    name: 'Bulkrow',
    consent: true,
  });
  await insertRows(
    sequelize,
    'leads',
    ['name', 'email', 'answers', 'status', 'created_at', 'updated_at'],
    Array.from({ length: BULK.leads }, (_, i) => {
      const at = sqlTime(when());
      return [
        `${BULK_MARK} ${pick(FIRST)} ${pick(LAST)}`,
        `lead${i}@bulkrow.example`,
        answers,
        pick(LEAD_STATUSES),
        at,
        at,
      ];
    }),
  );

  // Fresh statistics now, not whenever InnoDB gets round to it, so the plans are the ones a full table gets.
  await sequelize.query('ANALYZE TABLE customers, builds, quotes, quote_lines, payments, leads, dyno_gains');
  return { customers: customerIds.length, quotes: made.length, payments: payments.length };
}
