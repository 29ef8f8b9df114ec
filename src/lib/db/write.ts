import 'server-only';
import {
  ForeignKeyConstraintError,
  OptimisticLockError,
  QueryTypes,
  UniqueConstraintError,
  type Transaction,
} from 'sequelize';
import type { FieldError } from '@/lib/http/responses';
import { db } from '@/lib/db/models';

// The write discipline shared by the query modules in src/lib/db/queries/ (catalogue, leads, builds, jobs, …):
// every write runs in one transaction, a refusal (not found, stale version, invalid) rolls it back,
// and the outcome is a value the route handler turns into 404 / 409 / 422 — never a 500.

export type WriteOutcome<R> =
  | { ok: true; record: R; changed: boolean }
  | { ok: false; reason: 'not-found' }
  | { ok: false; reason: 'conflict'; current: R | null }
  | { ok: false; reason: 'invalid'; errors: FieldError[] }
  | { ok: false; reason: 'refused'; status: 409; message: string };

export class WriteRefused extends Error {
  constructor(
    readonly outcome: Exclude<WriteOutcome<never>, { ok: true }> | { ok: false; reason: 'conflict'; current: unknown },
  ) {
    super('write refused');
  }
}

export const notFound = () => new WriteRefused({ ok: false, reason: 'not-found' });
export const invalid = (errors: FieldError[]) => new WriteRefused({ ok: false, reason: 'invalid', errors });
export const conflict = (current: unknown) => new WriteRefused({ ok: false, reason: 'conflict', current });
export const refused = (message: string) => new WriteRefused({ ok: false, reason: 'refused', status: 409, message });

/**
 * Runs fn in a transaction. `uniqueFields` maps a unique column (as MariaDB names it) to the field the
 * form shows, so a duplicate SKU answers "sku: already used" instead of crashing.
 * `reload` fetches the current record after an OptimisticLockError (a writer raced past our lock).
 */
export async function runWrite<R>(
  fn: (t: Transaction) => Promise<{ record: R; changed?: boolean }>,
  options: { uniqueFields?: Record<string, string>; reload?: () => Promise<R | null> } = {},
): Promise<WriteOutcome<R>> {
  try {
    const { record, changed = true } = await db().transaction(fn);
    return { ok: true, record, changed };
  } catch (error) {
    if (error instanceof WriteRefused) return error.outcome as WriteOutcome<R>;
    if (error instanceof OptimisticLockError)
      return { ok: false, reason: 'conflict', current: options.reload ? await options.reload() : null };
    if (error instanceof UniqueConstraintError) {
      const columns = error.errors.map((e) => e.path ?? '').filter(Boolean);
      const fields = Object.entries(options.uniqueFields ?? {});
      const hit = fields.find(([column]) => columns.some((c) => c === column || c.includes(column))) ?? fields[0];
      const [, field] = hit ?? ['', '(body)'];
      return {
        ok: false,
        reason: 'invalid',
        errors: [{ field, message: `${field} is already used by another record` }],
      };
    }
    if (error instanceof ForeignKeyConstraintError) {
      return { ok: false, reason: 'refused', status: 409, message: 'Another record still refers to this one.' };
    }
    throw error;
  }
}

/** True when two plain records differ in any listed field. */
export function changedFields<T extends Record<string, unknown>>(
  before: T,
  after: T,
  fields: readonly (keyof T)[],
): (keyof T)[] {
  return fields.filter((f) => JSON.stringify(before[f] ?? null) !== JSON.stringify(after[f] ?? null));
}

/** Escapes LIKE wildcards so a search for "50%" finds "50%", not everything. */
export function likeTerm(q: string): string {
  return `%${q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}

/**
 * How many rows of `table` point at `id` through `column`. Table and column are fixed names from the
 * caller's code (never user input); some of these foreign keys have no association on their model.
 */
export async function countReferences(
  table: string,
  column: string,
  id: number,
  transaction: Transaction,
): Promise<number> {
  if (!/^[a-z_]+$/.test(table) || !/^[a-z_]+$/.test(column))
    throw new Error('countReferences takes fixed table and column names');
  const rows = await db().query<{ n: number | string }>(
    `SELECT COUNT(*) AS n FROM \`${table}\` WHERE \`${column}\` = ?`,
    {
      replacements: [id],
      type: QueryTypes.SELECT,
      transaction,
    },
  );
  return Number(rows[0]?.n ?? 0);
}
