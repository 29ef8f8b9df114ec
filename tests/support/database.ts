import { closeSequelize } from '@/lib/db/connection';
import { db } from '@/lib/db/models';
import { adoptRuntimeEnv } from './runtime';

/** Connects this test process to the same lobewise_test database the app under test uses. */
export function connectTestDatabase() {
  adoptRuntimeEnv();
  return db();
}

export async function disconnectTestDatabase() {
  await closeSequelize();
}
