import type { BuildProfile } from '@/lib/schemas/build-profile';
import type { CamCard } from '@/lib/schemas/cam-card';
import { camLobes } from './cycle/cam-spec';
import { FITTED, NM_PER_LBFT, PA_PER_PSI } from './cycle/constants';
import { flowAtLiftCfm } from './cycle/head-flow';
import { valveLiftIn } from './cycle/valve-lift';
import { roundTo } from './format';
import { camModel, engineContext } from './prediction';

// "How these numbers were reached": the cycle model's own intermediate values for one cam in one
// engine, as an engine builder reads them — valve lift against crank angle, the head's flow against
// lift, and per simulated rpm the charge trapped (volumetric efficiency), the mean effective pressures
// (IMEP − pumping − friction = BMEP, Heywood ch. 2) and the torque they give.

export type SimulatedPoint = {
  rpm: number;
  volumetricEfficiencyPct: number;
  residualGasPct: number;
  imepPsi: number;
  pumpingPsi: number;
  frictionPsi: number;
  bmepPsi: number;
  torqueLbFt: number;
  sparkRetardDeg: number;
};

export type ModelDetail = {
  camId: CamCard['id'];
  camName: string;
  simulated: SimulatedPoint[];
  /** Valve lift (in) every 4° of crank over the 720° cycle, firing TDC at 0°, overlap TDC at 360°. */
  lift: { crankDeg: number; intakeIn: number; exhaustIn: number }[];
  /** The head's bench flow (cfm at 28 inH2O) against valve lift, up to this cam's highest lift. */
  headFlow: { liftIn: number; intakeCfm: number; exhaustCfm: number }[];
  fittedConstants: typeof FITTED;
};

const LIFT_STEP_DEG = 4;
const FLOW_STEP_IN = 0.05;

export function modelDetail(build: BuildProfile, cam: CamCard): ModelDetail {
  const ctx = engineContext(build);
  const { intake, exhaust } = camLobes(cam);
  const simulated = camModel(ctx, cam).points.map((p) => ({
    rpm: p.rpm,
    volumetricEfficiencyPct: roundTo(100 * p.volumetricEfficiency, 1),
    residualGasPct: roundTo(100 * p.residualFraction, 1),
    imepPsi: roundTo(p.imepPa / PA_PER_PSI, 1),
    pumpingPsi: roundTo(p.pmepPa / PA_PER_PSI, 1),
    frictionPsi: roundTo(p.fmepPa / PA_PER_PSI, 1),
    bmepPsi: roundTo(p.bmepPa / PA_PER_PSI, 1),
    torqueLbFt: roundTo(p.torqueNm / NM_PER_LBFT, 1),
    sparkRetardDeg: p.sparkRetardDeg,
  }));
  const lift = Array.from({ length: 720 / LIFT_STEP_DEG }, (_, i) => {
    const deg = i * LIFT_STEP_DEG;
    return {
      crankDeg: deg,
      intakeIn: roundTo(valveLiftIn(intake, deg), 3),
      exhaustIn: roundTo(valveLiftIn(exhaust, deg), 3),
    };
  });
  const maxLift = Math.max(intake.valveLiftIn, exhaust.valveLiftIn);
  const head = ctx.spec.head;
  const headFlow = Array.from({ length: Math.ceil(maxLift / FLOW_STEP_IN) }, (_, i) => {
    const liftIn = roundTo(Math.min(maxLift, (i + 1) * FLOW_STEP_IN), 3);
    return {
      liftIn,
      intakeCfm: Math.round(flowAtLiftCfm(head.intakeFlow, liftIn)),
      exhaustCfm: Math.round(flowAtLiftCfm(head.exhaustFlow, liftIn)),
    };
  });
  return { camId: cam.id, camName: cam.name, simulated, lift, headFlow, fittedConstants: FITTED };
}
