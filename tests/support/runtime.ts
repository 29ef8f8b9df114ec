import fs from 'node:fs';
import path from 'node:path';

// What the integration global setup started, shared with test files through a small JSON file.
export type TestRuntime = {
  appUrl: string;
  mailUrl: string;
  paymentsUrl: string;
  env: Record<string, string>;
  pids: number[];
};

export const RUNTIME_FILE = path.resolve(__dirname, '../../var/test/runtime.json');

export function readRuntime(): TestRuntime {
  return JSON.parse(fs.readFileSync(RUNTIME_FILE, 'utf8')) as TestRuntime;
}

/** Gives in-process modules (mail, payments, database) the same environment the app got. */
export function adoptRuntimeEnv(): TestRuntime {
  const runtime = readRuntime();
  Object.assign(process.env, runtime.env);
  return runtime;
}
