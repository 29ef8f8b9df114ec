import { z } from 'zod';
import { closeSequelize, getSequelize } from '../lib/db/connection';
import { refreshAllDynoGains } from '../lib/db/queries/dyno-gains';
import { SIZES, ScaleWriter } from './scale/rows';

// npm run seed:scale -- --size M|L: fills the scratch database lobewise_scale (docker-local/bin/seed-scale
// has just reset it to the demo) with a busy shop's worth of invented rows, for npm run bench:scale.
export const SCALE_DATABASE = 'lobewise_scale';

const Args = z.object({ size: z.enum(['M', 'L'], { error: 'size must be M or L' }) });

async function main() {
  const at = process.argv.indexOf('--size');
  const args = Args.safeParse({ size: at >= 0 ? process.argv[at + 1] : 'M' });
  if (!args.success) {
    console.error(`seed:scale: ${args.error.issues.map((i) => i.message).join('; ')}`);
    process.exit(2);
  }
  // Never the demo or the test database: this deletes nothing, but it adds a hundred thousand rows.
  if (process.env.DB_NAME !== SCALE_DATABASE) {
    console.error(
      `seed:scale: DB_NAME must be ${SCALE_DATABASE} (got ${process.env.DB_NAME ?? 'nothing'}); run it through npm run seed:scale`,
    );
    process.exit(2);
  }
  const size = SIZES[args.data.size];
  const db = getSequelize();
  const writer = new ScaleWriter(db);
  const started = Date.now();
  const camIds = await writer.cams(size.cams);
  const owners = await writer.customersAndBuilds(size.customers);
  const made = await writer.quotes(size, owners, camIds);
  await writer.leads(size.leads);
  const runs = await writer.dynoRuns(size.dynoRuns, owners, camIds);
  await refreshAllDynoGains();
  await db.query(
    'ANALYZE TABLE cams, customers, builds, quotes, quote_lines, payments, leads, dyno_runs, dyno_gains, report_quote_days, report_margin_days',
  );
  console.log(
    `seed:scale ${args.data.size}: ${camIds.length} cams, ${owners.length} customers and builds, ${made.quotes} quotes, ${made.lines} lines, ${made.payments} payments, ${size.leads} leads, ${runs} dyno runs in ${((Date.now() - started) / 1000).toFixed(0)} s`,
  );
  await closeSequelize();
}

void main();
