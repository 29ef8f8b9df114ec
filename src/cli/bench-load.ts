// npm run bench:load (through docker-local/bin/bench-load, which readies MariaDB and the build): starts
// `next start` on a free loopback port, signs in the demo counter account, and measures three routes
// with autocannon at 16 connections for BENCH_SECONDS each — GET /api/health, POST /api/advisor/rank for
// one cam, and for the whole catalogue — then prints requests/s, p50 and p97.5, and the ratios of the
// rank routes' p97.5 to health's (issue 13 item 10's target: one-cam rank within 3×). A benchmark, not a test.
import { spawn } from 'node:child_process';
import fs from 'node:fs';
import autocannon from 'autocannon';
import { freePort, waitForOk } from './loopback';

const SECONDS = Number(process.env.BENCH_SECONDS ?? '10');
const CONNECTIONS = Number(process.env.BENCH_CONNECTIONS ?? '16');

type Figures = { name: string; rps: number; p50: number; p975: number; non2xx: number };

async function measure(name: string, options: autocannon.Options): Promise<Figures> {
  const result = await autocannon({ connections: CONNECTIONS, duration: SECONDS, ...options });
  return {
    name,
    rps: result.requests.average,
    p50: result.latency.p50,
    p975: result.latency.p97_5,
    non2xx: result.non2xx + result.errors,
  };
}

async function main(): Promise<void> {
  const port = await freePort();
  const url = `http://127.0.0.1:${port}`;
  const app = spawn(
    process.execPath,
    ['--max-semi-space-size=64', 'node_modules/next/dist/bin/next', 'start', '-H', '127.0.0.1', '-p', String(port)],
    {
      env: { ...process.env, NODE_ENV: 'production', APP_BASE_URL: url },
      stdio: 'ignore',
    },
  );
  try {
    await waitForOk(`${url}/api/health`, 60_000);
    const signIn = await fetch(`${url}/api/auth/sign-in`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ email: 'counter@lobewise.test', password: 'lobewise-demo' }),
    });
    if (signIn.status !== 200) throw new Error(`demo sign-in answered ${signIn.status}: is the demo seeded?`);
    const cookie = signIn.headers
      .getSetCookie()
      .map((c) => c.split(';')[0])
      .join('; ');
    const build = JSON.parse(fs.readFileSync('docs/examples/build-daily-truck.json', 'utf8'));
    const headers = { cookie, 'content-type': 'application/json' };
    const one = await fetch(`${url}/api/advisor/rank`, { method: 'POST', headers, body: JSON.stringify({ build }) });
    const ranked = (await one.json()) as { rankings?: { camId: number | string }[] };
    const camId = ranked.rankings?.[0]?.camId;
    if (one.status !== 200 || camId === undefined) throw new Error(`rank answered ${one.status}`);

    let sent = 0;
    const rows = [
      await measure('GET /api/health', { url: `${url}/api/health` }),
      await measure('rank, one cam', {
        url: `${url}/api/advisor/rank`,
        method: 'POST',
        headers,
        body: JSON.stringify({ build, camIds: [camId] }),
      }),
      // The same one-cam question with a build the server has not seen (a request number in the baseline
      // card's name): what a ranking costs when no kept answer fits (src/lib/ranking/ranking-cache.ts).
      await measure('rank, one cam, a new build each request', {
        url: `${url}/api/advisor/rank`,
        headers,
        requests: [
          {
            method: 'POST',
            setupRequest: (request) => ({
              ...request,
              body: JSON.stringify({
                build: { ...build, baselineCam: { ...build.baselineCam, name: `${build.baselineCam.name} ${++sent}` } },
                camIds: [camId],
              }),
            }),
          },
        ],
      }),
      await measure(`rank, whole catalogue (${ranked.rankings!.length} cams)`, {
        url: `${url}/api/advisor/rank`,
        method: 'POST',
        headers,
        body: JSON.stringify({ build }),
      }),
    ];
    console.log(`\n${CONNECTIONS} connections, ${SECONDS} s each, loopback, ${new Date().toISOString()}`);
    console.table(
      rows.map((r) => ({
        route: r.name,
        'req/s': Math.round(r.rps),
        'p50 ms': r.p50,
        'p97.5 ms': r.p975,
        'non-2xx/errors': r.non2xx,
      })),
    );
    const [health, oneCam, oneCamNew, all] = rows;
    console.log(`one-cam rank p97.5 / health p97.5 = ${(oneCam.p975 / health.p975).toFixed(2)} (target ≤ 3)`);
    console.log(
      `one-cam rank, new build each request, p97.5 / health p97.5 = ${(oneCamNew.p975 / health.p975).toFixed(2)}`,
    );
    console.log(`whole-catalogue rank p97.5 / health p97.5 = ${(all.p975 / health.p975).toFixed(2)}`);
    console.log(`health req/s / one-cam rank req/s = ${(health.rps / oneCam.rps).toFixed(2)}`);
  } finally {
    app.kill('SIGTERM');
  }
}

main().catch((error) => {
  console.error(`bench:load failed: ${error instanceof Error ? error.message : error}`);
  process.exit(1);
});
