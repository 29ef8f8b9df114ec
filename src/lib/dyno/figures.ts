import { horsepower } from '@/lib/advisor/horsepower';

// A pull's figures: power from torque by the definition of horsepower, peaks read off the points,
// corrected figures as observed × correction factor. Pure.

export type PullPoint = { rpm: number; torqueLbFt: number; hp: number };
export type PeakFigures = { peakHp: number; peakHpRpm: number; peakTorqueLbFt: number; peakTorqueRpm: number };

// Definition of horsepower (33,000 ft·lbf/min): hp = lb·ft · rpm / 5252 on every point.
export function pullWithPower(points: readonly { rpm: number; torqueLbFt: number }[]): PullPoint[] {
  return points.map((p) => ({ rpm: p.rpm, torqueLbFt: p.torqueLbFt, hp: horsepower(p.torqueLbFt, p.rpm) }));
}

/** The highest power and torque on the pull and where they fall (the first rpm on a tie). */
export function peaksOf(pull: readonly PullPoint[]): PeakFigures {
  let hpAt = pull[0];
  let tqAt = pull[0];
  for (const p of pull) {
    if (p.hp > hpAt.hp) hpAt = p;
    if (p.torqueLbFt > tqAt.torqueLbFt) tqAt = p;
  }
  return { peakHp: hpAt.hp, peakHpRpm: hpAt.rpm, peakTorqueLbFt: tqAt.torqueLbFt, peakTorqueRpm: tqAt.rpm };
}

export const round1 = (n: number) => Math.round(n * 10) / 10;

/** Corrected = observed × factor; the same factor applies to torque and power (rpm is unchanged). */
export function correctedFigure(observed: number, factor: number): number {
  return observed * factor;
}

/** Measured peak-power gain, %, of the after run over the before run. */
export function gainPct(beforeHp: number, afterHp: number): number {
  return (afterHp / beforeHp - 1) * 100;
}
