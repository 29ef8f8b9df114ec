import request from 'supertest';
import { AuditEntry } from '@/lib/db/models';
import { signIn } from '../support/auth';
import { connectTestDatabase, disconnectTestDatabase } from '../support/database';
import { readRuntime } from '../support/runtime';
import { DEMO, MISSING_ID } from '../support/demo';

// Spec-sheet attachments: judged by their first bytes, limited to 5 MB, served only to staff.
const app = () => request(readRuntime().appUrl);
const CAM_SHEETS = `/api/cams/${DEMO.cams.lowRise204}/attachments`;
let manager: string;
let counter: string;
let tech: string;
const made: string[] = [];

const pdf = Buffer.concat([
  Buffer.from('%PDF-1.4\n% test spec sheet\n'),
  Buffer.alloc(2048, 0x20),
  Buffer.from('\n%%EOF\n'),
]);
const png = Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), Buffer.alloc(64, 0)]);

beforeAll(async () => {
  connectTestDatabase();
  [manager, counter, tech] = await Promise.all([signIn('manager'), signIn('counter'), signIn('tech')]);
});

afterAll(async () => {
  for (const url of made) await app().delete(url).set('Cookie', manager);
  await disconnectTestDatabase();
});

describe('cam spec-sheet attachments', () => {
  it('stores a PDF for a manager and serves it back byte for byte to any staff member, never to a signed-out caller', async () => {
    const upload = await app()
      .post(CAM_SHEETS)
      .set('Cookie', manager)
      .attach('file', pdf, { filename: '../../etc/card.PDF', contentType: 'application/octet-stream' });
    expect(upload.status).toBe(201);
    expect(upload.body).toMatchObject({
      entityType: 'cam',
      entityId: DEMO.cams.lowRise204,
      contentType: 'application/pdf',
      byteSize: pdf.length,
      fileName: 'card.pdf',
    });
    const url = `${CAM_SHEETS}/${upload.body.id}`;
    made.push(url);

    const list = await app().get(CAM_SHEETS).set('Cookie', tech);
    expect(list.status).toBe(200);
    expect(list.body.items.map((a: { id: number; url: string }) => a.url)).toContain(url);

    const served = await app()
      .get(url)
      .set('Cookie', counter)
      .buffer(true)
      .parse((res, done) => {
        const chunks: Buffer[] = [];
        res.on('data', (c: Buffer) => chunks.push(c));
        res.on('end', () => done(null, Buffer.concat(chunks)));
      });
    expect(served.status).toBe(200);
    expect(served.headers['content-type']).toBe('application/pdf');
    expect(served.headers['cache-control']).toMatch(/private/);
    expect(Buffer.compare(served.body as Buffer, pdf)).toBe(0);

    expect((await app().get(url)).status).toBe(401);
    expect(
      await AuditEntry.count({ where: { action: 'attachment.added', entityType: 'cam', entityId: '8' } }),
    ).toBeGreaterThan(0);
  });

  it('takes a PNG named .jpg as a PNG: the type comes from the contents', async () => {
    const upload = await app()
      .post(CAM_SHEETS)
      .set('Cookie', manager)
      .attach('file', png, { filename: 'sheet.jpg', contentType: 'image/jpeg' });
    expect(upload.status).toBe(201);
    expect(upload.body).toMatchObject({ contentType: 'image/png', fileName: 'sheet.png' });
    made.push(`${CAM_SHEETS}/${upload.body.id}`);
  });

  it('refuses a file whose contents are not PDF, PNG or JPEG with 415, whatever its name and declared type', async () => {
    const html = Buffer.from('<html><script>alert(1)</script></html>');
    const response = await app()
      .post(CAM_SHEETS)
      .set('Cookie', manager)
      .attach('file', html, { filename: 'card.pdf', contentType: 'application/pdf' });
    expect(response.status).toBe(415);
    expect(response.body.errors[0].field).toBe('file');
    const exe = await app()
      .post(CAM_SHEETS)
      .set('Cookie', manager)
      .attach('file', Buffer.from('MZ\x90\x00'), { filename: 'card.png', contentType: 'image/png' });
    expect(exe.status).toBe(415);
  });

  it('refuses a file over 5 MB with 413', async () => {
    const big = Buffer.concat([Buffer.from('%PDF-1.4\n'), Buffer.alloc(5 * 1024 * 1024 + 10, 0x20)]);
    const response = await app()
      .post(CAM_SHEETS)
      .set('Cookie', manager)
      .attach('file', big, { filename: 'big.pdf', contentType: 'application/pdf' });
    expect(response.status).toBe(413);
  });

  it('lets only managers add or remove attachments', async () => {
    for (const cookie of [counter, tech]) {
      expect((await app().post(CAM_SHEETS).set('Cookie', cookie).attach('file', pdf, 'x.pdf')).status).toBe(403);
    }
    const upload = await app().post(CAM_SHEETS).set('Cookie', manager).attach('file', pdf, 'remove-me.pdf');
    const url = `${CAM_SHEETS}/${upload.body.id}`;
    expect((await app().delete(url).set('Cookie', counter)).status).toBe(403);
    expect((await app().delete(url).set('Cookie', manager)).status).toBe(200);
    expect((await app().get(url).set('Cookie', manager)).status).toBe(404);
  });

  it('works the same way for parts and labour, and 404s for a record that does not exist', async () => {
    const part = await app()
      .post(`/api/parts/${DEMO.parts.springs570}/attachments`)
      .set('Cookie', manager)
      .attach('file', pdf, 'spring-sheet.pdf');
    expect(part.status).toBe(201);
    made.push(`/api/parts/${DEMO.parts.springs570}/attachments/${part.body.id}`);
    const labour = await app()
      .post(`/api/labor/${DEMO.labor.camSwapTruck}/attachments`)
      .set('Cookie', manager)
      .attach('file', png, 'procedure.png');
    expect(labour.status).toBe(201);
    made.push(`/api/labor/${DEMO.labor.camSwapTruck}/attachments/${labour.body.id}`);
    // An attachment belongs to its own record: the part's id under another record is not found.
    expect(
      (await app().get(`/api/labor/${DEMO.labor.camSwapCar}/attachments/${labour.body.id}`).set('Cookie', manager))
        .status,
    ).toBe(404);
    expect(
      (await app().post(`/api/cams/${MISSING_ID}/attachments`).set('Cookie', manager).attach('file', pdf, 'x.pdf'))
        .status,
    ).toBe(404);
  });
});
