import type { CamCard } from '@/lib/schemas/cam-card';
import { DEFAULT_RAMP_DEG } from './cycle/valve-lift';

// Valve events in crank degrees: IVO and EVC around TDC, IVC and EVO around BDC.
// A positive IVO means "opens before TDC", positive IVC "closes after BDC", and so on.
export type ValveEventSet = {
  ivo: number; // intake opens, deg BTDC
  ivc: number; // intake closes, deg ABDC
  evo: number; // exhaust opens, deg BBDC
  evc: number; // exhaust closes, deg ATDC
  overlap: number; // IVO + EVC, deg (negative: both valves are never open together at this lift)
};

export type ValveEvents = ValveEventSet & {
  exhaustCenterline: number; // ECL, deg before TDC (exhaust lobe peak), as printed on cards
  /** The same events at advertised (seat) duration, when the card gives both advertised figures. */
  advertised?: ValveEventSet;
};

/**
 * Seat-timing allowance: how much later the valve really seats than it passes 0.050" tappet lift, per
 * event — half the default ramp the cycle model's lift curves use (advertised − 0.050" = 52° for a
 * hydraulic roller, so 26° per side), so a card with and without advertised figures gives the same
 * seat timing, overlap, dynamic compression and idle. Used only when a card has no advertised duration.
 */
export const SEAT_TIMING_ALLOWANCE_DEG = DEFAULT_RAMP_DEG['hydraulic-roller'] / 2;

// Standard cam-card arithmetic, common practice: ECL = 2·LSA − ICL.
export function exhaustCenterlineDeg(lsaDeg: number, intakeCenterlineDeg: number): number {
  return 2 * lsaDeg - intakeCenterlineDeg;
}

// Standard cam-card arithmetic, common practice: IVO = dur/2 − ICL, IVC = dur/2 + ICL − 180,
// EVO = dur/2 + ECL − 180, EVC = dur/2 − ECL, overlap = IVO + EVC.
export function eventsFromDurations(
  intakeDurationDeg: number,
  exhaustDurationDeg: number,
  lsaDeg: number,
  intakeCenterlineDeg: number,
): ValveEventSet {
  const ecl = exhaustCenterlineDeg(lsaDeg, intakeCenterlineDeg);
  const ivo = intakeDurationDeg / 2 - intakeCenterlineDeg;
  const ivc = intakeDurationDeg / 2 + intakeCenterlineDeg - 180;
  const evo = exhaustDurationDeg / 2 + ecl - 180;
  const evc = exhaustDurationDeg / 2 - ecl;
  return { ivo, ivc, evo, evc, overlap: ivo + evc };
}

/** Valve events at 0.050" tappet lift (and at advertised duration when the card has both figures). */
export function valveEvents(cam: CamCard): ValveEvents {
  const at050 = eventsFromDurations(cam.intakeDuration050, cam.exhaustDuration050, cam.lsa, cam.intakeCenterline);
  const out: ValveEvents = {
    ivo: at050.ivo,
    ivc: at050.ivc,
    evo: at050.evo,
    evc: at050.evc,
    overlap: at050.overlap,
    exhaustCenterline: exhaustCenterlineDeg(cam.lsa, cam.intakeCenterline),
  };
  if (cam.intakeAdvertised !== undefined && cam.exhaustAdvertised !== undefined) {
    out.advertised = eventsFromDurations(cam.intakeAdvertised, cam.exhaustAdvertised, cam.lsa, cam.intakeCenterline);
  }
  return out;
}

// Common practice: seat-timed IVC from the advertised duration when given, else 0.050" IVC + allowance.
export function seatIntakeClosingDeg(cam: CamCard): number {
  if (cam.intakeAdvertised !== undefined) return cam.intakeAdvertised / 2 + cam.intakeCenterline - 180;
  return cam.intakeDuration050 / 2 + cam.intakeCenterline - 180 + SEAT_TIMING_ALLOWANCE_DEG;
}

// Common practice: seat-timed overlap from advertised durations when both are given,
// else 0.050" overlap plus the allowance at both ends (IVO and EVC).
export function seatOverlapDeg(cam: CamCard): number {
  if (cam.intakeAdvertised !== undefined && cam.exhaustAdvertised !== undefined) {
    return (cam.intakeAdvertised + cam.exhaustAdvertised) / 2 - 2 * cam.lsa;
  }
  return overlap050Deg(cam) + 2 * SEAT_TIMING_ALLOWANCE_DEG;
}

// Arithmetic from the events above: overlap = IVO + EVC = (dur_in + dur_ex)/2 − 2·LSA.
export function overlap050Deg(cam: CamCard): number {
  return (cam.intakeDuration050 + cam.exhaustDuration050) / 2 - 2 * cam.lsa;
}
