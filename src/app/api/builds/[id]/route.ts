import { NextResponse } from 'next/server';
import { buildFormValues, getBuild, updateBuild } from '@/lib/db/queries/builds';
import { notFound } from '@/lib/http/errors';
import { outcomeResponse } from '@/lib/http/kit';
import { readPatch } from '@/lib/http/parse';
import { route } from '@/lib/http/route';
import { BuildPatchControlSchema, BuildUpdateSchema } from '@/lib/schemas/build';

/** One build with its full profile. */
export const GET = route({ permission: 'builds.read', ids: { id: 'build' } }, async ({ ids }) => {
  const build = await getBuild(ids.id);
  if (!build) throw notFound('build', ids.id);
  return NextResponse.json(build);
});

/**
 * Changes a build: `version` (the one the form loaded) plus any of customerId, vehicleLabel,
 * baselineCamId, profile (replaced whole). A stale version answers 409 with the current build; a
 * missing build is 404 whatever the body says (the body is read after the lookup).
 */
export const PATCH = route({ permission: 'builds.write', ids: { id: 'build' } }, async ({ request, user, ids }) => {
  const current = await getBuild(ids.id);
  if (!current) throw notFound('build', ids.id);
  const patch = await readPatch(request, BuildPatchControlSchema, BuildUpdateSchema, buildFormValues(current));
  return outcomeResponse(await updateBuild(ids.id, patch.control.version, patch.values, user), { label: 'build' });
});
