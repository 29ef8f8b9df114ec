import { spawn } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { freePort, waitForOk } from '../../src/cli/loopback';
import { RUNTIME_FILE, type TestRuntime } from '../support/runtime';

// Starts the real production build (`next start`) and both fakes on free loopback ports,
// against the lobewise_test database that `npm test` has just reset.
const ROOT = path.resolve(__dirname, '../..');

function start(name: string, args: string[], env: Record<string, string>): number {
  const logDir = path.join(ROOT, 'var/test/logs');
  fs.mkdirSync(logDir, { recursive: true });
  const out = fs.openSync(path.join(logDir, `${name}.log`), 'w');
  const child = spawn(process.execPath, args, {
    cwd: ROOT,
    env: { ...process.env, ...env },
    stdio: ['ignore', out, out],
    detached: true,
  });
  child.unref();
  if (!child.pid) throw new Error(`could not start ${name}`);
  return child.pid;
}

export default async function globalSetup(): Promise<void> {
  const testDir = path.join(ROOT, 'var/test');
  fs.rmSync(testDir, { recursive: true, force: true });
  fs.mkdirSync(testDir, { recursive: true });
  const [appPort, mailPort, paymentsPort] = [await freePort(), await freePort(), await freePort()];
  const appUrl = `http://127.0.0.1:${appPort}`;
  const env: Record<string, string> = {
    NODE_ENV: 'production',
    NEXT_TELEMETRY_DISABLED: '1',
    DB_NAME: 'lobewise_test',
    APP_BASE_URL: appUrl,
    SESSION_SECRET: 'integration-test-secret-0123456789abcdefghij',
    RESEND_API_KEY: 're_test_integration',
    MAIL_FAKE_API_KEY: 're_test_integration',
    MAIL_FAKE_PORT: String(mailPort),
    MAIL_FAKE_DATA_DIR: path.join(testDir, 'mail-fake'),
    RESEND_BASE_URL: `http://127.0.0.1:${mailPort}`,
    MAIL_FROM: 'Lobewise tests <tests@lobewise.test>',
    STRIPE_SECRET_KEY: 'sk_test_integration',
    PAYMENTS_FAKE_API_KEY: 'sk_test_integration',
    PAYMENTS_FAKE_PORT: String(paymentsPort),
    PAYMENTS_FAKE_DATA_DIR: path.join(testDir, 'payments-fake'),
    PAYMENTS_FAKE_WEBHOOK_URL: `${appUrl}/api/payments/webhook`,
    PAYMENTS_FAKE_WEBHOOK_SECRET: 'whsec_integration',
    STRIPE_WEBHOOK_SECRET: 'whsec_integration',
    STRIPE_API_HOST: '127.0.0.1',
    STRIPE_API_PORT: String(paymentsPort),
    STRIPE_API_PROTOCOL: 'http',
  };
  const pids = [
    start('mail-fake', ['docker-local/mail-fake/server.mjs'], env),
    start('payments-fake', ['docker-local/payments-fake/server.mjs'], env),
    start(
      'app',
      [
        '--max-semi-space-size=64',
        'node_modules/next/dist/bin/next',
        'start',
        '-H',
        '127.0.0.1',
        '-p',
        String(appPort),
      ],
      env,
    ),
  ];
  const runtime: TestRuntime = {
    appUrl,
    mailUrl: env.RESEND_BASE_URL,
    paymentsUrl: `http://127.0.0.1:${paymentsPort}`,
    env,
    pids,
  };
  fs.writeFileSync(RUNTIME_FILE, JSON.stringify(runtime, null, 2));
  try {
    await Promise.all([
      waitForOk(`${runtime.mailUrl}/health`, 15_000),
      waitForOk(`${runtime.paymentsUrl}/health`, 15_000),
      waitForOk(`${appUrl}/api/health`, 60_000),
    ]);
  } catch (error) {
    // Jest skips the teardown when the setup fails: stop what was started, then say where the logs are.
    for (const pid of pids) {
      try {
        process.kill(-pid, 'SIGTERM');
      } catch {
        // already gone
      }
    }
    throw new Error(`${(error as Error).message}; see var/test/logs/ for what the servers printed`);
  }
}
