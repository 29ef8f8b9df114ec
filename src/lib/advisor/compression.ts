import type { BuildProfile } from '@/lib/schemas/build-profile';
import type { CamCard } from '@/lib/schemas/cam-card';
import { pistonTravelFromTdcIn } from './geometry';
import { seatIntakeClosingDeg } from './valve-events';

// Arithmetic: static CR = (swept + clearance) / clearance, so clearance = swept / (CR − 1).
export function clearanceVolumeCi(sweptCi: number, compressionRatio: number): number {
  return sweptCi / (compressionRatio - 1);
}

// Heywood ch. 2 (slider-crank) applied to the trapped charge: DCR = (V after IVC + Vc) / Vc.
// Piston travel left after IVC, as a fraction of the stroke, times (CR − 1), plus 1. Bore cancels.
export function dynamicCompressionRatio(
  strokeIn: number,
  rodLengthIn: number,
  compressionRatio: number,
  ivcAbdcDeg: number,
): number {
  // An intake that closes before BDC traps the full stroke; one after 180° ABDC is not a cam.
  const ivc = Math.min(180, Math.max(0, ivcAbdcDeg));
  const travelLeftIn = pistonTravelFromTdcIn(strokeIn, rodLengthIn, 180 + ivc);
  return 1 + (travelLeftIn / strokeIn) * (compressionRatio - 1);
}

/** Dynamic compression ratio of this cam in this engine, from the seat-timed IVC. */
export function dynamicCompression(build: BuildProfile, cam: CamCard): number {
  const e = build.engine;
  return dynamicCompressionRatio(e.strokeIn, e.rodLengthIn, e.compressionRatio, seatIntakeClosingDeg(cam));
}
