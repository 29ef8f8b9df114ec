/** 1 hp = 33,000 ft·lbf/min; 33,000 / 2π = 5,252.1, used as 5,252 by the trade. */
export const HP_TORQUE_CONSTANT = 5252;

// Definition of horsepower (33,000 ft·lbf/min): hp = torque (lb·ft) · rpm / 5252.
export function horsepower(torqueLbFt: number, rpm: number): number {
  return (torqueLbFt * rpm) / HP_TORQUE_CONSTANT;
}

// Definition of horsepower, solved for torque: lb·ft = hp · 5252 / rpm.
export function torqueFromHorsepower(hp: number, rpm: number): number {
  return (hp * HP_TORQUE_CONSTANT) / rpm;
}
