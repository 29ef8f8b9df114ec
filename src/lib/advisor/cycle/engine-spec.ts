import type { BuildProfile } from '@/lib/schemas/build-profile';
import { pistonTravelFromTdcIn } from '../geometry';
import {
  AMBIENT_TEMPERATURE_K,
  CRANK_STEP_DEG,
  E85_EQUIVALENT_AKI,
  FITTED,
  FUELS,
  GAMMA_AIR,
  INTAKE_CHARGE_HEATING_K,
  M_PER_IN,
  type FittedConstants,
} from './constants';
import { speedOfSoundMPerS } from './gas-flow';
import { HEAD_PRESET_FIGURES, headFromPeak, type HeadSpec } from './head-flow';
import { researchOctaneFromAki } from './knock';
import { reflectionCoefficient, type Echo } from './wave-pipes';

// What the cycle needs to know about an engine, worked out once per build (cam-independent).
// Part dimensions below are our own generic figures (from memory of typical parts), documented in
// docs/advisor.md; they describe the parts, they are not fitted to any result.

/** Effective valve-to-plenum runner length by intake type, in (from memory: long truck runners to short single-plane). */
export const RUNNER_LENGTH_IN = { truck: 17, car: 14, 'single-plane': 8.5 } as const;
/** Header primary length by type, in (from memory), unless the build gives its own. */
export const PRIMARY_LENGTH_IN = { 'long-tube': 30, shorty: 14, manifold: 7 } as const;
/** A cast manifold's passages behave like a primary of about this bore, in (our choice). */
export const MANIFOLD_EQUIVALENT_BORE_IN = 1.5;
/** Header tube wall (18 gauge, 0.049") on each side: the bore is the tube size less 0.1" (common practice). */
export const PRIMARY_WALL_ALLOWANCE_IN = 0.1;
/** Collector area over one primary's area (a 3" collector on 1-3/4" primaries, from memory), and its length. */
export const COLLECTOR_AREA_RATIO = 2.9;
export const COLLECTOR_LENGTH_IN = 12;
/** Pipe from the collector to the first muffler in a full system, in (our choice, a typical car or truck). */
export const PIPE_TO_MUFFLER_IN = 100;
/** Reflection at a muffler's expansion (−) and at a catalytic converter's substrate face (+), our choice. */
export const MUFFLER_REFLECTION = -0.5;
export const CATALYST_REFLECTION = 0.25;
export const PIPE_TO_CATALYST_IN = 30;

/**
 * Mean back pressure of each exhaust system at a reference flow, kPa, rising with flow squared
 * (turbulent pipe and muffler losses). From memory: a street system with mufflers 1–2 psi and with
 * catalytic converters 2–4 psi at rated power; open collectors none.
 */
export const EXHAUST_BACK_PRESSURE_KPA = { full: 10, 'full-with-cats': 22, 'open-short': 0 } as const;
/** Air-filter and throttle pressure loss at the reference flow, kPa (from memory: about 0.7 inHg at full power). */
export const INTAKE_RESTRICTION_KPA = 2.5;
/** The reference flow for both, kg/s of air for the whole engine (≈ a 400 hp engine at full power). */
export const REFERENCE_ENGINE_AIRFLOW_KG_S = 0.33;

/** A runner's cross-section grows with the port it feeds: in² = peak cfm / 120 (our choice; 240 cfm → 2.0 in²). */
export const RUNNER_IN2_PER_CFM = 1 / 120;

export type EngineSpec = {
  cylinders: number;
  boreM: number;
  strokeM: number;
  sweptM3: number;
  clearanceM3: number;
  pistonAreaM2: number;
  head: HeadSpec;
  runner: { lengthM: number; areaM2: number };
  primary: { lengthM: number; areaM2: number };
  exhaustEchoes: (soundSpeed: number) => Echo[];
  intakeEchoes: Echo[];
  intakeSoundSpeedMPerS: number;
  intakeTemperatureK: number;
  backPressurePaAtRef: number;
  intakeRestrictionPaAtRef: number;
  fuel: { lhvMjPerKg: number; stoichAfr: number };
  researchOctane: number;
  crankStepDeg: number;
  // Per crank step over 720°, firing TDC at 0: volume, its change, and the heat-transfer area.
  volumeM3: Float64Array;
  dVolumeM3: Float64Array;
  wallAreaM2: Float64Array;
};

function headOf(build: BuildProfile): HeadSpec {
  const e = build.engine;
  if (e.intakeFlowSheet && e.intakeFlowSheet.length >= 2) {
    const fromPeak = headFromPeak(e.intakeFlowCfm, e.intakeValveIn, e.exhaustValveIn);
    return {
      ...fromPeak,
      intakeFlow: e.intakeFlowSheet,
      exhaustFlow: e.exhaustFlowSheet && e.exhaustFlowSheet.length >= 2 ? e.exhaustFlowSheet : fromPeak.exhaustFlow,
    };
  }
  if (e.headPreset) {
    // The interview's peak figure wins over the preset's; the preset gives the valve sizes. (The generic
    // 0.75 exhaust ratio is kept, as in the fit, rather than the preset's own.)
    const preset = HEAD_PRESET_FIGURES[e.headPreset];
    return headFromPeak(
      e.intakeFlowCfm,
      e.intakeValveIn ?? preset.intakeValveIn,
      e.exhaustValveIn ?? preset.exhaustValveIn,
    );
  }
  return headFromPeak(e.intakeFlowCfm, e.intakeValveIn, e.exhaustValveIn);
}

