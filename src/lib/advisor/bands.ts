// Prediction bands: how far a measured curve may honestly sit from the model's, per rpm.
// From the calibration residuals (docs/advisor.md, "Calibration"): peak figures, fit and held-out
// together, have an RMS error of about 2.3 %; the band is two of those (≈ 95 % if errors were normal),
// rounded up to 5 %. Below 3,000 rpm there is no check data, so the band is half as wide again (our choice).
// A cam's gain over another in the same engine has its own residual (about 3.9 % RMS on the two
// held-out cams): that one sets the crossover's range. tests/unit/advisor/calibration.test.ts recomputes both.
export const BAND = {
  halfWidthPct: 5,
  lowRpmBelow: 3000,
  lowRpmFactor: 1.5,
  gainUncertaintyPct: 3.9,
} as const;

/** Band half-width (%) at an rpm, narrowed by the shop's measured evidence there: × √(prior / (prior + evidence)). */
export function bandHalfWidthPct(rpm: number, evidence = 0, prior = 2): number {
  const base = BAND.halfWidthPct * (rpm < BAND.lowRpmBelow ? BAND.lowRpmFactor : 1);
  return base * Math.sqrt(prior / (prior + Math.max(0, evidence)));
}
