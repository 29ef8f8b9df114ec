// npm run bench:advisor — ranks the demo shop's catalogue and a generated 1,000-cam catalogue for one
// build, with full curves, and prints the median server time of each. A benchmark, not a test.
// It runs as one esbuild bundle, as the app runs it inside the Next build: under tsx every cross-module
// call goes through an export getter, which is a development cost, not the advisor's.
import { rankCams } from '../lib/advisor';
import { dailyTruck } from '../lib/builds/sample-trucks';
import { BuildProfileSchema } from '../lib/schemas/build-profile';
import { CamCatalogueSchema, type CamCard } from '../lib/schemas/cam-card';
import { generatedCatalogue } from './generated-catalogue';
// eslint-disable-next-line @typescript-eslint/no-require-imports
const { demoCamCards } = require('../../database/demo-cams.cjs') as { demoCamCards: () => unknown[] };

const build = BuildProfileSchema.parse(dailyTruck());

function medianMs(cams: readonly CamCard[], runs: number): { medianMs: number; fullyModelled: number } {
  rankCams(build, cams); // warm-up (JIT)
  const times: number[] = [];
  let fullyModelled = 0;
  for (let i = 0; i < runs; i++) {
    const t0 = process.hrtime.bigint();
    const r = rankCams(build, cams);
    times.push(Number(process.hrtime.bigint() - t0) / 1e6);
    fullyModelled = r.rankings.length;
  }
  times.sort((a, b) => a - b);
  return { medianMs: Number(times[Math.floor(times.length / 2)].toFixed(1)), fullyModelled };
}

const demo = CamCatalogueSchema.parse(demoCamCards());
const generated = generatedCatalogue(1000);
console.log(
  JSON.stringify(
    {
      build: '5.3 L truck, 240 cfm heads, long tubes, full exhaust, daily use',
      demoCatalogue: { cams: demo.length, runs: 20, ...medianMs(demo, 20), targetMs: 300 },
      generatedCatalogue: {
        cams: generated.length,
        runs: Number(process.env.BENCH_RUNS ?? 3),
        ...medianMs(generated, Number(process.env.BENCH_RUNS ?? 3)),
        targetMs: 1000,
      },
      node: process.version,
    },
    null,
    2,
  ),
);
