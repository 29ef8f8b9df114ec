import 'server-only';
import { db } from '../models';

const PING_TIMEOUT_MS = 2000;

/** True when MariaDB answers a trivial query in time. Never throws: health checks must answer. */
export async function databaseIsUp(): Promise<boolean> {
  let timer: NodeJS.Timeout | undefined;
  const timeout = new Promise<boolean>((resolve) => {
    timer = setTimeout(() => resolve(false), PING_TIMEOUT_MS);
  });
  const ping = db()
    .query('SELECT 1')
    .then(() => true)
    .catch(() => false);
  try {
    return await Promise.race([ping, timeout]);
  } finally {
    clearTimeout(timer);
  }
}
