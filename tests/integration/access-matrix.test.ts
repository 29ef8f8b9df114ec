import fs from 'node:fs';
import path from 'node:path';
import request from 'supertest';
import { accessMatrix, expectedFor, type AccessRow, type Caller } from './access-matrix';
import { signIn, type TestRole } from '../support/auth';
import { readRuntime } from '../support/runtime';

// Every route handler under src/app/api, every exported HTTP method, every caller: exactly the
// answer the matrix says (for most rows, the answer the permission table in lib/auth/policy.ts gives).
const { appUrl } = readRuntime();
const API_DIR = path.resolve(__dirname, '../../src/app/api');
const METHODS = ['GET', 'HEAD', 'POST', 'PUT', 'PATCH', 'DELETE', 'OPTIONS'] as const;
const ROLES: TestRole[] = ['manager', 'counter', 'tech'];

function routeFiles(dir: string): string[] {
  return fs.readdirSync(dir, { withFileTypes: true }).flatMap((entry) => {
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) return routeFiles(full);
    return /^route\.(ts|tsx|js|mjs)$/.test(entry.name) ? [full] : [];
  });
}

/** '/…/src/app/api/(group)/users/[id]/route.ts' → '/api/users/[id]' */
function routePathOf(file: string): string {
  const segments = path
    .relative(API_DIR, path.dirname(file))
    .split(path.sep)
    .filter((s) => s && !/^\(.*\)$/.test(s));
  return ['/api', ...segments].join('/');
}

/** The HTTP methods a route module exports, read from its source. */
function exportedMethods(source: string): string[] {
  const found = new Set<string>();
  for (const match of source.matchAll(/export\s+(?:async\s+)?(?:function|const|let)\s+([A-Z]+)\b/g))
    found.add(match[1]);
  for (const match of source.matchAll(/export\s*\{([^}]*)\}/g)) {
    for (const part of match[1].split(','))
      found.add(
        part
          .trim()
          .split(/\s+as\s+/)
          .pop()!
          .trim(),
      );
  }
  return [...found].filter((name) => (METHODS as readonly string[]).includes(name));
}

const discovered = routeFiles(API_DIR).flatMap((file) =>
  exportedMethods(fs.readFileSync(file, 'utf8')).map((method) => ({ method, path: routePathOf(file), file })),
);
const key = (row: { method: string; path: string }) => `${row.method} ${row.path}`;

describe('the access matrix covers every route handler', () => {
  it('finds the route handlers (the walk itself works)', () => {
    expect(discovered.map(key)).toEqual(
      expect.arrayContaining(['GET /api/health', 'POST /api/auth/sign-in', 'PATCH /api/users/[id]']),
    );
  });

  it('has a row for every exported method of every route', () => {
    const inMatrix = new Set(accessMatrix.map(key));
    const missing = discovered
      .filter((route) => !inMatrix.has(key(route)))
      .map((route) => `${key(route)}  (${path.relative(process.cwd(), route.file)})`);
    expect(missing).toEqual([]);
  });

  it('has no row for a route or method that does not exist, and no duplicate rows', () => {
    const existing = new Set(discovered.map(key));
    expect(accessMatrix.filter((row) => !existing.has(key(row))).map(key)).toEqual([]);
    const keys = accessMatrix.map(key);
    expect(keys.filter((k, i) => keys.indexOf(k) !== i)).toEqual([]);
  });
});

describe('each caller gets exactly its answer', () => {
  let cookies: Record<TestRole, string>;

  beforeAll(async () => {
    cookies = Object.fromEntries(
      await Promise.all(ROLES.map(async (role) => [role, await signIn(role)] as const)),
    ) as Record<TestRole, string>;
  });

  async function call(row: AccessRow, cookie: string | null) {
    const url = row.url ?? row.path;
    const method = row.method.toLowerCase() as 'get' | 'post' | 'put' | 'patch' | 'delete';
    let req = request(appUrl)[method](url);
    if (cookie) req = req.set('Cookie', cookie);
    if (row.method !== 'GET') req = req.send((row.body ?? {}) as object);
    return req;
  }

  it.each(accessMatrix.map((row) => [key(row), row] as const))('%s', async (_name, row) => {
    const got: Record<Caller, number> = { anonymous: 0, manager: 0, counter: 0, tech: 0 };
    const refusalsWithoutMessage: string[] = [];
    for (const caller of ['anonymous', ...ROLES] as Caller[]) {
      const cookie = caller === 'anonymous' ? null : row.freshSession ? await signIn(caller) : cookies[caller];
      const response = await call(row, cookie);
      got[caller] = response.status;
      // Refusals are JSON with a message people can read.
      if ((response.status === 401 || response.status === 403) && typeof response.body?.message !== 'string')
        refusalsWithoutMessage.push(caller);
    }
    expect(got).toEqual(expectedFor(row));
    expect(refusalsWithoutMessage).toEqual([]);
  });
});
