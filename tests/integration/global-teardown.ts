import { readRuntime } from '../support/runtime';

export default async function globalTeardown(): Promise<void> {
  for (const pid of readRuntime().pids) {
    try {
      process.kill(-pid, 'SIGTERM');
    } catch {
      // already gone
    }
  }
}
