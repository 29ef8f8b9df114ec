import type { BuildProfile } from '@/lib/schemas/build-profile';
import type { CamCard } from '@/lib/schemas/cam-card';
import { camSpec } from './cycle/cam-spec';
import { FITTED } from './cycle/constants';
import { modelCurve, type ModelCurve } from './cycle/engine-model';
import { engineSpec, type EngineSpec } from './cycle/engine-spec';
import { cylinderVolumeCi, displacementCi } from './geometry';
import { rpmGrid } from './rpm-grid';

// The engine-cycle model as the ranking uses it: everything cam-independent worked out once per build.

/** A two-valve head supports about 0.26 hp per cfm (28 inH2O) per cylinder (common practice, 0.25–0.27): reported, not used by the model. */
export const HP_PER_CFM_PER_CYLINDER = 0.26;

export type EngineContext = {
  build: BuildProfile;
  spec: EngineSpec;
  rpms: Float64Array;
  displacementCi: number;
  cylinderCi: number;
  ceilingHp: number;
};

export function engineContext(build: BuildProfile): EngineContext {
  const e = build.engine;
  return {
    build,
    spec: engineSpec(build, FITTED),
    rpms: rpmGrid(build),
    displacementCi: displacementCi(e.boreIn, e.strokeIn, e.cylinders),
    cylinderCi: cylinderVolumeCi(e.boreIn, e.strokeIn),
    ceilingHp: e.intakeFlowCfm * e.cylinders * HP_PER_CFM_PER_CYLINDER,
  };
}

/** The cycle model's curve for one cam, with its simulated points (VE, IMEP, BMEP, pumping, spark). */
export function camModel(ctx: EngineContext, cam: CamCard): ModelCurve {
  return modelCurve(ctx.spec, camSpec(cam, ctx.spec.head), ctx.rpms, FITTED);
}

/** Predicted torque (lb·ft, unrounded) over the context's rpm grid. */
export function torqueCurve(ctx: EngineContext, cam: CamCard): Float64Array {
  return camModel(ctx, cam).torqueLbFt;
}
