import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';

// Starts one of the docker-local fakes as a child process on a port the OS picks (port 0); the fake
// logs the address it got, and this waits for that line and its /health answer.
export type FakeProcess = { child: ChildProcess; baseUrl: string; port: number; log: string[] };

export async function startFakeProcess(
  name: 'mail-fake' | 'payments-fake',
  env: Record<string, string>,
): Promise<FakeProcess> {
  const server = path.resolve(__dirname, `../../docker-local/${name}/server.mjs`);
  const child = spawn(process.execPath, [server], {
    env: { ...process.env, ...env },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  const log: string[] = [];
  const baseUrl = await new Promise<string>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`${name} did not start:\n${log.join('')}`)), 10_000);
    child.stdout!.on('data', (chunk: Buffer) => {
      log.push(chunk.toString());
      const match = /listening on (http:\/\/\S+)/.exec(log.join(''));
      if (match) {
        clearTimeout(timer);
        resolve(match[1]);
      }
    });
    child.stderr!.on('data', (chunk: Buffer) => log.push(chunk.toString()));
    child.once('exit', (code) => reject(new Error(`${name} exited with ${code}:\n${log.join('')}`)));
  });
  const health = await fetch(`${baseUrl}/health`);
  if (health.status !== 200) throw new Error(`${name} /health answered ${health.status}`);
  return { child, baseUrl, port: Number(new URL(baseUrl).port), log };
}

/** SIGTERM, then the exit code (the fakes exit 0 on a clean stop). */
export function stopFakeProcess(fake: FakeProcess): Promise<number | null> {
  if (fake.child.exitCode !== null) return Promise.resolve(fake.child.exitCode);
  return new Promise((resolve) => {
    fake.child.once('exit', (code) => resolve(code));
    fake.child.kill('SIGTERM');
  });
}
