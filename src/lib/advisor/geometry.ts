// Engine geometry: the arithmetic every cam conversation starts from.

/** 1 litre = 61.024 in³ (arithmetic: 1000 cm³ / 16.387 cm³ per in³). */
export const CUBIC_INCHES_PER_LITRE = 61.024;

// Arithmetic: one cylinder's swept volume = π/4 · bore² · stroke.
export function cylinderVolumeCi(boreIn: number, strokeIn: number): number {
  return (Math.PI / 4) * boreIn * boreIn * strokeIn;
}

// Arithmetic: displacement = π/4 · bore² · stroke · cylinders.
export function displacementCi(boreIn: number, strokeIn: number, cylinders: number): number {
  return cylinderVolumeCi(boreIn, strokeIn) * cylinders;
}

// Arithmetic: litres = in³ / 61.024.
export function litresFromCubicInches(ci: number): number {
  return ci / CUBIC_INCHES_PER_LITRE;
}

const DEG = Math.PI / 180;

// Heywood, ICE Fundamentals (1988) ch. 2: slider-crank, s = a·cosθ + √(l² − a²·sin²θ), a = stroke/2.
export function crankToPinDistanceIn(strokeIn: number, rodLengthIn: number, crankDeg: number): number {
  const a = strokeIn / 2;
  const t = crankDeg * DEG;
  const sin = Math.sin(t);
  return a * Math.cos(t) + Math.sqrt(rodLengthIn * rodLengthIn - a * a * sin * sin);
}

// Heywood ch. 2: piston travel from TDC = l + a − s (crankDeg measured from TDC).
export function pistonTravelFromTdcIn(strokeIn: number, rodLengthIn: number, crankDeg: number): number {
  return rodLengthIn + strokeIn / 2 - crankToPinDistanceIn(strokeIn, rodLengthIn, crankDeg);
}

// Heywood ch. 2: mean piston speed = 2 · stroke · rpm (stroke in inches → ft/min divides by 12).
export function meanPistonSpeedFtMin(strokeIn: number, rpm: number): number {
  return (2 * strokeIn * rpm) / 12;
}

// Heywood ch. 2, solved for rpm: rpm = speed · 12 / (2 · stroke).
export function rpmAtMeanPistonSpeed(strokeIn: number, speedFtMin: number): number {
  return (speedFtMin * 12) / (2 * strokeIn);
}
