import { NextResponse } from 'next/server';
import { requireRole } from '@/lib/auth/guard';
import { idFrom, outcomeResponse, parsePatch, type IdParams } from '@/lib/http/kit';
import { buildFormValues, getBuild, updateBuild } from '@/lib/db/queries/builds';
import { errorResponse } from '@/lib/http/responses';
import { BuildPatchControlSchema, BuildUpdateSchema } from '@/lib/schemas/build';

export const dynamic = 'force-dynamic';

/** One build with its full profile: any staff member. */
export async function GET(request: Request, context: IdParams) {
  const user = await requireRole(request, 'manager', 'counter', 'tech');
  if (user instanceof Response) return user;
  const id = await idFrom(context, 'build');
  if (id instanceof Response) return id;
  const build = await getBuild(id);
  if (!build) return errorResponse(404, `No build with id ${id}.`);
  return NextResponse.json(build);
}

/**
 * Changes a build: `version` (the one the form loaded) plus any of customerId, vehicleLabel,
 * baselineCamId, profile (replaced whole). A stale version answers 409 with the current build.
 */
export async function PATCH(request: Request, context: IdParams) {
  const user = await requireRole(request, 'manager', 'counter');
  if (user instanceof Response) return user;
  const id = await idFrom(context, 'build');
  if (id instanceof Response) return id;
  const current = await getBuild(id);
  if (!current) return errorResponse(404, `No build with id ${id}.`);
  const patch = await parsePatch(request, BuildPatchControlSchema, BuildUpdateSchema, buildFormValues(current));
  if (!patch.ok) return patch.response;
  return outcomeResponse(await updateBuild(id, patch.control.version, patch.values, user), { label: 'build' });
}
