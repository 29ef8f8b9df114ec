import { QueryTypes, type Sequelize } from 'sequelize';
import { connectTestDatabase, disconnectTestDatabase } from '../support/database';
import { DEMO, DEMO_KEYS } from '../support/demo';

// Every name in tests/support/demo.ts is the row it claims, read back from the seeded test database by
// its code or name: if a reseed moves a row, this fails naming it, not a test that happens to use the id.
let sequelize: Sequelize;
beforeAll(() => {
  sequelize = connectTestDatabase();
});
afterAll(() => disconnectTestDatabase());

// [DEMO group, table, the SQL expression that names a row]
const GROUPS: [keyof typeof DEMO_KEYS, string, string][] = [
  ['users', 'users', 'email'],
  ['suppliers', 'suppliers', 'name'],
  ['cams', 'cams', 'sku'],
  ['parts', 'parts', 'sku'],
  ['labor', 'labor_operations', 'code'],
  ['needRules', 'need_rules', "CONCAT(kind, IF(vehicle_class IS NULL, '', CONCAT('/', vehicle_class)))"],
  ['customers', 'customers', 'email'],
  ['builds', 'builds', '(SELECT c.email FROM customers c WHERE c.id = builds.customer_id)'],
  ['quotes', 'quotes', 'number'],
];

describe('the demo seed ids (tests/support/demo.ts)', () => {
  it.each(GROUPS)('DEMO.%s: every id is the %s row with that key', async (group, table, keyExpression) => {
    const names = DEMO_KEYS[group] as Record<string, string>;
    const ids = DEMO[group] as Record<string, number>;
    const rows = await sequelize.query<{ id: number; k: string }>(
      `SELECT id, ${keyExpression} AS k FROM ${table} WHERE id IN (:ids)`,
      {
        replacements: { ids: Object.values(ids) },
        type: QueryTypes.SELECT,
      },
    );
    const found = Object.fromEntries(rows.map((r) => [r.id, r.k]));
    const claimed = Object.fromEntries(Object.keys(names).map((name) => [name, names[name]]));
    const actual = Object.fromEntries(Object.keys(names).map((name) => [name, found[ids[name]] ?? '(no such row)']));
    expect(actual).toEqual(claimed);
  });

  it('names every demo cam, part and labour operation the seed made', async () => {
    for (const [group, table] of [
      ['cams', 'cams'],
      ['parts', 'parts'],
      ['labor', 'labor_operations'],
    ] as const) {
      const seeded = await sequelize.query<{ n: number }>(`SELECT COUNT(*) AS n FROM ${table} WHERE id <= :last`, {
        replacements: { last: Math.max(...Object.values(DEMO[group])) },
        type: QueryTypes.SELECT,
      });
      expect([group, Number(seeded[0].n)]).toEqual([group, Object.keys(DEMO[group]).length]);
    }
  });
});
