import 'server-only';
import { Sequelize, type Options } from 'sequelize';
import * as mariadb from 'mariadb';
// Shared with sequelize-cli so the app and the migrations can never disagree about where the data is.
import databaseConfig from '../../../database/config.cjs';

type SharedSettings = Options & { database: string; username: string; password: string };

const globalForDb = globalThis as unknown as { lobewiseSequelize?: Sequelize };

// One pool per process; Next's dev server reloads modules, so it lives on globalThis.
export function getSequelize(): Sequelize {
  if (!globalForDb.lobewiseSequelize) {
    const settings = databaseConfig.connectionSettings() as unknown as SharedSettings;
    globalForDb.lobewiseSequelize = new Sequelize(settings.database, settings.username, settings.password, {
      ...settings,
      dialectModule: mariadb,
    });
  }
  return globalForDb.lobewiseSequelize;
}

/**
 * Drops the connection when the environment now names another server or database than it was made with
 * (a test process adopts the app's environment after importing the models, which made the connection on
 * import). The next db() makes a fresh one and binds the models to it. Call it before any query.
 */
export function forgetSequelizeIfSettingsChanged(): void {
  const current = globalForDb.lobewiseSequelize;
  if (!current) return;
  const wanted = databaseConfig.connectionSettings() as unknown as SharedSettings;
  const { host, port, database, username } = current.config;
  if (
    wanted.host === host &&
    Number(wanted.port) === Number(port) &&
    wanted.database === database &&
    wanted.username === username
  )
    return;
  globalForDb.lobewiseSequelize = undefined;
  // No query has run on it, so its pool holds no connection; closing only settles its timers.
  void current.close();
}

export async function closeSequelize(): Promise<void> {
  await globalForDb.lobewiseSequelize?.close();
  globalForDb.lobewiseSequelize = undefined;
}
