import type { BuildProfile } from '@/lib/schemas/build-profile';
import type { CamCard } from '@/lib/schemas/cam-card';
import { CALIBRATION_ENGINE, CALIBRATION_STOCK_CAM, type PeakFact } from './calibration';
import { crossoverRpm } from './crossover';
import { curvePeaks } from './curve';
import { camSpec } from './cycle/cam-spec';
import type { FittedConstants } from './cycle/constants';
import { modelCurve } from './cycle/engine-model';
import { engineSpec } from './cycle/engine-spec';
import { revLimitRpm, rpmGrid } from './rpm-grid';

type Crossing = { candidate: CamCard; against: CamCard; rpm: number; what: string };

/** Residuals of the model against the calibration facts for a set of fitted constants. */
export function calibrationReport(fitted: FittedConstants, peaks: readonly PeakFact[], crossings: readonly Crossing[]) {
  const build: BuildProfile = { ...CALIBRATION_ENGINE, baselineCam: CALIBRATION_STOCK_CAM };
  const engine = engineSpec(build, fitted);
  const full = rpmGrid(build);
  // The dyno engine had springs for every cam: its pulls ran to the upgraded valvetrain's limit.
  const limit = revLimitRpm(build, full[full.length - 1], true);
  const rpms = full.filter((r) => r <= limit);
  const curves = new Map<CamCard['id'], Float64Array>();
  const curve = (cam: CamCard) => {
    let c = curves.get(cam.id);
    if (!c) curves.set(cam.id, (c = modelCurve(engine, camSpec(cam, engine.head), rpms, fitted).torqueLbFt));
    return c;
  };
  return {
    peaks: peaks.map((f) => {
      const predicted = curvePeaks(rpms, curve(f.cam))[f.quantity];
      return {
        cam: f.cam.id,
        quantity: f.quantity,
        set: f.set,
        measured: f.value,
        predicted: Math.round(predicted * 10) / 10,
        errorPct: Math.round((predicted / f.value - 1) * 1000) / 10,
      };
    }),
    crossings: crossings.map((c) => {
      const predicted = crossoverRpm(rpms, curve(c.candidate), curve(c.against));
      return {
        what: c.what,
        set: 'held-out' as const,
        measuredRpm: c.rpm,
        predictedRpm: predicted,
        errorRpm: predicted === null ? null : predicted - c.rpm,
      };
    }),
  };
}