const area = (diameterIn: number) => (Math.PI / 4) * (diameterIn * M_PER_IN) ** 2;

export function engineSpec(
  build: BuildProfile,
  fitted: FittedConstants = FITTED,
  crankStepDeg: number = CRANK_STEP_DEG,
): EngineSpec {
  const e = build.engine;
  const x = build.exhaust;
  const boreM = e.boreIn * M_PER_IN;
  const strokeM = e.strokeIn * M_PER_IN;
  const pistonAreaM2 = (Math.PI / 4) * boreM * boreM;
  const sweptM3 = pistonAreaM2 * strokeM;
  const clearanceM3 = sweptM3 / (e.compressionRatio - 1);
  const head = headOf(build);
  const runnerAreaM2 = e.intakeFlowCfm * RUNNER_IN2_PER_CFM * M_PER_IN * M_PER_IN;
  const runnerLengthM = RUNNER_LENGTH_IN[e.intakeManifold] * M_PER_IN;
  const primaryBoreIn =
    x.headers === 'manifold' ? MANIFOLD_EQUIVALENT_BORE_IN : (x.primaryIn ?? 1.75) - PRIMARY_WALL_ALLOWANCE_IN;
  const primaryAreaM2 = area(primaryBoreIn);
  const primaryLengthM =
    (x.headers === 'manifold' ? PRIMARY_LENGTH_IN.manifold : (x.primaryLengthIn ?? PRIMARY_LENGTH_IN[x.headers])) *
    M_PER_IN;
  const intakeTemperatureK = AMBIENT_TEMPERATURE_K + INTAKE_CHARGE_HEATING_K;
  const intakeSoundSpeedMPerS = speedOfSoundMPerS(GAMMA_AIR, intakeTemperatureK);
  const a = fitted.waveAttenuation;

  // Four primaries meet in one collector: a wave leaving one primary sees the collector and the other three.
  const collectorAreaM2 = COLLECTOR_AREA_RATIO * primaryAreaM2;
  const rJunction = reflectionCoefficient(primaryAreaM2, collectorAreaM2 + 3 * primaryAreaM2);
  const tOut = 1 + rJunction;
  const tBack = 1 + reflectionCoefficient(collectorAreaM2, 4 * primaryAreaM2);
  const collectorM = COLLECTOR_LENGTH_IN * M_PER_IN;
  const exhaustEchoes = (c: number): Echo[] => {
    const echoes: Echo[] = [{ delayS: (2 * primaryLengthM) / c, gain: rJunction * a }];
    // Losses happen mostly where the area changes, so each echo loses the attenuation once.
    if (x.system === 'open-short')
      echoes.push({ delayS: (2 * (primaryLengthM + collectorM)) / c, gain: tOut * tBack * -1 * a });
    else {
      if (x.system === 'full-with-cats')
        echoes.push({
          delayS: (2 * (primaryLengthM + PIPE_TO_CATALYST_IN * M_PER_IN)) / c,
          gain: tOut * tBack * CATALYST_REFLECTION * a,
        });
      echoes.push({
        delayS: (2 * (primaryLengthM + PIPE_TO_MUFFLER_IN * M_PER_IN)) / c,
        gain: tOut * tBack * MUFFLER_REFLECTION * a,
      });
    }
    return echoes;
  };

  const slots = Math.round(720 / crankStepDeg);
  const volumeM3 = new Float64Array(slots);
  const dVolumeM3 = new Float64Array(slots);
  const wallAreaM2 = new Float64Array(slots);
  const clearanceHeightM = clearanceM3 / pistonAreaM2;
  for (let s = 0; s < slots; s++) {
    const travelM = pistonTravelFromTdcIn(e.strokeIn, e.rodLengthIn, (s * crankStepDeg) % 360) * M_PER_IN;
    volumeM3[s] = clearanceM3 + pistonAreaM2 * travelM;
    // Head and piston crown (10 % more than flat for the chamber's shape, our choice) plus the exposed liner.
    wallAreaM2[s] = 2.2 * pistonAreaM2 + Math.PI * boreM * (travelM + clearanceHeightM);
  }
  for (let s = 0; s < slots; s++) dVolumeM3[s] = volumeM3[(s + 1) % slots] - volumeM3[s];

  const fuel = build.use.fuel === 'e85' ? FUELS.e85 : FUELS.gasoline;
  const aki = build.use.fuel === 'e85' ? Math.max(E85_EQUIVALENT_AKI, build.use.fuelOctane) : build.use.fuelOctane;
  return {
    cylinders: e.cylinders,
    crankStepDeg,
    boreM,
    strokeM,
    sweptM3,
    clearanceM3,
    pistonAreaM2,
    head,
    runner: { lengthM: runnerLengthM, areaM2: runnerAreaM2 },
    primary: { lengthM: primaryLengthM, areaM2: primaryAreaM2 },
    exhaustEchoes,
    // The runner opens into the plenum: an open end (R = −1).
    intakeEchoes: [{ delayS: (2 * runnerLengthM) / intakeSoundSpeedMPerS, gain: -1 * a }],
    intakeSoundSpeedMPerS,
    intakeTemperatureK,
    backPressurePaAtRef: EXHAUST_BACK_PRESSURE_KPA[x.system] * 1000,
    intakeRestrictionPaAtRef: INTAKE_RESTRICTION_KPA * 1000,
    fuel,
    researchOctane: researchOctaneFromAki(aki),
    volumeM3,
    dVolumeM3,
    wallAreaM2,
  };
}
