import { z } from 'zod';
import { BuildProfileSchema } from './build-profile';

export const ADVISOR_REQUEST_LIMITS = { camIdsMax: 2000 } as const;

// POST /api/advisor/rank: one build, and optionally the catalogue cams to consider (default: all active).
export const RankRequestSchema = z.strictObject({
  build: BuildProfileSchema,
  camIds: z
    .array(z.number().int().positive({ error: 'each cam id must be a positive whole number' }), {
      error: 'camIds must be a list of cam ids',
    })
    .min(1, { error: 'camIds, when given, must name at least one cam' })
    .max(ADVISOR_REQUEST_LIMITS.camIdsMax, {
      error: `camIds may name at most ${ADVISOR_REQUEST_LIMITS.camIdsMax} cams`,
    })
    .optional(),
  includeCurves: z.boolean({ error: 'includeCurves must be true or false' }).optional(),
  // How many of the best-ranked cams carry their predicted curve (default 20; the rest come without one).
  curveLimit: z
    .number({ error: 'curveLimit must be a whole number' })
    .int({ error: 'curveLimit must be a whole number' })
    .min(0, { error: 'curveLimit must be at least 0' })
    .max(ADVISOR_REQUEST_LIMITS.camIdsMax, { error: `curveLimit may be at most ${ADVISOR_REQUEST_LIMITS.camIdsMax}` })
    .optional(),
  // Leave this build's own measured results out of the shop history (the job page compares the
  // prediction with that build's pulls, so the prediction must not have learnt from them).
  excludeBuildId: z
    .number({ error: 'excludeBuildId must be a build id' })
    .int({ error: 'excludeBuildId must be a build id' })
    .positive({ error: 'excludeBuildId must be a build id' })
    .optional(),
});

export type RankRequest = z.output<typeof RankRequestSchema>;

// POST /api/advisor/model: the cycle model's intermediate values for one catalogue cam (or the build's own cam).
export const ModelDetailRequestSchema = z.strictObject({
  build: BuildProfileSchema,
  camId: z.union([z.number().int().positive(), z.literal('baseline')], {
    error: 'camId must be a catalogue cam id or "baseline"',
  }),
});
