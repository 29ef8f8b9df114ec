import { RateLimiterMySQL, RateLimiterRes } from 'rate-limiter-flexible';
import { getSequelize } from '@/lib/db/connection';
import { retryOnLockContention } from '@/lib/db/lock-contention';

// rate-limiter-flexible's MySQL store speaks the callback API of the `mysql` driver (`??` for
// identifiers, `query(sql, values, cb)`); Sequelize here runs on the promise-based `mariadb` driver.
// This adapter lends the store connections from Sequelize's own pool and translates the calls, so the
// library's own BEGIN / upsert / SELECT / COMMIT runs unchanged on one connection (its atomicity).

export const RATE_LIMIT_TABLE = 'rate_limits';

type Callback = (error: Error | null, rows?: unknown) => void;
type DriverConnection = { query(sql: string, values?: unknown[]): Promise<unknown>; rollback(): Promise<void> };

function quoteId(name: unknown): string {
  return '`' + String(name).replace(/`/g, '``') + '`';
}

/** Inlines `??` identifiers (only our own database and table names reach them) and keeps `?` values. */
export function translateQuery(sql: string, values: unknown[]): { sql: string; values: unknown[] } {
  const kept: unknown[] = [];
  let index = 0;
  const out = sql.replace(/\?\?|\?/g, (mark) => {
    const value = values[index++];
    if (mark === '??') return quoteId(value);
    kept.push(value);
    return '?';
  });
  return { sql: out, values: kept };
}

// The store does arithmetic on `points` and `expire`; the driver may hand BIGINT back as BigInt.
function plainRows(result: unknown): unknown {
  if (!Array.isArray(result)) return result;
  return result.map((row) => {
    if (!row || typeof row !== 'object') return row;
    const copy: Record<string, unknown> = {};
    for (const [key, value] of Object.entries(row)) copy[key] = typeof value === 'bigint' ? Number(value) : value;
    return copy;
  });
}

function callbackConnection(conn: DriverConnection, release: () => void) {
  return {
    query(sql: string, valuesOrCb: unknown[] | Callback, maybeCb?: Callback) {
      const cb = (typeof valuesOrCb === 'function' ? valuesOrCb : maybeCb) as Callback | undefined;
      const values = Array.isArray(valuesOrCb) ? valuesOrCb : [];
      const translated = translateQuery(sql, values);
      conn.query(translated.sql, translated.values).then(
        (rows) => cb?.(null, plainRows(rows)),
        (error: Error) => cb?.(error),
      );
    },
    rollback() {
      conn.rollback().catch(() => undefined);
    },
    release,
  };
}

function sequelizePool() {
  return {
    getConnection(cb: (error: Error | null, conn?: ReturnType<typeof callbackConnection>) => void) {
      const manager = getSequelize().connectionManager as unknown as {
        getConnection(): Promise<DriverConnection>;
        // Synchronous in Sequelize 6 (returns nothing): chaining .catch on it threw an unhandled TypeError per release.
        releaseConnection(conn: DriverConnection): void;
      };
      manager.getConnection().then(
        (conn) =>
          cb(
            null,
            callbackConnection(conn, () => {
              try {
                manager.releaseConnection(conn);
              } catch {
                // released twice: nothing left to give back
              }
            }),
          ),
        (error: Error) => cb(error),
      );
    },
  };
}

export type LimiterOptions = { keyPrefix: string; points: number; durationSeconds: number };

/** A limiter whose counters live in the rate_limits table (made by a migration, never by the library). */
export function makeLimiter(options: LimiterOptions): RateLimiterMySQL {
  return new RateLimiterMySQL({
    storeClient: sequelizePool(),
    storeType: 'pool',
    dbName: getSequelize().config.database,
    tableName: RATE_LIMIT_TABLE,
    tableCreated: true,
    keyPrefix: options.keyPrefix,
    points: options.points,
    duration: options.durationSeconds,
  });
}

/**
 * consume() rejects with a RateLimiterRes when the limit is passed and with an Error when the store
 * failed; this keeps the first as an answer and lets the second propagate (a database fault).
 * Concurrent consumes of one key can deadlock on the upsert's row lock (MariaDB rolls one back, 1213);
 * that one is counted again rather than answered 500.
 */
export async function consumePoint(
  limiter: RateLimiterMySQL,
  key: string,
  points = 1,
): Promise<{ allowed: boolean; res: RateLimiterRes }> {
  return retryOnLockContention(async () => {
    try {
      return { allowed: true, res: await limiter.consume(key, points) };
    } catch (outcome) {
      if (outcome instanceof RateLimiterRes) return { allowed: false, res: outcome };
      throw outcome;
    }
  });
}

export function retryAfterSeconds(res: RateLimiterRes): number {
  return Math.max(1, Math.ceil(res.msBeforeNext / 1000));
}
