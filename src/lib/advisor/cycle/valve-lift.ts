// Valve lift curves synthesised from the cam card. Our profile shape (documented in docs/advisor.md):
// tappet lift y(φ) = Lt · cosⁿ(π·φ / (2·H)) for |φ| < H, φ = crank degrees from the lobe centreline,
// Lt = valve lift / rocker ratio. The two unknowns H (half the base duration) and n (fullness) are
// solved so the curve passes 0.050" at half the 0.050" duration and the seat-timing lift at half the
// advertised duration. One shape for every card, so the same grind always gives the same events.

/** Tappet lift at which advertised (seat) duration is quoted for hydraulic lifters: 0.006" (common practice). */
export const SEAT_TAPPET_LIFT_IN = 0.006;
/** The trade's checking lift: 0.050" at the tappet. */
export const CHECKING_TAPPET_LIFT_IN = 0.05;

/**
 * Advertised minus 0.050" duration when a card gives no advertised figure, crank deg, by lifter type.
 * From memory (common practice, no published source): hydraulic roller ramps add about 50–56° (the demo
 * catalogue's own cards imply 52°), flat tappets about 60°, solid rollers about 45°.
 */
export const DEFAULT_RAMP_DEG = { 'hydraulic-roller': 52, 'flat-tappet': 60, 'solid-roller': 45 } as const;
export type LifterType = keyof typeof DEFAULT_RAMP_DEG;

export type LobeShape = { centerDeg: number; halfBaseDeg: number; fullness: number; valveLiftIn: number };

function halfAngleForRatio(ratio: number, n: number): number {
  return Math.acos(Math.pow(ratio, 1 / n));
}

/** Solves the fullness n so the lobe is dur050 wide at 0.050" and durSeat wide at the seat lift. */
export function lobeShape(
  centerDeg: number,
  duration050Deg: number,
  seatDurationDeg: number,
  valveLiftIn: number,
  rockerRatio: number,
): LobeShape {
  const tappetLiftIn = valveLiftIn / rockerRatio;
  const r050 = Math.min(0.95, CHECKING_TAPPET_LIFT_IN / tappetLiftIn);
  const rSeat = Math.min(r050 * 0.99, SEAT_TAPPET_LIFT_IN / tappetLiftIn);
  const wanted = seatDurationDeg / duration050Deg;
  // ratio(n) = acos(rSeat^(1/n)) / acos(r050^(1/n)) rises with n (from 1 towards √(ln rSeat / ln r050)); bisect on n in [0.3, 40].
  let lo = 0.3;
  let hi = 40;
  for (let i = 0; i < 50; i++) {
    const mid = (lo + hi) / 2;
    const ratio = halfAngleForRatio(rSeat, mid) / halfAngleForRatio(r050, mid);
    if (ratio > wanted) hi = mid;
    else lo = mid;
  }
  const n = (lo + hi) / 2;
  const halfBase = (Math.PI * duration050Deg) / 4 / halfAngleForRatio(r050, n);
  return { centerDeg, halfBaseDeg: halfBase, fullness: n, valveLiftIn };
}

/** Valve lift (in) at a crank angle, on a 720° cycle. */
export function valveLiftIn(shape: LobeShape, crankDeg: number): number {
  let phi = crankDeg - shape.centerDeg;
  phi -= 720 * Math.round(phi / 720);
  if (Math.abs(phi) >= shape.halfBaseDeg) return 0;
  return shape.valveLiftIn * Math.pow(Math.cos((Math.PI * phi) / (2 * shape.halfBaseDeg)), shape.fullness);
}
