import 'server-only';
// Transactions that MariaDB rolled back over row locks (InnoDB deadlock detection) are safe to run again:
// nothing they wrote was kept. Every write path that can meet a concurrent twin retries through here.

/** MariaDB's deadlock (1213) and lock-wait timeout (1205): the transaction was rolled back and may run again. */
export function isLockContention(error: unknown): boolean {
  const parts = [error, (error as { parent?: unknown })?.parent, (error as { original?: unknown })?.original];
  return parts.some((e) => {
    const errno = (e as { errno?: number } | undefined)?.errno;
    const code = (e as { code?: string } | undefined)?.code;
    return errno === 1213 || errno === 1205 || code === 'ER_LOCK_DEADLOCK' || code === 'ER_LOCK_WAIT_TIMEOUT';
  });
}

/** Runs fn again (a few times, with a short random pause) when the database rolled it back over locks. */
export async function retryOnLockContention<T>(fn: () => Promise<T>, attempts = 5): Promise<T> {
  for (let attempt = 1; ; attempt++) {
    try {
      return await fn();
    } catch (error) {
      if (attempt >= attempts || !isLockContention(error)) throw error;
      await new Promise((resolve) => setTimeout(resolve, 10 + Math.random() * 40 * attempt));
    }
  }
}
