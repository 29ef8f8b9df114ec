import { execFileSync } from 'node:child_process';
import path from 'node:path';
import request from 'supertest';
import { readRuntime } from '../support/runtime';

const { appUrl } = readRuntime();
const mariadbScript = (name: string) =>
  execFileSync('bash', [path.resolve(__dirname, '../../docker-local/mariadb', name)], { stdio: 'pipe' });

async function healthStatusWithin(expected: number, timeoutMs: number): Promise<number> {
  const deadline = Date.now() + timeoutMs;
  let status = 0;
  while (Date.now() < deadline) {
    status = (await request(appUrl).get('/api/health')).status;
    if (status === expected) return status;
    await new Promise((r) => setTimeout(r, 500));
  }
  return status;
}

describe('database outage', () => {
  afterAll(() => {
    mariadbScript('start'); // never leave the suite without its database
  });

  it('answers 503 while MariaDB is down and 200 again once it is back, without an app restart', async () => {
    await request(appUrl).get('/api/health').expect(200);
    mariadbScript('stop');
    expect(await healthStatusWithin(503, 15_000)).toBe(503);
    const down = await request(appUrl).get('/api/health');
    expect(down.body).toMatchObject({ status: 'degraded', db: 'down' });
    mariadbScript('start');
    expect(await healthStatusWithin(200, 30_000)).toBe(200);
    const up = await request(appUrl).get('/api/health');
    expect(up.body).toMatchObject({ status: 'ok', db: 'up' });
  }, 90_000);
});
