import { closeSequelize, forgetSequelizeIfSettingsChanged } from '@/lib/db/connection';
import { db } from '@/lib/db/models';
import { adoptRuntimeEnv } from './runtime';

/** Connects this test process to the same lobewise_test database the app under test uses. */
export function connectTestDatabase() {
  adoptRuntimeEnv();
  // The models bound themselves to a connection when imported, before this process took the app's settings.
  forgetSequelizeIfSettingsChanged();
  return db();
}

export async function disconnectTestDatabase() {
  await closeSequelize();
}
