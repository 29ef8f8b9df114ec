import http from 'node:http';
import request from 'supertest';
import { signIn } from '../support/auth';
import { readRuntime } from '../support/runtime';
import { DEMO } from '../support/demo';

// Upload limits (issue 13 item 6): a chunked multipart body is refused with 413 once it passes the
// limit, not after it has all been read; a record keeps at most 10 spec sheets (409 naming the field).
const { appUrl } = readRuntime();
const app = () => request(appUrl);
const pdf = Buffer.concat([Buffer.from('%PDF-1.4\n% limit test\n'), Buffer.alloc(512, 0x20), Buffer.from('\n%%EOF\n')]);
const CAM = `/api/cams/${DEMO.cams.hauler208}/attachments`;
let manager: string;
const made: string[] = [];

beforeAll(async () => {
  manager = await signIn('manager');
});
afterAll(async () => {
  for (const url of made) await app().delete(url).set('Cookie', manager);
});

describe('attachment limits', () => {
  it('refuses a 40 MB chunked multipart upload with 413 long before the end of the body', async () => {
    const boundary = 'lobewise-limit-test';
    const result = await new Promise<{ status: number; bytes: number }>((resolve, reject) => {
      let bytes = 0;
      let answered = false;
      const req = http.request(
        `${appUrl}${CAM}`,
        {
          method: 'POST',
          headers: {
            Cookie: manager,
            'Content-Type': `multipart/form-data; boundary=${boundary}`,
            'Transfer-Encoding': 'chunked',
          },
        },
        (res) => {
          answered = true;
          res.resume();
          resolve({ status: res.statusCode ?? 0, bytes });
          req.destroy();
        },
      );
      req.on('error', (error) => (answered ? undefined : reject(error)));
      req.write(
        `--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="big.pdf"\r\nContent-Type: application/pdf\r\n\r\n%PDF-1.4\n`,
      );
      const chunk = Buffer.alloc(64 * 1024, 0x20);
      const pump = () => {
        while (!answered && bytes < 40 * 1024 * 1024) {
          bytes += chunk.length;
          if (!req.write(chunk)) return void req.once('drain', pump);
        }
        if (!answered) req.end(`\r\n--${boundary}--\r\n`);
      };
      pump();
    });
    expect(result.status).toBe(413);
    expect(result.bytes).toBeLessThan(20 * 1024 * 1024);
  });

  it('keeps at most 10 spec sheets on one record and says so with 409 naming the file field', async () => {
    const existing = (await app().get(CAM).set('Cookie', manager)).body.items.length as number;
    for (let i = existing; i < 10; i += 1) {
      const upload = await app()
        .post(CAM)
        .set('Cookie', manager)
        .attach('file', pdf, { filename: `sheet-${i}.pdf`, contentType: 'application/pdf' });
      expect(upload.status).toBe(201);
      made.push(`${CAM}/${upload.body.id}`);
    }
    const refused = await app()
      .post(CAM)
      .set('Cookie', manager)
      .attach('file', pdf, { filename: 'one-too-many.pdf', contentType: 'application/pdf' });
    expect(refused.status).toBe(409);
    expect(refused.body.message).toMatch(/10 spec sheets/);
    expect(refused.body.errors).toEqual([expect.objectContaining({ field: 'file' })]);
    // removing one makes room again
    const removed = made.pop()!;
    await app()
      .delete(removed)
      .set('Cookie', manager)
      .expect((r) => expect([200, 204]).toContain(r.status));
    const again = await app()
      .post(CAM)
      .set('Cookie', manager)
      .attach('file', pdf, { filename: 'room-again.pdf', contentType: 'application/pdf' });
    expect(again.status).toBe(201);
    made.push(`${CAM}/${again.body.id}`);
  });
});
