import Papa from 'papaparse';
import request from 'supertest';
import { Op } from 'sequelize';
import { AuditEntry, Cam, Supplier } from '@/lib/db/models';
import { signIn } from '../support/auth';
import { connectTestDatabase, disconnectTestDatabase } from '../support/database';
import { postDeclaringSize } from '../support/early-refusal';
import { readRuntime } from '../support/runtime';

// The cam spreadsheet import and export over HTTP. Rows made here use the run's SKU prefix and an
// invented supplier, both removed at the end.
const PREFIX = `TI${Date.now().toString(36).toUpperCase()}`;
const NEW_SUPPLIER = `Test Import Supplier ${PREFIX}`;
const app = () => request(readRuntime().appUrl);
let manager: string;
let counter: string;

const HEADER =
  'sku,name,supplier,intake_duration_050,exhaust_duration_050,intake_advertised,exhaust_advertised,intake_lift_in,exhaust_lift_in,lsa,intake_centerline,price,cost,stock_on_hand,active,notes';
const row = (
  sku: string,
  overrides: Partial<Record<'name' | 'supplier' | 'in050' | 'lift' | 'lsa' | 'price' | 'notes', string>> = {},
) =>
  [
    sku,
    overrides.name ?? `Import Grind ${sku}`,
    overrides.supplier ?? NEW_SUPPLIER,
    overrides.in050 ?? '212',
    '218',
    '264',
    '270',
    overrides.lift ?? '0.565"',
    '0.565',
    overrides.lsa ?? '113',
    '109',
    overrides.price ?? '$419.00',
    '260',
    '2',
    'yes',
    overrides.notes ?? '',
  ].join(',');

function upload(
  cookie: string,
  csv: string | Buffer,
  mode: 'preview' | 'commit',
  name = 'cams.csv',
  type = 'text/csv',
) {
  return app()
    .post('/api/cams/import')
    .set('Cookie', cookie)
    .field('mode', mode)
    .attach('file', Buffer.isBuffer(csv) ? csv : Buffer.from(csv, 'utf8'), { filename: name, contentType: type });
}

beforeAll(async () => {
  connectTestDatabase();
  [manager, counter] = await Promise.all([signIn('manager'), signIn('counter')]);
});

afterAll(async () => {
  await Cam.destroy({ where: { sku: { [Op.like]: `${PREFIX}%` } } });
  await Supplier.destroy({ where: { name: NEW_SUPPLIER } });
  await disconnectTestDatabase();
});

