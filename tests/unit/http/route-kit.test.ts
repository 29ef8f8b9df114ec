import { z } from 'zod';
import { HttpError, notFound } from '@/lib/http/errors';
import { idFromParam } from '@/lib/http/ids';
import { readBody, readPatch, readQuery } from '@/lib/http/parse';
import { httpErrorResponse, route } from '@/lib/http/route';
import { readUpload } from '@/lib/http/uploads';

// The route kit's pure parts: ids from the path, query and body through zod, and how a thrown
// HttpError is answered. The permission check needs a session and is covered by access-matrix.test.ts.

async function thrown(work: () => unknown): Promise<HttpError> {
  try {
    await work();
  } catch (error) {
    if (error instanceof HttpError) return error;
    throw error;
  }
  throw new Error('expected an HttpError, nothing was thrown');
}

const jsonRequest = (body: string, init: RequestInit = {}) =>
  new Request('http://lobewise.test/api/things', {
    method: 'POST',
    body,
    headers: { 'content-type': 'application/json' },
    ...init,
  });

describe('idFromParam', () => {
  it.each([
    ['1', 1],
    ['42', 42],
    ['9999999999', 9999999999],
  ])('reads %s as the id %d', (raw, id) => {
    expect(idFromParam(raw, 'cam')).toBe(id);
  });

  it.each(['0', '-3', '1.5', '1e3', ' 7', 'abc', '', '12345678901', '0x10'])(
    'answers 404 naming the record for %j',
    async (raw) => {
      const error = await thrown(() => idFromParam(raw, 'cam'));
      expect(error.status).toBe(404);
      expect(error.message).toBe(`No cam with id ${raw}.`);
    },
  );

  it('answers 404 for a missing segment', async () => {
    expect((await thrown(() => idFromParam(undefined, 'part'))).status).toBe(404);
  });
});

const Query = z.strictObject({ page: z.coerce.number().int().min(1).default(1), q: z.string().max(5).optional() });

describe('readQuery', () => {
  it('parses and defaults the query string', () => {
    expect(readQuery(new Request('http://lobewise.test/x?q=abc'), Query)).toEqual({ page: 1, q: 'abc' });
    expect(readQuery(new Request('http://lobewise.test/x?page=3'), Query)).toEqual({ page: 3 });
  });

  it('throws a 422 naming each bad or unknown field', async () => {
    const error = await thrown(() => readQuery(new Request('http://lobewise.test/x?page=0&q=toolong&sort=up'), Query));
    expect(error.status).toBe(422);
    expect(error.extra.errors?.map((e) => e.field).sort()).toEqual(['page', 'q', 'sort']);
  });
});

const Body = z.strictObject({ name: z.string().min(1), count: z.number().int() });

describe('readBody', () => {
  it('gives back the parsed body', async () => {
    await expect(readBody(jsonRequest('{"name":"x","count":2}'), Body)).resolves.toEqual({ name: 'x', count: 2 });
  });

  it('answers 422 naming the fields that fail the schema', async () => {
    const error = await thrown(() => readBody(jsonRequest('{"name":"","count":1.5}'), Body));
    expect(error.status).toBe(422);
    expect(error.message).toBe('Some fields need attention.');
    expect(error.extra.errors?.map((e) => e.field).sort()).toEqual(['count', 'name']);
  });

  it('answers 400 for a body that is not JSON', async () => {
    const error = await thrown(() => readBody(jsonRequest('{"name":'), Body));
    expect(error.status).toBe(400);
    expect(error.extra.errors).toEqual([{ field: '(body)', message: 'not valid JSON' }]);
  });

  it('answers 413 past the byte limit', async () => {
    const error = await thrown(() =>
      readBody(jsonRequest(JSON.stringify({ name: 'x'.repeat(2000), count: 1 })), Body, 1024),
    );
    expect(error.status).toBe(413);
    expect(error.extra.errors?.[0].field).toBe('(body)');
  });
});

const Control = z.strictObject({ version: z.number().int().min(1) });
const Record_ = z
  .strictObject({ name: z.string().min(1), low: z.number(), high: z.number() })
  .refine((r) => r.low <= r.high, { path: ['high'], message: 'must be at least low' });

