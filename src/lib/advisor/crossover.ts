/** Crossover rpm is reported to the nearest 10 rpm (our choice: finer than anyone can feel). */
export const CROSSOVER_RESOLUTION_RPM = 10;

// Definition used by the shop: the crossover is the first rpm from which the candidate out-pulls the
// baseline and keeps doing so to the end of the curve. Between grid points the torque difference is
// interpolated linearly. Null when the candidate is not ahead at the top of the curve.
export function crossoverRpm(rpms: Float64Array, candidate: Float64Array, baseline: Float64Array): number | null {
  const n = rpms.length;
  let first = -1;
  for (let i = n - 1; i >= 0; i--) {
    if (candidate[i] > baseline[i]) first = i;
    else break;
  }
  if (first < 0) return null;
  if (first === 0) return rpms[0];
  const d0 = candidate[first - 1] - baseline[first - 1]; // ≤ 0
  const d1 = candidate[first] - baseline[first]; // > 0
  const rpm = rpms[first - 1] + ((rpms[first] - rpms[first - 1]) * -d0) / (d1 - d0);
  return Math.round(rpm / CROSSOVER_RESOLUTION_RPM) * CROSSOVER_RESOLUTION_RPM;
}

/** True when the candidate is ahead of the baseline at this rpm on the grid (nearest point). */
export function aheadAt(rpms: Float64Array, candidate: Float64Array, baseline: Float64Array, rpm: number): boolean {
  let best = 0;
  for (let i = 1; i < rpms.length; i++) if (Math.abs(rpms[i] - rpm) < Math.abs(rpms[best] - rpm)) best = i;
  return candidate[best] > baseline[best];
}
