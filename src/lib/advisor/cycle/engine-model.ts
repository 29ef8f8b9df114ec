import { FITTED, NM_PER_LBFT } from './constants';
import type { CamSpec } from './cam-spec';
import type { EngineSpec } from './engine-spec';
import { monotoneCubic } from './interpolate';
import { simulateRpm, type CyclePoint, type Fitted, type WarmStart } from './simulate';

/** The cycle is run every this many rpm and joined by a monotone cubic (our choice: VE changes slowly with rpm). */
export const SIMULATION_STEP_RPM = 500;

/** The rpm points the cycle is simulated at: every 500 from the first grid rpm, and the last grid rpm. */
export function simulationRpms(gridRpms: ArrayLike<number>, stepRpm: number = SIMULATION_STEP_RPM): number[] {
  const first = gridRpms[0];
  const last = gridRpms[gridRpms.length - 1];
  const out: number[] = [];
  for (let r = first; r < last - stepRpm / 2; r += stepRpm) out.push(r);
  out.push(last);
  return out;
}

export type ModelCurve = { torqueLbFt: Float64Array; points: CyclePoint[] };

/** Torque (lb·ft) over the grid for one cam in one engine, with the simulated points for "how it was reached". */
export function modelCurve(
  engine: EngineSpec,
  cam: CamSpec,
  gridRpms: Float64Array,
  fitted: Fitted = FITTED,
  stepRpm: number = SIMULATION_STEP_RPM,
): ModelCurve {
  const rpms = simulationRpms(gridRpms, stepRpm);
  const points: CyclePoint[] = [];
  let warm: WarmStart | undefined;
  for (const rpm of rpms) {
    const r = simulateRpm(engine, cam, rpm, fitted, warm);
    points.push(r.point);
    warm = r.warm;
  }
  const torqueLbFt = monotoneCubic(
    rpms,
    points.map((p) => p.torqueNm / NM_PER_LBFT),
    gridRpms,
  );
  return { torqueLbFt, points };
}