describe('readPatch', () => {
  const current = { name: 'stored', low: 1, high: 5 };

  it('lays the changes over the stored values and splits off the control fields', async () => {
    await expect(readPatch(jsonRequest('{"version":3,"high":9}'), Control, Record_, current)).resolves.toEqual({
      control: { version: 3 },
      values: { name: 'stored', low: 1, high: 9 },
    });
  });

  it('checks the whole record again, so a change that breaks a cross-field rule is a 422', async () => {
    const error = await thrown(() => readPatch(jsonRequest('{"version":3,"low":7}'), Control, Record_, current));
    expect(error.status).toBe(422);
    expect(error.extra.errors).toEqual([{ field: 'high', message: 'must be at least low' }]);
  });

  it('names a missing version and a bad field together', async () => {
    const error = await thrown(() => readPatch(jsonRequest('{"name":""}'), Control, Record_, current));
    expect(error.extra.errors?.map((e) => e.field).sort()).toEqual(['name', 'version']);
  });

  it('refuses a body that is not a JSON object', async () => {
    const error = await thrown(() => readPatch(jsonRequest('[1,2]'), Control, Record_, current));
    expect(error.status).toBe(422);
    expect(error.extra.errors).toEqual([{ field: '(body)', message: 'the body must be a JSON object' }]);
  });
});

describe('HttpError answers', () => {
  it('carries status, message, the errors list, other fields and headers into the response', async () => {
    const response = httpErrorResponse(
      new HttpError(
        429,
        'Slow down.',
        { errors: [{ field: 'email', message: 'too many' }], retryAfterSeconds: 60 },
        { 'Retry-After': '60' },
      ),
    );
    expect(response.status).toBe(429);
    expect(response.headers.get('retry-after')).toBe('60');
    await expect(response.json()).resolves.toEqual({
      message: 'Slow down.',
      errors: [{ field: 'email', message: 'too many' }],
      retryAfterSeconds: 60,
    });
  });

  it('notFound names the record and the id', () => {
    const error = notFound('labour operation', 12);
    expect([error.status, error.message]).toEqual([404, 'No labour operation with id 12.']);
  });
});

describe('route() on a public handler', () => {
  const handler = route({ permission: 'public', ids: { id: 'thing' }, body: Body }, async ({ ids, body }) => {
    if (body.name === 'gone') throw notFound('thing', ids.id);
    return Response.json({ id: ids.id, ...body });
  });
  const call = (id: string, request: Request) => handler(request, { params: Promise.resolve({ id }) });

  it('passes the parsed id and body to the handler', async () => {
    const response = await call('5', jsonRequest('{"name":"x","count":2}'));
    expect(response.status).toBe(200);
    await expect(response.json()).resolves.toEqual({ id: 5, name: 'x', count: 2 });
  });

  it('answers an HttpError the handler throws', async () => {
    const response = await call('5', jsonRequest('{"name":"gone","count":2}'));
    expect(response.status).toBe(404);
    await expect(response.json()).resolves.toEqual({ message: 'No thing with id 5.' });
  });

  it('answers a bad id (404) before it reads the body', async () => {
    const response = await call('x', jsonRequest('not json'));
    expect(response.status).toBe(404);
  });

  it('refuses a post from another site before anything else (403)', async () => {
    const response = await call(
      'x',
      jsonRequest('not json', {
        headers: { 'content-type': 'application/json', origin: 'https://elsewhere.example', host: 'lobewise.test' },
      }),
    );
    expect(response.status).toBe(403);
  });

  it('lets an error that is not an HttpError through (a bug, which Next answers 500)', async () => {
    const broken = route({ permission: 'public' }, () => {
      throw new TypeError('bug');
    });
    await expect(broken(new Request('http://lobewise.test/x'), { params: Promise.resolve({}) })).rejects.toThrow('bug');
  });
});

describe('readUpload', () => {
  it('throws 415 for a body that is not multipart', async () => {
    const error = await thrown(() => readUpload(jsonRequest('{}'), 1024, 'spec sheet'));
    expect(error.status).toBe(415);
    expect(error.extra.errors).toEqual([{ field: 'file', message: 'expected multipart/form-data' }]);
  });

  it('throws 422 naming `file` when the form has no file, and gives back a good one', async () => {
    const empty = new FormData();
    empty.set('mode', 'preview');
    const noFile = await thrown(() =>
      readUpload(new Request('http://lobewise.test/x', { method: 'POST', body: empty }), 1024, 'spec sheet'),
    );
    expect([noFile.status, noFile.extra.errors?.[0].field]).toEqual([422, 'file']);

    const form = new FormData();
    form.set('file', new File(['a,b\n1,2\n'], 'cams.csv', { type: 'text/csv' }));
    const upload = await readUpload(
      new Request('http://lobewise.test/x', { method: 'POST', body: form }),
      1024,
      'spec sheet',
    );
    expect([upload.file.name, upload.bytes.toString('utf8')]).toEqual(['cams.csv', 'a,b\n1,2\n']);
  });

  it('throws 413 for a file past the limit', async () => {
    const form = new FormData();
    form.set('file', new File(['x'.repeat(2048)], 'big.pdf'));
    const error = await thrown(() =>
      readUpload(new Request('http://lobewise.test/x', { method: 'POST', body: form }), 1024, 'spec sheet'),
    );
    expect(error.status).toBe(413);
  });
});
