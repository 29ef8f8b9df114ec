import { closeSequelize } from '../lib/db/connection';
import { refreshAllDynoGains } from '../lib/db/queries/dyno-gains';

// npm run dyno:reindex: rewrites dyno_gains (the advisor's measured history) from every stored dyno run.
// The app keeps the table in step on every write; this is for runs stored before the table existed.
async function main() {
  const started = Date.now();
  const builds = await refreshAllDynoGains();
  console.log(
    `dyno:reindex: ${builds} builds with dyno runs refiled in ${((Date.now() - started) / 1000).toFixed(1)} s`,
  );
  await closeSequelize();
}

void main().catch(async (error: unknown) => {
  console.error('dyno:reindex failed:', error);
  await closeSequelize();
  process.exit(1);
});
