// Every number the power model uses, in one place, with what it stands for and where it came from.
// "Calibrated" means chosen so the dyno facts in docs/advisor.md (a 5.7 L with ported cathedral heads
// on three cams) come out within tolerance; "common practice" means a rule of thumb of the trade
// without a published source; "our choice" means a judgement we made and can defend, not a fact.

export const MODEL = {
  // Reference cylinder volume the size scaling is centred on (our choice: ~5.3 L / 8, in³).
  refCylinderCi: 40,
  // Peak-VE rpm of a 200° @0.050" cam in a 40 in³ cylinder with a truck intake (calibrated).
  peakRpmAt200Deg: 4720,
  // How strongly intake duration moves the peak: rpm ∝ (duration / 200)^exp (calibrated).
  durationExponent: 1.11,
  // How much smaller a cam acts in a bigger cylinder: rpm ∝ (40 / cylinder in³)^exp.
  // Our choice from memory: the same cam peaks a few hundred rpm lower in a 6.0 L than in a 5.3 L.
  sizeExponent: 0.5,
  // Installed centerline: each degree of retard past 110° ICL moves the band up this fraction
  // (common practice, from memory: 4° of advance moves the band down ~100–200 rpm).
  centerlinePerDeg: 0.005,
  refCenterlineDeg: 110,
  // Width of the VE bell in log-rpm below and above the peak, at 112° LSA (calibrated).
  sigmaLow: 0.97,
  sigmaHigh: 0.4,
  // A wider LSA spreads the curve (common practice); fraction of width per degree of LSA (our choice).
  lsaWidthPerDeg: 0.02,
  // ... and a tighter one peaks a little harder: fraction of peak VE per degree (our choice).
  lsaPeakPerDeg: 0.004,
  refLsaDeg: 112,
  // Valve lift vs the port: flow levels off near L/D ≈ 0.30 and the intake valve is about 52 % of
  // the bore on a two-valve wedge head (common practice, from memory).
  valveToBore: 0.52,
  liftOverDiameterAtPeakFlow: 0.3,
  // Shape of "flow gained with lift" below that point: 1 − (1 − L/Lpeak)^exp (calibrated).
  liftExponent: 1.75,
  // Low-rpm loss from overlap (exhaust pushing back into the intake at low rpm): fraction of peak VE
  // per 40° of seat-timed overlap in a 40 in³ cylinder, fading above overlapFadeRpm (calibrated).
  overlapLossPer40Deg: 0.06,
  overlapFadeRpm: 2000,
  // Torque per in³ at 100 % of the model's peak VE, at 10:1 static compression (calibrated).
  torquePerCiAtPeak: 1.39,
  // Otto-cycle efficiency 1 − CR^−(γ−1) with γ − 1 = 0.3, relative to 10:1 (Heywood ch. 5; γ our choice).
  compressionGammaMinusOne: 0.3,
  refCompressionRatio: 10,
  // Port flow per in³ of cylinder fills the cylinder better, with diminishing returns:
  // VE ∝ 1 − exp(−(cfm / cylinder in³) / scale), relative to the calibration engine's 6.7 cfm/in³
  // (290 cfm on 43.3 in³), capped at +15 %. Scale our choice: stock truck heads (240 cfm) on a 5.3 L
  // then fill about 9 % less than the ported calibration heads.
  specificFlowRefCfmPerCi: 6.7,
  specificFlowScaleCfmPerCi: 10,
  specificFlowMaxFactor: 1.15,
  // Head-flow ceiling: a two-valve head supports about 0.26 hp per cfm per cylinder (common practice).
  hpPerCfmPerCylinder: 0.26,
  // Sharpness of the soft ceiling: hp / (1 + (hp / ceiling)^m)^(1/m) (our choice: invisible until close).
  ceilingSharpness: 8,
  // Curve range and the safe limit: mean piston speed 4,500 ft/min for a street hydraulic-roller
  // engine (common practice, from memory).
  curveStartRpm: 1500,
  curveEndRpm: 7000,
  curveStepRpm: 100,
  safePistonSpeedFtMin: 4500,
} as const;

export type ModelCoefficients = { -readonly [K in keyof typeof MODEL]: number };

// Induction and exhaust parts as multipliers on the cam's peak rpm, peak VE and low-rpm width.
// 1.00 is the reference the calibration engine used (truck intake, long tubes); the others are our
// choice from common practice on direction and size (from memory, no published source).
export const INTAKE_MANIFOLD_FACTORS = {
  truck: { rpm: 1.0, ve: 1.0, lowWidth: 1.0 }, // long runners: strong low end (calibration reference)
  car: { rpm: 1.04, ve: 1.01, lowWidth: 0.97 },
  'single-plane': { rpm: 1.12, ve: 1.03, lowWidth: 0.9 }, // short runners: top end, soft low end
} as const;

export const HEADER_FACTORS = {
  manifold: { rpm: 0.95, ve: 0.93, usesPrimary: false },
  shorty: { rpm: 0.98, ve: 0.975, usesPrimary: true },
  'long-tube': { rpm: 1.0, ve: 1.0, usesPrimary: true }, // calibration reference
} as const;

// Primary tube size: the peak moves with (primary / 1.75")^exp (our choice, common practice in direction).
export const PRIMARY_REFERENCE_IN = 1.75;
export const PRIMARY_RPM_EXPONENT = 0.25;

// Exhaust system: overlapMultiplier scales the overlap loss (short open collectors give no low-rpm
// scavenging, so overlap hurts more); lowEndLoss is a loss for every cam fading above lowEndFadeRpm.
// The open system is the calibration reference for peak VE; mufflers and cats cost a little on top.
export const EXHAUST_SYSTEM_FACTORS = {
  full: { rpm: 1.0, ve: 0.985, overlapMultiplier: 1.0, lowEndLoss: 0, lowEndFadeRpm: 3000 },
  'full-with-cats': { rpm: 0.99, ve: 0.965, overlapMultiplier: 1.0, lowEndLoss: 0, lowEndFadeRpm: 3000 },
  'open-short': { rpm: 1.0, ve: 1.0, overlapMultiplier: 1.6, lowEndLoss: 0.05, lowEndFadeRpm: 3000 },
} as const;
