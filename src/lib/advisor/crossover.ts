/** Crossover rpm is reported to the nearest 10 rpm (our choice: finer than anyone can feel). */
export const CROSSOVER_RESOLUTION_RPM = 10;

/**
 * Torque differences smaller than this share of the current cam's torque are a tie, not a lead lost
 * (numerics, our choice): the cycle model settles each point to 0.2 % and its points move by up to about
 * 0.5 % between two and five cycles (measured 3 Dec 2026), so a dip of a pound-foot or two is below
 * what the model can resolve and must not move the crossover by thousands of rpm.
 */
export const TIE_FRACTION = 0.005;

const behind = (candidate: number, baseline: number) => candidate < baseline * (1 - TIE_FRACTION);

const round = (rpm: number) => Math.round(rpm / CROSSOVER_RESOLUTION_RPM) * CROSSOVER_RESOLUTION_RPM;

// Where the torque difference changes sign between two grid points, linearly interpolated.
function signChangeRpm(rpms: ArrayLike<number>, d0: number, d1: number, i: number): number {
  return rpms[i - 1] + ((rpms[i] - rpms[i - 1]) * -d0) / (d1 - d0);
}

/** Index of the last grid point at or below the limit. */
function lastIndex(rpms: ArrayLike<number>, limitRpm: number): number {
  let n = rpms.length - 1;
  while (n > 0 && rpms[n] > limitRpm) n--;
  return n;
}

// Definition used by the shop: the crossover is the first rpm from which the candidate out-pulls the
// baseline and keeps doing so to the engine's rev limit (default: the top of the curve); a tie within the
// model's resolution on the way does not end the lead. Between grid points the torque difference is
// interpolated linearly. Null when the candidate is not ahead at any point of that last stretch.
export function crossoverRpm(
  rpms: ArrayLike<number>,
  candidate: ArrayLike<number>,
  baseline: ArrayLike<number>,
  limitRpm = Infinity,
): number | null {
  const n = lastIndex(rpms, limitRpm);
  let stretchStart = n + 1;
  while (stretchStart > 0 && !behind(candidate[stretchStart - 1], baseline[stretchStart - 1])) stretchStart--;
  let first = stretchStart;
  while (first <= n && candidate[first] <= baseline[first]) first++;
  if (first > n) return null;
  if (first === 0) return rpms[0];
  return round(
    signChangeRpm(rpms, candidate[first - 1] - baseline[first - 1], candidate[first] - baseline[first], first),
  );
}

export type LeadStretch = { fromRpm: number; toRpm: number };

/**
 * The longest stretch, within the rev limit, over which the candidate out-pulls the baseline; null when
 * it never does. A cam that leads from 2,300 to 6,500 rpm but falls behind past the valvetrain's limit
 * still leads where the engine is really used.
 */
export function leadStretch(
  rpms: ArrayLike<number>,
  candidate: ArrayLike<number>,
  baseline: ArrayLike<number>,
  limitRpm = Infinity,
): LeadStretch | null {
  const n = lastIndex(rpms, limitRpm);
  let best: LeadStretch | null = null;
  let start = -1;
  for (let i = 0; i <= n + 1; i++) {
    const ahead = i <= n && (start >= 0 ? !behind(candidate[i], baseline[i]) : candidate[i] > baseline[i]);
    if (ahead && start < 0) start = i;
    if (!ahead && start >= 0) {
      const from =
        start === 0
          ? rpms[0]
          : signChangeRpm(rpms, candidate[start - 1] - baseline[start - 1], candidate[start] - baseline[start], start);
      const to =
        i > n ? rpms[n] : signChangeRpm(rpms, candidate[i - 1] - baseline[i - 1], candidate[i] - baseline[i], i);
      if (!best || to - from > best.toRpm - best.fromRpm) best = { fromRpm: round(from), toRpm: round(to) };
      start = -1;
    }
  }
  return best;
}

/** True when the candidate is ahead of the baseline at this rpm on the grid (nearest point). */
export function aheadAt(
  rpms: ArrayLike<number>,
  candidate: ArrayLike<number>,
  baseline: ArrayLike<number>,
  rpm: number,
): boolean {
  let best = 0;
  for (let i = 1; i < rpms.length; i++) if (Math.abs(rpms[i] - rpm) < Math.abs(rpms[best] - rpm)) best = i;
  return candidate[best] > baseline[best];
}
