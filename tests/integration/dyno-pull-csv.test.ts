import request from 'supertest';
import { DynoRun } from '@/lib/db/models';
import { CURVE_CSV_MAX_BYTES, CURVE_CSV_TEMPLATE } from '@/lib/dyno/curve-csv';
import { signIn } from '../support/auth';
import { connectTestDatabase, disconnectTestDatabase } from '../support/database';
import { readRuntime } from '../support/runtime';

// POST /api/dyno-runs/pull-csv over HTTP against the real build and database: the technician's pull file is
// checked on the server with the job page's parser. It records nothing, which the run count shows.
const { appUrl } = readRuntime();
const URL = '/api/dyno-runs/pull-csv';

type Problem = { field: string; row: number; column: string; message: string };

function upload(cookie: string | null, body: Buffer | string, name = 'pull.csv', type = 'text/csv') {
  const call = request(appUrl).post(URL);
  if (cookie) call.set('Cookie', cookie);
  return call.attach('file', Buffer.isBuffer(body) ? body : Buffer.from(body, 'utf8'), {
    filename: name,
    contentType: type,
  });
}

describe('POST /api/dyno-runs/pull-csv', () => {
  let tech: string;
  let manager: string;
  let counter: string;
  let runsBefore: number;

  beforeAll(async () => {
    connectTestDatabase();
    [tech, manager, counter] = await Promise.all([signIn('tech'), signIn('manager'), signIn('counter')]);
    runsBefore = await DynoRun.count();
  });
  afterAll(async () => {
    await disconnectTestDatabase();
  });

  it('answers the points of a good file, skipping the header and blank lines, and records nothing', async () => {
    const pull = 'rpm;torque_lbft\r\n3000;352.4\r\n\r\n3500;371\r\n4000;380.2\r\n';
    const response = await upload(tech, pull);
    expect(response.status).toBe(200);
    expect(response.body).toEqual({
      fileName: 'pull.csv',
      points: [
        { rpm: 3000, torqueLbFt: 352.4 },
        { rpm: 3500, torqueLbFt: 371 },
        { rpm: 4000, torqueLbFt: 380.2 },
      ],
      rows: [2, 4, 5],
    });
    expect(await DynoRun.count()).toBe(runsBefore);
  });

  it('takes the downloadable template as it is, for a manager too', async () => {
    const response = await upload(manager, CURVE_CSV_TEMPLATE, 'dyno-pull-template.csv');
    expect(response.status).toBe(200);
    expect(response.body.points).toHaveLength(3);
  });

  it('refuses a file past the limit with 413 naming the file field', async () => {
    const big = '3000,300\n'.repeat(Math.ceil((CURVE_CSV_MAX_BYTES + 1000) / 9));
    const response = await upload(tech, big, 'big.csv');
    expect(response.status).toBe(413);
    expect(response.body.errors).toEqual([expect.objectContaining({ field: 'file' })]);
  });

  it('refuses a file that is not CSV with 415: by its contents, by its name, and a JSON body', async () => {
    const pdf = await upload(tech, Buffer.from('%PDF-1.4\n1 0 obj\n'), 'pull.csv', 'text/csv');
    expect(pdf.status).toBe(415);
    expect(pdf.body.message).toContain('PDF');
    const workbook = await upload(tech, '3000,300\n', 'pull.xlsx', 'application/octet-stream');
    expect(workbook.status).toBe(415);
    const image = await upload(tech, '3000,300\n', 'pull.csv', 'image/png');
    expect(image.status).toBe(415);
    const json = await request(appUrl).post(URL).set('Cookie', tech).send({ curve: [] });
    expect(json.status).toBe(415);
  });

  it('answers 422 with every problem by row and column, counting the header and blank lines', async () => {
    // Row 1 header, row 3 blank; row 4 has no torque number, row 6 falls in rpm, row 7 is past the torque limit.
    const pull = 'rpm,torque\n3000,300\n\n3500,abc\n4000,320\n3900,330\n4500,99999\n';
    const response = await upload(tech, pull);
    expect(response.status).toBe(422);
    const errors = response.body.errors as Problem[];
    expect(errors.map(({ row, column }) => [row, column])).toEqual([
      [4, 'torque'],
      [6, 'rpm'],
      [7, 'torque'],
    ]);
    expect(errors[0].message).toBe('row 4, column torque: expected a number (got "3500,abc")');
    expect(errors[1].message).toBe('row 6, column rpm: rpm must rise from point to point (3900 after 4000)');
    expect(errors[2].message).toMatch(/^row 7, column torque: torque must be at most \d+ lb·ft$/);
    expect(errors.every((e) => e.field === 'file')).toBe(true);
  });

  it('answers 422 for too few points and for a file with only a header', async () => {
    const short = await upload(tech, 'rpm,torque\n3000,300\n3500,310\n');
    expect(short.status).toBe(422);
    expect(short.body.errors).toEqual([
      expect.objectContaining({
        row: 3,
        column: '(row)',
        message: 'row 3: a pull needs 3–400 points; this file has 2',
      }),
    ]);
    const empty = await upload(tech, 'rpm,torque\n');
    expect(empty.status).toBe(422);
    expect(empty.body.errors[0]).toMatchObject({ row: 1, column: '(row)' });
  });

  it('lets only the roles that record runs in: signed out 401 (customers hold no account), counter 403', async () => {
    expect((await upload(null, CURVE_CSV_TEMPLATE)).status).toBe(401);
    expect((await upload(counter, CURVE_CSV_TEMPLATE)).status).toBe(403);
  });
});
