import type { BuildProfile } from '@/lib/schemas/build-profile';
import { rpmAtMeanPistonSpeed } from './geometry';

// The rpm range the advisor predicts over, and the engine's real rev limit within it.

export const CURVE_START_RPM = 1500;
export const CURVE_END_RPM = 7000;
export const CURVE_STEP_RPM = 100;
/** Mean piston speed a street hydraulic-roller engine is kept under: 4,500 ft/min (common practice, from memory). */
export const SAFE_PISTON_SPEED_FT_MIN = 4500;

/**
 * Where each valvetrain runs out of control (valve float, lifter pump-up), rpm. Common practice, from
 * memory, deferring to the cam and spring maker's figures: stock hydraulic-roller springs about 6,200;
 * upgraded springs on hydraulic rollers about 6,800; a solid roller past the curve's 7,000.
 */
export const VALVETRAIN_LIMIT_RPM = {
  'stock-hydraulic': 6200,
  'upgraded-hydraulic': 6800,
  'solid-roller': 7500,
} as const;

/** The grid: 1,500 to 7,000 in 100s, cut at the mean-piston-speed limit when that comes first. */
export function rpmGrid(build: BuildProfile): Float64Array {
  const safe =
    Math.floor(rpmAtMeanPistonSpeed(build.engine.strokeIn, SAFE_PISTON_SPEED_FT_MIN) / CURVE_STEP_RPM) * CURVE_STEP_RPM;
  const end = Math.max(CURVE_START_RPM + 10 * CURVE_STEP_RPM, Math.min(CURVE_END_RPM, safe));
  const n = Math.floor((end - CURVE_START_RPM) / CURVE_STEP_RPM) + 1;
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) out[i] = CURVE_START_RPM + i * CURVE_STEP_RPM;
  return out;
}

/** The real rev limit with a cam: the valvetrain's (upgraded when the cam comes with new springs), within the grid. */
export function revLimitRpm(build: BuildProfile, gridEndRpm: number, withNewSprings: boolean): number {
  const valvetrain = build.engine.valvetrain ?? 'stock-hydraulic';
  const effective = withNewSprings && valvetrain === 'stock-hydraulic' ? 'upgraded-hydraulic' : valvetrain;
  return Math.min(gridEndRpm, VALVETRAIN_LIMIT_RPM[effective]);
}