describe('cam import', () => {
  const good = [
    HEADER,
    row(`${PREFIX}-1`),
    row(`${PREFIX}-2`, { name: 'Second Import Grind', price: '"1,049.5"' }),
  ].join('\r\n');

  it('previews a good file row by row and writes nothing', async () => {
    const response = await upload(manager, good, 'preview');
    expect(response.status).toBe(200);
    expect(response.body).toMatchObject({
      mode: 'preview',
      committed: false,
      rowCount: 2,
      summary: { create: 2, update: 0, unchanged: 0, error: 0 },
      errors: [],
    });
    expect(response.body.suppliersToAdd).toEqual([NEW_SUPPLIER]);
    expect(response.body.rows.map((r: { row: number; action: string }) => [r.row, r.action])).toEqual([
      [2, 'create'],
      [3, 'create'],
    ]);
    expect(await Cam.count({ where: { sku: { [Op.like]: `${PREFIX}%` } } })).toBe(0);
  });

  it('commits a good file: cams created with prices in cents, the new supplier added, audit rows written', async () => {
    const response = await upload(manager, good, 'commit');
    expect(response.status).toBe(200);
    expect(response.body).toMatchObject({
      committed: true,
      result: { created: 2, updated: 0, suppliersAdded: [NEW_SUPPLIER] },
    });
    const cams = await Cam.findAll({ where: { sku: { [Op.like]: `${PREFIX}%` } }, order: [['sku', 'ASC']] });
    expect(cams.map((c) => [c.sku, c.priceCents, c.costCents, c.intakeLiftIn])).toEqual([
      [`${PREFIX}-1`, 41900, 26000, 0.565],
      [`${PREFIX}-2`, 104950, 26000, 0.565],
    ]);
    const supplier = await Supplier.findOne({ where: { name: NEW_SUPPLIER } });
    expect(cams[0].supplierId).toBe(supplier?.id);
    expect(await AuditEntry.count({ where: { action: 'cam.imported', entityId: cams.map((c) => String(c.id)) } })).toBe(
      2,
    );
  });

  it('previews an update of an existing SKU with the changed fields, and commits it', async () => {
    const csv = [HEADER, row(`${PREFIX}-1`, { price: '429.00' })].join('\n');
    const preview = await upload(manager, csv, 'preview');
    expect(preview.body.rows[0]).toMatchObject({
      action: 'update',
      changes: [{ field: 'priceCents', column: 'price', from: 41900, to: 42900 }],
    });
    const commit = await upload(manager, csv, 'commit');
    expect(commit.body.result).toMatchObject({ created: 0, updated: 1 });
    expect((await Cam.findOne({ where: { sku: `${PREFIX}-1` } }))?.version).toBe(2);
  });

  it('lists every error with its row and column, and a commit of that file writes nothing at all', async () => {
    const csv = [
      HEADER,
      row(`${PREFIX}-3`),
      row(`${PREFIX}-4`, { in050: '2120', lift: 'big' }),
      row(`${PREFIX}-3`, { price: '12.345' }),
      row('', { lsa: '140' }),
    ].join('\n');
    const preview = await upload(manager, csv, 'preview');
    expect(preview.status).toBe(200);
    const errors = preview.body.errors.map((e: { row: number; column: string }) => `${e.row}:${e.column}`);
    expect(errors).toEqual(
      expect.arrayContaining(['3:intake_duration_050', '3:intake_lift_in', '4:sku', '4:price', '5:sku', '5:lsa']),
    );
    expect(preview.body.summary).toMatchObject({ create: 1, error: 3 });

    const commit = await upload(manager, csv, 'commit');
    expect(commit.status).toBe(422);
    expect(commit.body.committed).toBe(false);
    expect(commit.body.message).toMatch(/Nothing was imported/);
    expect(await Cam.count({ where: { sku: { [Op.in]: [`${PREFIX}-3`, `${PREFIX}-4`] } } })).toBe(0);
  });

  it('names a missing required column against the header row', async () => {
    const response = await upload(manager, 'sku,name\nX-1,Only a name', 'preview');
    expect(response.status).toBe(200);
    expect(response.body.errors).toEqual(expect.arrayContaining([expect.objectContaining({ row: 1, column: 'lsa' })]));
  });

  it('refuses a file over 2 MB with 413 from its declared size, before reading it', async () => {
    const boundary = 'lobewise-import-limit';
    const head = Buffer.from(
      `--${boundary}\r\nContent-Disposition: form-data; name="mode"\r\n\r\npreview\r\n` +
        `--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="cams.csv"\r\nContent-Type: text/csv\r\n\r\n${HEADER}\n`,
    );
    const response = await postDeclaringSize(
      `${readRuntime().appUrl}/api/cams/import`,
      { Cookie: manager, 'Content-Type': `multipart/form-data; boundary=${boundary}` },
      head,
      Math.ceil(2.1 * 1024 * 1024),
    );
    expect(response.status).toBe(413);
    expect(response.json.message).toMatch(/2 MB/);
  });

  it('refuses a workbook, a PDF and binary data with 415, whatever the name says', async () => {
    const workbook = Buffer.concat([Buffer.from([0x50, 0x4b, 0x03, 0x04]), Buffer.alloc(200, 1)]);
    const asCsv = await upload(manager, workbook, 'preview', 'cams.csv', 'text/csv');
    expect(asCsv.status).toBe(415);
    expect(asCsv.body.message).toMatch(/workbook/);
    expect((await upload(manager, Buffer.from('%PDF-1.7\n...'), 'preview', 'cams.csv')).status).toBe(415);
    expect((await upload(manager, Buffer.from([0x73, 0x6b, 0x75, 0x00, 0x01]), 'preview', 'cams.csv')).status).toBe(
      415,
    );
    expect((await upload(manager, good, 'preview', 'cams.json', 'application/json')).status).toBe(415);
  });

  it('refuses a counter (403) and a JSON body (415)', async () => {
    expect((await upload(counter, good, 'preview')).status).toBe(403);
    expect((await app().post('/api/cams/import').set('Cookie', manager).send({ mode: 'preview' })).status).toBe(415);
  });

  it('serves a template whose header the import accepts', async () => {
    const template = await app().get('/api/cams/import/template').set('Cookie', counter);
    expect(template.status).toBe(200);
    expect(template.headers['content-type']).toMatch(/text\/csv/);
    const header = template.text.split('\r\n')[0].split(',');
    expect(header).toEqual(
      expect.arrayContaining(['sku', 'name', 'intake_duration_050', 'lsa', 'intake_centerline', 'price']),
    );
    const preview = await upload(manager, template.text, 'preview');
    expect(preview.body.errors).toEqual([]);
  });
});

describe('cam export', () => {
  it('neutralises cells a spreadsheet would run as formulas, and re-imports them unchanged', async () => {
    const names = ['=HYPERLINK("http://x.example","click")', '+1+1', '-2+3', '@SUM(A1)'];
    const csv = [
      HEADER,
      ...names.map((name, i) =>
        row(`${PREFIX}-F${i}`, { name: `"${name.replace(/"/g, '""')}"`, notes: 'formula test' }),
      ),
    ].join('\n');
    const imported = await upload(manager, csv, 'commit');
    expect(imported.status).toBe(200);
    expect(imported.body.result.created).toBe(names.length);

    const exported = await app().get('/api/cams/export').set('Cookie', manager);
    expect(exported.status).toBe(200);
    expect(exported.headers['content-type']).toMatch(/text\/csv/);
    expect(exported.headers['content-disposition']).toMatch(/attachment; filename="lobewise-cams-/);
    const parsed = Papa.parse<Record<string, string>>(exported.text.replace(/^\uFEFF/, ''), {
      header: true,
      skipEmptyLines: true,
    });
    const ours = parsed.data.filter((r) => r.sku.startsWith(`${PREFIX}-F`)).sort((a, b) => a.sku.localeCompare(b.sku));
    expect(ours.map((r) => r.name)).toEqual(names.map((n) => `'${n}`));
    for (const r of parsed.data) expect(r.name).not.toMatch(/^[=+\-@\t\r]/);
    expect(parsed.data.find((r) => r.sku === 'LV-212')).toMatchObject({ price: '419.00', lsa: '113', archived: 'no' });

    const again = await upload(manager, exported.text, 'preview');
    expect(again.body.errors).toEqual([]);
    const mine = again.body.rows.filter((r: { sku: string }) => r.sku.startsWith(`${PREFIX}-F`));
    expect(mine.map((r: { action: string }) => r.action)).toEqual(names.map(() => 'unchanged'));
  });
});
