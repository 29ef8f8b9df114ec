import { z } from 'zod';
import { closeSequelize } from '../lib/db/connection';
import { remindExpiringQuotes } from '../lib/quotes/expiry-reminders';

// npm run quotes:remind-expiring [-- --days N]: e-mails each customer whose sent quote runs out within
// N days (default 3, UTC days) one reminder with a fresh private link. Safe to run as often as you like
// (a quote is reminded once); in production run it daily from cron or a systemd timer with the server's
// environment. Prints what it did as JSON; exits 1 when an e-mail could not be sent (retried next run).

const Args = z.object({
  days: z.coerce
    .number({ error: 'days must be a whole number' })
    .int({ error: 'days must be a whole number' })
    .min(0, { error: 'days must be 0 to 30' })
    .max(30, { error: 'days must be 0 to 30' }),
});

async function main() {
  const at = process.argv.indexOf('--days');
  const args = Args.safeParse({ days: at >= 0 ? process.argv[at + 1] : 3 });
  if (!args.success) {
    console.error(`quotes:remind-expiring: ${args.error.issues.map((i) => i.message).join('; ')}`);
    process.exit(2);
  }
  const run = await remindExpiringQuotes({ withinDays: args.data.days });
  console.log(JSON.stringify(run));
  await closeSequelize();
  process.exit(run.failed.length ? 1 : 0);
}

void main();
