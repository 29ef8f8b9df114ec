import type { CamCard } from '@/lib/schemas/cam-card';
import { exhaustCenterlineDeg } from '../valve-events';
import { CRANK_STEP_DEG } from './constants';
import { effectiveAreaAtLiftM2, type HeadSpec } from './head-flow';
import { DEFAULT_RAMP_DEG, lobeShape, valveLiftIn, type LobeShape } from './valve-lift';

// A cam in a head, as the cycle sees it: valve lift curves (firing TDC at 0°, overlap TDC at 360°)
// and the effective flow area of each valve at every crank step.

export type CamSpec = {
  intake: LobeShape;
  exhaust: LobeShape;
  intakeAreaM2: Float64Array;
  exhaustAreaM2: Float64Array;
  /** Crank angle (deg, 0–720) at which the intake valve is fully closed: the cycle starts here. */
  intakeClosedDeg: number;
};

/** Seat-timed (advertised) duration: the card's, else the 0.050" figure plus the default ramp for hydraulic rollers. */
export function seatDurationDeg(duration050Deg: number, advertisedDeg: number | undefined): number {
  return advertisedDeg ?? duration050Deg + DEFAULT_RAMP_DEG['hydraulic-roller'];
}

export function camLobes(cam: CamCard): { intake: LobeShape; exhaust: LobeShape } {
  const ecl = exhaustCenterlineDeg(cam.lsa, cam.intakeCenterline);
  return {
    intake: lobeShape(
      360 + cam.intakeCenterline,
      cam.intakeDuration050,
      seatDurationDeg(cam.intakeDuration050, cam.intakeAdvertised),
      cam.intakeLiftIn,
      cam.rockerRatio,
    ),
    exhaust: lobeShape(
      360 - ecl,
      cam.exhaustDuration050,
      seatDurationDeg(cam.exhaustDuration050, cam.exhaustAdvertised),
      cam.exhaustLiftIn,
      cam.rockerRatio,
    ),
  };
}

export function camSpec(cam: CamCard, head: HeadSpec, crankStepDeg: number = CRANK_STEP_DEG): CamSpec {
  const { intake, exhaust } = camLobes(cam);
  const slots = Math.round(720 / crankStepDeg);
  const intakeAreaM2 = new Float64Array(slots);
  const exhaustAreaM2 = new Float64Array(slots);
  for (let s = 0; s < slots; s++) {
    const deg = s * crankStepDeg;
    intakeAreaM2[s] = effectiveAreaAtLiftM2(head.intakeFlow, valveLiftIn(intake, deg));
    exhaustAreaM2[s] = effectiveAreaAtLiftM2(head.exhaustFlow, valveLiftIn(exhaust, deg));
  }
  const intakeClosedDeg = Math.min(700, Math.ceil(intake.centerDeg + intake.halfBaseDeg));
  return { intake, exhaust, intakeAreaM2, exhaustAreaM2, intakeClosedDeg };
}
