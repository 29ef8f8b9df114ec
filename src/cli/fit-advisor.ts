// Fits the cycle model's few physical constants once, to the fitting set in src/lib/advisor/calibration.ts,
// inside their published ranges, and reports fit and held-out residuals. Run: npm run fit:advisor
// The printed values are then written into FITTED (src/lib/advisor/cycle/constants.ts) by hand.
import { CALIBRATION_ENGINE, CALIBRATION_STOCK_CAM, CROSSING_FACTS, PEAK_FACTS } from '@/lib/advisor/calibration';
import { FITTED, FITTED_RANGES, type FittedConstants } from '@/lib/advisor/cycle/constants';
import { calibrationReport } from '@/lib/advisor/calibration-report';

function grid(min: number, max: number, steps: number): number[] {
  return Array.from({ length: steps }, (_, i) => min + ((max - min) * i) / (steps - 1));
}

const fitFacts = PEAK_FACTS.filter((f) => f.set === 'fit');
let best: { fitted: FittedConstants; cost: number } | null = null;
const r = FITTED_RANGES;
for (const combustionEfficiency of grid(r.combustionEfficiency.min, r.combustionEfficiency.max, 5)) {
  for (const frictionScale of grid(r.frictionScale.min, r.frictionScale.max, 6)) {
    for (const waveAttenuation of grid(r.waveAttenuation.min, r.waveAttenuation.max, 5)) {
      const fitted = { ...FITTED, combustionEfficiency, frictionScale, waveAttenuation };
      const report = calibrationReport(fitted, fitFacts, []);
      const cost = report.peaks.reduce((s, p) => s + p.errorPct * p.errorPct, 0);
      if (!best || cost < best.cost) best = { fitted, cost };
    }
  }
}
const chosen = best!.fitted;
const report = calibrationReport(chosen, PEAK_FACTS, CROSSING_FACTS);
console.log(
  JSON.stringify(
    { fitted: chosen, baseline: CALIBRATION_STOCK_CAM.id, engine: CALIBRATION_ENGINE.engine, ...report },
    null,
    2,
  ),
);
