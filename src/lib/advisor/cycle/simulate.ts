import {
  AMBIENT_PRESSURE_PA,
  AMBIENT_TEMPERATURE_K,
  type FittedConstants,
  GAMMA_AIR,
  GAMMA_BURNED,
  GAMMA_UNBURNED,
  GAS_CONSTANT_J_PER_KG_K as R,
  WALL_TEMPERATURE_K,
} from './constants';
import { chargeHeatJ, startOfBurnDegAtdc, wiebeFractionBurned } from './combustion';
import type { CamSpec } from './cam-spec';
import type { EngineSpec } from './engine-spec';
import { REFERENCE_ENGINE_AIRFLOW_KG_S } from './engine-spec';
import { frictionMeanEffectivePressurePa } from './friction';
import { orificeMassFlowKgPerS, speedOfSoundMPerS } from './gas-flow';
import { WOSCHNI, woschniCoefficientWPerM2K, woschniGasSpeedMPerS } from './heat-transfer';
import { endGasTemperatureK, ignitionDelayMs, KNOCK_MAX_RETARD_DEG, KNOCK_RETARD_STEP_DEG } from './knock';
import { backwardWavePa, launchWave, makeWavePipe, type WavePipe } from './wave-pipes';

// Heywood ch. 14, filling and emptying: one cylinder (the others identical) integrated crank step by
// crank step through a whole cycle, as a single zone of ideal gas exchanging mass through the valves
// with the intake runner and the exhaust primary, whose port pressures carry the pipe waves.
// Energy per step (first law for an open system): d(m·cv·T) = δQ_burn − δQ_wall − p·dV + Σ h_in·dm_in − h·dm_out.

export type Fitted = FittedConstants;

export type CyclePoint = {
  rpm: number;
  trappedAirKg: number;
  volumetricEfficiency: number; // trapped air / (ambient density · swept volume), Heywood ch. 6
  residualFraction: number;
  imepPa: number; // net, the whole 720°
  pmepPa: number; // pumping loss (positive = work spent on the gas exchange)
  fmepPa: number;
  bmepPa: number;
  torqueNm: number; // whole engine
  sparkRetardDeg: number; // from MBT, for knock
  exhaustTempK: number;
};

/** What one rpm hands the next as its starting guess (the answer barely changes between grid points). */
export type WarmStart = {
  massKg: number;
  airKg: number;
  tempK: number;
  airflowKgPerS: number;
  exhaustTempK: number;
  retardDeg: number;
  intakeForward: Float64Array;
  exhaustForward: Float64Array;
  meanOutIntakeKgPerS: number;
  meanOutExhaustKgPerS: number;
};

type Gas = { m: number; air: number; t: number };
type Buffer = { m: number; air: number; t: number; capKg: number };

const AIR_CP = (GAMMA_AIR * R) / (GAMMA_AIR - 1);
const AMBIENT_DENSITY = AMBIENT_PRESSURE_PA / (R * AMBIENT_TEMPERATURE_K);

function gammaOf(g: Gas): number {
  const airShare = g.m > 0 ? g.air / g.m : 1;
  return GAMMA_UNBURNED * airShare + GAMMA_BURNED * (1 - airShare);
}

/** Mass flow out of the cylinder through one valve into a port whose pressure rises with that flow (the pipe's impedance). */
function valveFlowOut(
  areaM2: number,
  pCyl: number,
  tCyl: number,
  gCyl: number,
  portBasePa: number,
  impedance: number,
  tPort: number,
  guess: number,
): number {
  // Solve ṁ = f(p_port(ṁ)) by the secant method from the last step's flow; f falls as ṁ grows, so the root is unique.
  let m0 = guess;
  let g0 = portFlow(areaM2, pCyl, tCyl, gCyl, portBasePa, impedance, tPort, m0) - m0;
  let m1 = m0 + 0.5 * g0;
  for (let k = 0; k < 3; k++) {
    const g1 = portFlow(areaM2, pCyl, tCyl, gCyl, portBasePa, impedance, tPort, m1) - m1;
    if (g1 === g0 || Math.abs(g1) < 1e-7) return m1;
    const m2 = m1 - (g1 * (m1 - m0)) / (g1 - g0);
    m0 = m1;
    g0 = g1;
    m1 = m2;
  }
  return m1;
}

// The valve's flow for an assumed flow ṁ, whose own wave sets the port pressure (a plain function, not a
// closure: this runs millions of times per ranking and closures would be garbage).
function portFlow(
  areaM2: number,
  pCyl: number,
  tCyl: number,
  gCyl: number,
  portBasePa: number,
  impedance: number,
  tPort: number,
  mdot: number,
): number {
  const pPort = Math.max(1000, portBasePa + impedance * mdot);
  return pCyl >= pPort
    ? orificeMassFlowKgPerS(areaM2, pCyl, tCyl, pPort, gCyl)
    : -orificeMassFlowKgPerS(areaM2, pPort, tPort, pCyl, GAMMA_AIR);
}

