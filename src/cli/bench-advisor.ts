// npm run bench:advisor — ranks a generated 1,000-cam catalogue for one build, repeatedly, with full
// curves, and prints the median time per ranking and per cam. A benchmark, not a test.
// It runs as one esbuild bundle, as the app runs it inside the Next build: under tsx every cross-module
// call goes through an export getter, which is a development cost, not the advisor's.
import { rankCams } from '../lib/advisor';
import { BuildProfileSchema } from '../lib/schemas/build-profile';
import { CamCatalogueSchema, type CamCard } from '../lib/schemas/cam-card';

// Deterministic pseudo-random numbers (mulberry32), so every run ranks the same catalogue.
function mulberry32(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

function catalogue(n: number): CamCard[] {
  const rnd = mulberry32(20261202);
  const cams = [];
  for (let i = 0; i < n; i++) {
    const dur = 190 + Math.round(rnd() * 60);
    const lsa = 106 + Math.round(rnd() * 12);
    const lift = Math.round((0.45 + (dur - 190) * 0.005 + rnd() * 0.03) * 1000) / 1000;
    cams.push({
      id: `GEN-${String(i).padStart(4, '0')}`, name: `Generated grind ${dur}`, intakeDuration050: dur, exhaustDuration050: dur + Math.round(rnd() * 10),
      intakeLiftIn: lift, exhaustLiftIn: lift, lsa, intakeCenterline: lsa - Math.round(rnd() * 6),
      emissionsCertified: rnd() < 0.1, deactivationCompatible: rnd() < 0.3, priceCents: 30000 + Math.round(rnd() * 25000),
    });
  }
  return CamCatalogueSchema.parse(cams);
}

const build = BuildProfileSchema.parse({
  engine: { cylinders: 8, boreIn: 3.78, strokeIn: 3.622, rodLengthIn: 6.098, compressionRatio: 9.9, headMaterial: 'aluminum', intakeFlowCfm: 240, intakeManifold: 'truck', cylinderDeactivation: 'none' },
  exhaust: { headers: 'long-tube', primaryIn: 1.75, system: 'full' },
  drivetrain: { transmission: 'automatic', stallRpm: 2200, axleRatio: 3.73, topGearRatio: 0.7, tireDiameterIn: 31 },
  vehicle: { weightLb: 5200, powerBrakes: 'vacuum' },
  use: { primary: 'daily', idle: 'smooth', fuelOctane: 91, emissionsRequired: false, cruiseMph: 70, budgetCents: 250000 },
  baselineCam: { id: 'stock', name: 'Stock', intakeDuration050: 190, exhaustDuration050: 191, intakeLiftIn: 0.467, exhaustLiftIn: 0.479, lsa: 114.5, intakeCenterline: 114.5 },
});

const N = 1000;
const RUNS = Number(process.env.BENCH_RUNS ?? 30);
const cams = catalogue(N);
for (let i = 0; i < 5; i++) rankCams(build, cams); // warm-up (JIT)
const times: number[] = [];
let points = 0;
for (let i = 0; i < RUNS; i++) {
  const t0 = process.hrtime.bigint();
  const r = rankCams(build, cams);
  times.push(Number(process.hrtime.bigint() - t0) / 1e6);
  points = r.rankings.reduce((s, x) => s + x.curve.length, 0);
}
times.sort((a, b) => a - b);
const median = times[Math.floor(times.length / 2)];
console.log(JSON.stringify({
  cams: N, runs: RUNS, curvePointsPerRanking: points,
  medianMsPerRanking: Number(median.toFixed(2)), medianMsPerCam: Number((median / N).toFixed(4)),
  fastestMs: Number(times[0].toFixed(2)), slowestMs: Number(times[times.length - 1].toFixed(2)),
  targetMs: 50, node: process.version,
}, null, 2));
