/**
 * Idle vacuum estimate. Common practice, no published source; values from memory: a stock-type cam
 * idles near 20 inHg, and each degree of seat-timed overlap costs about 0.18 inHg in a 40 in³
 * cylinder, less in a bigger one (more displacement keeps pulling through the overlap).
 */
export const IDLE_VACUUM = {
  stockInHg: 20.5,
  lossPerOverlapDeg: 0.18,
  refCylinderCi: 40,
  minInHg: 3,
  maxInHg: 21,
  // Vacuum brake boosters want roughly 15+ inHg at idle (common practice).
  brakeBoosterMinInHg: 15,
  // Plain-words labels for what the customer will hear (our choice of cut-offs, from memory: stock-like
  // cams idle at 15+ inHg and sound smooth; a mild street cam at 11–15 has a noticeable lope).
  smoothAtLeastInHg: 15,
  noticeableAtLeastInHg: 11,
} as const;

// Common practice (values from memory): vacuum ≈ 20.5 − 0.18 · overlap · (40 / cylinder in³), clamped.
export function idleVacuumInHg(seatOverlapDeg: number, cylinderCi: number): number {
  const v = IDLE_VACUUM;
  const loss = v.lossPerOverlapDeg * Math.max(0, seatOverlapDeg) * (v.refCylinderCi / cylinderCi);
  return Math.min(v.maxInHg, Math.max(v.minInHg, v.stockInHg - loss));
}

export type IdleCharacter = 'smooth' | 'noticeable' | 'aggressive';

/** What the idle will sound like, in the interview's own words. */
export function idleCharacter(vacuumInHg: number): IdleCharacter {
  if (vacuumInHg >= IDLE_VACUUM.smoothAtLeastInHg) return 'smooth';
  if (vacuumInHg >= IDLE_VACUUM.noticeableAtLeastInHg) return 'noticeable';
  return 'aggressive';
}
