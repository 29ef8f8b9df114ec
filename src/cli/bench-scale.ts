import { spawn } from 'node:child_process';
import fs from 'node:fs';
import { freePort, waitForOk } from './loopback';

// npm run bench:scale: the production build against lobewise_scale (npm run seed:scale first), each
// endpoint asked in turn by a signed-in manager; prints p50 / p97.5 time and answer size per endpoint
// and the server's peak memory. Sequential on purpose: it measures the cost of one request, not the
// machine's throughput.

const RUNS = Number(process.env.BENCH_RUNS ?? 30);
// BENCH_ONLY=quotes: only the endpoints whose label matches (a regular expression), when working on one.
const ONLY = process.env.BENCH_ONLY ? new RegExp(process.env.BENCH_ONLY) : null;

const percentile = (sorted: number[], p: number) =>
  sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)];
const peakMb = (pid: number) =>
  Number(/VmHWM:\s+(\d+)/.exec(fs.readFileSync(`/proc/${pid}/status`, 'utf8'))?.[1] ?? 0) / 1024;

type Probe = { label: string; path: string; method?: 'POST'; body?: () => unknown; runs?: number };

async function main() {
  const port = await freePort();
  const base = `http://127.0.0.1:${port}`;
  const server = spawn(
    process.execPath,
    ['--max-semi-space-size=64', 'node_modules/next/dist/bin/next', 'start', '-H', '127.0.0.1', '-p', String(port)],
    {
      env: {
        ...process.env,
        NODE_ENV: 'production',
        DB_NAME: 'lobewise_scale',
        APP_BASE_URL: base,
        SESSION_SECRET: process.env.SESSION_SECRET ?? 'bench-scale-secret-0123456789abcdefghijkl',
      },
      stdio: ['ignore', 'ignore', 'inherit'],
    },
  );
  try {
    await waitForOk(`${base}/api/health`, 60_000);
    const signIn = await fetch(`${base}/api/auth/sign-in`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', origin: base },
      body: JSON.stringify({ email: 'manager@lobewise.test', password: 'lobewise-demo' }),
    });
    const cookie = (signIn.headers.get('set-cookie') ?? '').split(';')[0];
    if (!signIn.ok || !cookie) throw new Error(`sign-in answered ${signIn.status}`);
    const headers = { cookie, origin: base, 'content-type': 'application/json' };
    const build = (await (await fetch(`${base}/api/builds/1`, { headers })).json()) as { profile: unknown };
    const today = new Date().toISOString().slice(0, 10);
    const yearAgo = new Date(Date.now() - 364 * 86_400_000).toISOString().slice(0, 10);
    // The one-cam probe ranks the catalogue's last cam (its history is read by cam); finding it costs a whole ranking.
    const wanted = (label: string) => !ONLY || ONLY.test(label);
    const first = wanted('POST /api/advisor/rank (one cam)')
      ? ((await (
          await fetch(`${base}/api/advisor/rank`, {
            method: 'POST',
            headers,
            body: JSON.stringify({ build: build.profile, includeCurves: false }),
          })
        ).json()) as { rankings: { camId: number }[] })
      : { rankings: [{ camId: 0 }] };
    const oneCam = first.rankings[first.rankings.length - 1].camId;
    const probes: Probe[] = [
      {
        label: 'POST /api/advisor/rank',
        path: '/api/advisor/rank',
        method: 'POST',
        body: () => ({ build: build.profile }),
        runs: 10,
      },
      {
        label: 'POST /api/advisor/rank (one cam)',
        path: '/api/advisor/rank',
        method: 'POST',
        body: () => ({ build: build.profile, camIds: [oneCam] }),
        runs: 10,
      },
      { label: 'GET /api/reports/summary (1 year)', path: `/api/reports/summary?from=${yearAgo}&to=${today}` },
      { label: 'GET /api/leads', path: '/api/leads' },
      { label: 'GET /api/quotes', path: '/api/quotes' },
      { label: 'GET /api/quotes?page=100', path: '/api/quotes?page=100' },
      { label: 'GET /api/quotes?q=', path: '/api/quotes?q=Kavel' },
      { label: 'GET /api/customers?q=', path: '/api/customers?q=Kavel' },
      { label: 'GET /api/builds', path: '/api/builds' },
      {
        label: 'GET /api/reports/quotes.csv (1 year)',
        path: `/api/reports/quotes.csv?from=${yearAgo}&to=${today}`,
        runs: 5,
      },
      { label: 'page /quotes', path: '/quotes' },
      { label: 'page /leads', path: '/leads' },
      { label: 'page /dashboard', path: '/dashboard' },
    ];
    console.log('| endpoint | p50 ms | p97.5 ms | bytes | status |\n|---|---|---|---|---|');
    for (const probe of probes.filter((p) => wanted(p.label))) {
      const times: number[] = [];
      let bytes = 0;
      let status = 0;
      for (let i = 0; i < (probe.runs ?? RUNS); i++) {
        const t0 = performance.now();
        const res = await fetch(`${base}${probe.path}`, {
          method: probe.method ?? 'GET',
          headers,
          body: probe.body ? JSON.stringify(probe.body()) : undefined,
        });
        bytes = (await res.arrayBuffer()).byteLength;
        times.push(performance.now() - t0);
        status = res.status;
      }
      times.sort((a, b) => a - b);
      console.log(
        `| ${probe.label} | ${percentile(times, 50).toFixed(0)} | ${percentile(times, 97.5).toFixed(0)} | ${bytes.toLocaleString('en-US')} | ${status} |`,
      );
    }
    console.log(`\nserver peak memory (VmHWM): ${peakMb(server.pid!).toFixed(0)} MB`);
  } finally {
    server.kill('SIGTERM');
  }
}

main().catch((error) => {
  console.error(`bench:scale: ${error instanceof Error ? error.message : error}`);
  process.exit(1);
});
