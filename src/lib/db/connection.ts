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

export async function closeSequelize(): Promise<void> {
  await globalForDb.lobewiseSequelize?.close();
  globalForDb.lobewiseSequelize = undefined;
}
