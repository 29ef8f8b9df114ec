import { execFile, execFileSync } from 'node:child_process';
import path from 'node:path';
import { QueryTypes, type Sequelize } from 'sequelize';
import request from 'supertest';
import { signedInAgent } from '../support/auth';
import { connectTestDatabase, disconnectTestDatabase } from '../support/database';
import { mailsTo, waitForMailsTo } from '../support/mail';
import { dayFromToday, makeSentQuote } from '../support/quote-fixtures';
import { readRuntime } from '../support/runtime';

// The expiry reminder (issue 12, item 5): the command the server runs daily, run here as production runs
// it (npm's script, the app's environment) against the test database and the mail fake. Dates are
// relative to today.
const { appUrl, env } = readRuntime();
const ROOT = path.resolve(__dirname, '../..');

let sequelize: Sequelize;
let counter: Awaited<ReturnType<typeof signedInAgent>>;

beforeAll(async () => {
  sequelize = connectTestDatabase();
  counter = await signedInAgent('counter');
});
afterAll(() => disconnectTestDatabase());

// Run without blocking: a synchronous run held the test's event loop past the mail fake's keep-alive
// timeout, and the next read of the inbox went out on a socket the fake had already closed.
async function remind(
  days?: number,
): Promise<{ reminded: string[]; withoutEmail: string[]; failed: string[]; through: string }> {
  const args = [
    'tsx',
    '--tsconfig',
    'tsconfig.cli.json',
    'src/cli/remind-expiring.ts',
    ...(days === undefined ? [] : ['--days', String(days)]),
  ];
  const out = await new Promise<string>((resolve, reject) =>
    execFile(
      'npx',
      args,
      { cwd: ROOT, env: { ...process.env, ...env }, encoding: 'utf8', timeout: 60_000 },
      (error, stdout) => (error ? reject(error) : resolve(stdout)),
    ),
  );
  return JSON.parse(out.trim().split('\n').at(-1)!);
}
const reminders = async (email: string) => (await mailsTo(email)).filter((m) => m.subject.includes('is good until'));

describe('the expiry reminder command', () => {
  it('reminds once each open quote near its valid-until day, with a working link, and no other', async () => {
    const soon = await makeSentQuote(counter, 'Expiring soon', { validUntil: dayFromToday(2) });
    const later = await makeSentQuote(counter, 'Expiring later', { validUntil: dayFromToday(12) });
    const declined = await makeSentQuote(counter, 'Expiring declined', { validUntil: dayFromToday(1) });
    await counter
      .post(`/api/quotes/${declined.id}/transition`)
      .send({ to: 'declined', version: declined.version })
      .expect(200);
    const before = (await counter.get(`/api/quotes/${soon.id}`)).body as { version: number; updatedAt: string };

    const first = await remind();
    expect(first.reminded).toContain(soon.number);
    expect(first.reminded).not.toContain(later.number);
    expect(first.reminded).not.toContain(declined.number);
    expect(first.failed).toEqual([]);
    const [mail] = await waitForMailsTo(soon.customerEmail, 2);
    expect(mail.subject).toContain(`Your quote ${soon.number} is good until`);
    expect(mail.html).toContain('Open your quote');
    const link = /(http:\/\/\S+\/q\/[A-Za-z0-9_-]+)/.exec(mail.text)![1];
    expect(link.startsWith(appUrl)).toBe(true);
    const page = await request(appUrl).get(new URL(link).pathname);
    expect(page.status).toBe(200);
    expect(page.text).toContain(soon.number);
    // The reminder does not move the quote's version under a colleague's open page.
    expect(((await counter.get(`/api/quotes/${soon.id}`)).body as { version: number }).version).toBe(before.version);

    // Run again: nobody is reminded twice.
    const second = await remind();
    expect(second.reminded).not.toContain(soon.number);
    expect(await reminders(soon.customerEmail)).toHaveLength(1);
    expect(await reminders(later.customerEmail)).toHaveLength(0);
    expect(await reminders(declined.customerEmail)).toHaveLength(0);
    const audit = await sequelize.query<{ n: number }>(
      "SELECT COUNT(*) AS n FROM audit_log WHERE action = 'quote.expiry-reminded' AND entity_id = ?",
      { replacements: [String(soon.id)], type: QueryTypes.SELECT },
    );
    expect(Number(audit[0].n)).toBe(1);

    // A wider window reaches the later quote, once.
    expect((await remind(14)).reminded).toContain(later.number);
    expect(await reminders(later.customerEmail)).toHaveLength(1);
  }, 180_000);

  it('refuses a bad --days with exit code 2 and a message naming it', () => {
    let status = 0;
    let stderr = '';
    try {
      execFileSync('npx', ['tsx', '--tsconfig', 'tsconfig.cli.json', 'src/cli/remind-expiring.ts', '--days', 'soon'], {
        cwd: ROOT,
        env: { ...process.env, ...env },
        encoding: 'utf8',
        stdio: 'pipe',
        timeout: 60_000,
      });
    } catch (error) {
      status = (error as { status: number }).status;
      stderr = String((error as { stderr: string }).stderr);
    }
    expect(status).toBe(2);
    expect(stderr).toMatch(/days must be a whole number/);
  }, 60_000);
});