function intoBuffer(b: Buffer, dm: number, air: number, t: number): void {
  const m = b.m + dm;
  b.t = (b.m * b.t + dm * t) / m;
  b.air = (b.air * b.m + air) / m;
  b.m = Math.min(m, b.capKg);
}

type Drawn = { air: number; heat: number };

/** Takes dm from the gas next to the valve: first what the valve pushed out before, then the far side's gas (into `out`, reused: no garbage per step). */
function fromBuffer(b: Buffer, dm: number, farAirShare: number, farT: number, out: Drawn): Drawn {
  const near = Math.min(dm, b.m);
  const far = dm - near;
  b.m -= near;
  out.air = near * b.air + far * farAirShare;
  out.heat = AIR_CP * (near * b.t + far * farT);
  return out;
}

export function simulateRpm(
  engine: EngineSpec,
  cam: CamSpec,
  rpm: number,
  fitted: Fitted,
  warm?: WarmStart,
): { point: CyclePoint; warm: WarmStart } {
  const slots = engine.volumeM3.length;
  const stepDeg = engine.crankStepDeg;
  const dt = stepDeg / (6 * rpm);
  const dtMs = dt * 1000;
  const meanPistonSpeed = (2 * engine.strokeM * rpm) / 60;
  const vol = engine.volumeM3;
  const dVol = engine.dVolumeM3;
  const wall = engine.wallAreaM2;
  const start = Math.round(cam.intakeClosedDeg / stepDeg);
  const tIn = engine.intakeTemperatureK;

  let exhaustTempK = warm?.exhaustTempK ?? 900;
  let airflow = warm?.airflowKgPerS ?? (0.9 * AMBIENT_DENSITY * engine.sweptM3 * engine.cylinders * rpm) / 120;
  let retard = Math.max(0, (warm?.retardDeg ?? 0) - 2 * KNOCK_RETARD_STEP_DEG);
  const intakePipe: WavePipe = makeWavePipe(
    engine.intakeEchoes,
    engine.intakeSoundSpeedMPerS,
    engine.runner.areaM2,
    slots,
  );
  if (warm) intakePipe.forward.set(warm.intakeForward);
  const gas: Gas = warm
    ? { m: warm.massKg, air: warm.airKg, t: warm.tempK }
    : { m: (0.9 * AMBIENT_PRESSURE_PA * vol[start]) / (R * tIn), air: 0, t: 340 };
  if (!warm) gas.air = 0.93 * gas.m;
  const intakeBuf: Buffer = {
    m: 0,
    air: 0,
    t: tIn,
    capKg: AMBIENT_DENSITY * engine.runner.areaM2 * engine.runner.lengthM,
  };
  const exhaustBuf: Buffer = { m: 0, air: 0, t: exhaustTempK, capKg: 0 };
  const burnDeg = fitted.burnDurationDeg;
  const exhaustPipe: WavePipe = makeWavePipe([], 1, engine.primary.areaM2, slots);
  if (warm) exhaustPipe.forward.set(warm.exhaustForward);

  // The pipes carry waves around the mean flow (linear acoustics about the mean); the mean itself is the
  // plenum's and the exhaust system's steady pressure, so the source is the flow's departure from its cycle mean.
  let meanOutIn = warm?.meanOutIntakeKgPerS ?? -airflow / engine.cylinders;
  let meanOutEx = warm?.meanOutExhaustKgPerS ?? (1.07 * airflow) / engine.cylinders;
  let point: CyclePoint | null = null;
  const scratch: Drawn = { air: 0, heat: 0 };
  const cycles = warm ? 2 : 3;
  for (let cycle = 0; cycle < cycles; cycle++) {
    const cEx = speedOfSoundMPerS(GAMMA_BURNED, 0.85 * exhaustTempK);
    exhaustPipe.echoes = engine.exhaustEchoes(cEx);
    exhaustPipe.impedanceSPerM2 = cEx / engine.primary.areaM2;
    exhaustBuf.capKg = (AMBIENT_PRESSURE_PA / (R * exhaustTempK)) * engine.primary.areaM2 * engine.primary.lengthM;
    const flowRatio = airflow / REFERENCE_ENGINE_AIRFLOW_KG_S;
    const plenumPa = AMBIENT_PRESSURE_PA - engine.intakeRestrictionPaAtRef * flowRatio * flowRatio;
    const backPa = AMBIENT_PRESSURE_PA + engine.backPressurePaAtRef * (1.07 * flowRatio) * (1.07 * flowRatio);

    // --- closed part: compression, burn and expansion, with the spark retarded until the end gas survives ---
    const startGas = { ...gas };
    const trappedAir = startGas.air;
    const q = chargeHeatJ(trappedAir, engine.fuel.lhvMjPerKg, engine.fuel.stoichAfr, fitted.combustionEfficiency);
    const exhaustOpens = firstOpenSlot(cam.exhaustAreaM2, start, slots);
    let closedWork = 0;
    let knocked = true;
    while (knocked) {
      gas.m = startGas.m;
      gas.air = startGas.air;
      gas.t = startGas.t;
      closedWork = 0;
      const sob = 720 + startOfBurnDegAtdc(burnDeg, retard);
      const pRef = (gas.m * R * gas.t) / vol[start];
      const tRef = gas.t;
      const vRef = vol[start];
      let knockIntegral = 0;
      let burned = 0;
      for (let k = 0; ; k++) {
        const s = (start + k) % slots;
        if (k > 0 && s === exhaustOpens) break;
        const deg = (start + k) * stepDeg;
        const v = vol[s];
        const p = (gas.m * R * gas.t) / v;
        const nextBurned = wiebeFractionBurned(deg + stepDeg - sob, burnDeg);
        const dQ = q * (nextBurned - burned);
        const gU = GAMMA_UNBURNED;
        const pMotored = pRef * Math.pow(vRef / v, gU);
        const w = woschniGasSpeedMPerS(
          WOSCHNI.c1Closed,
          meanPistonSpeed,
          burned > 0 ? WOSCHNI.c2Combustion : 0,
          engine.sweptM3,
          tRef,
          pRef,
          vRef,
          p,
          pMotored,
        );
        const h = woschniCoefficientWPerM2K(engine.boreM, p, gas.t, w);
        const qWall = h * wall[s] * (gas.t - WALL_TEMPERATURE_K) * dt;
        const g = gammaOf(gas);
        const cv = R / (g - 1);
        const dV = dVol[s];
        gas.t += (dQ - qWall - p * dV) / (gas.m * cv);
        closedWork += p * dV;
        // The end gas: unburned charge compressed isentropically from intake closing (Heywood ch. 9).
        if (burned < 0.9) {
          knockIntegral += dtMs / ignitionDelayMs(engine.researchOctane, p, endGasTemperatureK(tRef, pRef, p, gU));
        }
        gas.air = trappedAir * (1 - nextBurned);
        burned = nextBurned;
      }
      knocked = knockIntegral >= 1 && retard < KNOCK_MAX_RETARD_DEG;
      if (knocked) retard += KNOCK_RETARD_STEP_DEG;
    }
    // Both valves shut: each pipe's wave reflects off the closed valve (R = +1) and keeps travelling.
    for (let s = start; s !== exhaustOpens; s = (s + 1) % slots) {
      launchWave(intakePipe, s, -meanOutIn, backwardWavePa(intakePipe, s, dt));
      launchWave(exhaustPipe, s, -meanOutEx, backwardWavePa(exhaustPipe, s, dt));
    }

    // --- gas exchange: from exhaust opening to intake closing, through both valves and their pipes ---
    let work = closedWork;
    let pumpWork = 0;
    let outEnergy = 0;
    let outMass = 0;
    let inducted = 0;
    let mdotIn = 0;
    let mdotEx = 0;
    let sumOutIn = 0;
    let sumOutEx = 0;
    const end = start + slots;
    for (let abs = start + ((exhaustOpens - start + slots) % slots); abs < end; abs++) {
      const s = abs % slots;
      const v = vol[s];
      const p = (gas.m * R * gas.t) / v;
      const g = gammaOf(gas);
      const cv = R / (g - 1);
      const cp = g * cv;
      const bIn = backwardWavePa(intakePipe, s, dt);
      const bEx = backwardWavePa(exhaustPipe, s, dt);
      const aIn = cam.intakeAreaM2[s];
      const aEx = cam.exhaustAreaM2[s];
      const zIn = intakePipe.impedanceSPerM2;
      const zEx = exhaustPipe.impedanceSPerM2;
      mdotIn =
        aIn > 0
          ? valveFlowOut(
              aIn,
              p,
              gas.t,
              g,
              plenumPa + 2 * bIn - zIn * meanOutIn,
              zIn,
              intakeBuf.m > 0 ? intakeBuf.t : tIn,
              mdotIn,
            )
          : 0;
      mdotEx =
        aEx > 0
          ? valveFlowOut(
              aEx,
              p,
              gas.t,
              g,
              backPa + 2 * bEx - zEx * meanOutEx,
              zEx,
              exhaustBuf.m > 0 ? exhaustBuf.t : exhaustTempK,
              mdotEx,
            )
          : 0;
      launchWave(intakePipe, s, mdotIn - meanOutIn, bIn);
      launchWave(exhaustPipe, s, mdotEx - meanOutEx, bEx);
      sumOutIn += mdotIn;
      sumOutEx += mdotEx;

      // Keep each step from overshooting pressure equality (explicit integration stays stable).
      const capKg = (0.5 * p * v) / (R * gas.t);
      let dmIn = -mdotIn * dt;
      let dmEx = -mdotEx * dt;
      dmIn = Math.max(-capKg, Math.min(capKg, dmIn));
      dmEx = Math.max(-capKg, Math.min(capKg, dmEx));
      // Both valves together may not empty more than that half either (coarse steps could empty the cylinder).
      const outKg = Math.max(0, -dmIn) + Math.max(0, -dmEx);
      if (outKg > capKg) {
        const keep = capKg / outKg;
        if (dmIn < 0) dmIn *= keep;
        if (dmEx < 0) dmEx *= keep;
      }

      let mass = gas.m;
      let air = gas.air;
      let energy = gas.m * cv * gas.t - p * dVol[s];
      const airShare = gas.air / gas.m;
      // Intake valve: in from the runner (first what flowed back into it), or back out into it.
      if (dmIn > 0) {
        const drawn = fromBuffer(intakeBuf, dmIn, 1, tIn, scratch);
        mass += dmIn;
        air += drawn.air;
        energy += drawn.heat;
        inducted += drawn.air;
      } else if (dmIn < 0) {
        intoBuffer(intakeBuf, -dmIn, -dmIn * airShare, gas.t);
        mass += dmIn;
        air += dmIn * airShare;
        energy += cp * gas.t * dmIn;
        inducted += dmIn * airShare;
      }
      // Exhaust valve: out into the primary, or back in from it (reversion).
      if (dmEx > 0) {
        const drawn = fromBuffer(exhaustBuf, dmEx, exhaustBuf.air, exhaustTempK, scratch);
        mass += dmEx;
        air += drawn.air;
        energy += drawn.heat;
      } else if (dmEx < 0) {
        intoBuffer(exhaustBuf, -dmEx, -dmEx * airShare, gas.t);
        mass += dmEx;
        air += dmEx * airShare;
        energy += cp * gas.t * dmEx;
        outEnergy -= dmEx * gas.t;
        outMass -= dmEx;
      }
      const w = WOSCHNI.c1GasExchange * meanPistonSpeed;
      const h = woschniCoefficientWPerM2K(engine.boreM, p, gas.t, w);
      energy -= h * wall[s] * (gas.t - WALL_TEMPERATURE_K) * dt;
      work += p * dVol[s];
      const crankInCycle = s * stepDeg;
      if (crankInCycle >= 180 && crankInCycle < 540) pumpWork += p * dVol[s];
      gas.m = mass;
      gas.air = Math.max(0, Math.min(air, mass));
      gas.t = Math.max(250, energy / (mass * cv));
    }

    meanOutIn = sumOutIn / slots;
    meanOutEx = sumOutEx / slots;
    if (outMass > 0) exhaustTempK = Math.min(1500, Math.max(500, outEnergy / outMass));
    airflow = (Math.max(0, inducted) * engine.cylinders * rpm) / 120;
    const imep = work / engine.sweptM3;
    const fmep = frictionMeanEffectivePressurePa(rpm, fitted.frictionScale);
    const bmep = imep - fmep;
    point = {
      rpm,
      trappedAirKg: trappedAir,
      volumetricEfficiency: trappedAir / (AMBIENT_DENSITY * engine.sweptM3),
      residualFraction: 1 - trappedAir / startGas.m,
      imepPa: imep,
      pmepPa: -pumpWork / engine.sweptM3,
      fmepPa: fmep,
      bmepPa: bmep,
      torqueNm: (bmep * engine.sweptM3 * engine.cylinders) / (4 * Math.PI),
      sparkRetardDeg: retard,
      exhaustTempK,
    };
    if (cycle === cycles - 1) {
      return {
        point,
        warm: {
          massKg: gas.m,
          airKg: gas.air,
          tempK: gas.t,
          airflowKgPerS: airflow,
          exhaustTempK,
          retardDeg: retard,
          intakeForward: intakePipe.forward.slice(),
          exhaustForward: exhaustPipe.forward.slice(),
          meanOutIntakeKgPerS: meanOutIn,
          meanOutExhaustKgPerS: meanOutEx,
        },
      };
    }
  }
  throw new Error('unreachable');
}

function firstOpenSlot(area: Float64Array, from: number, slots: number): number {
  for (let k = 1; k < slots; k++) {
    const s = (from + k) % slots;
    if (area[s] > 0) return s;
  }
  return from;
}
