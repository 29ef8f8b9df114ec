import { NextResponse } from 'next/server';
import { requireRole } from '@/lib/auth/guard';
import { idFrom, outcomeResponse, parsePatch, withoutCosts, type IdParams } from '@/lib/catalogue/http';
import { camFormValues, getCam, removeCam, updateCam } from '@/lib/db/queries/cams';
import { errorResponse } from '@/lib/http/responses';
import { CamPatchControlSchema, CatalogueCamSchema } from '@/lib/schemas/catalogue-cam';

export const dynamic = 'force-dynamic';

export async function GET(request: Request, context: IdParams) {
  const user = await requireRole(request);
  if (user instanceof Response) return user;
  const id = await idFrom(context, 'cam');
  if (id instanceof Response) return id;
  const cam = await getCam(id);
  if (!cam) return errorResponse(404, `No cam with id ${id}.`);
  return NextResponse.json(withoutCosts(cam, user));
}

/** Changes a cam. The body carries the `version` the form loaded; a stale one answers 409 with the current cam. */
export async function PATCH(request: Request, context: IdParams) {
  const user = await requireRole(request, 'manager');
  if (user instanceof Response) return user;
  const id = await idFrom(context, 'cam');
  if (id instanceof Response) return id;
  const current = await getCam(id);
  if (!current) return errorResponse(404, `No cam with id ${id}.`);
  const patch = await parsePatch(request, CamPatchControlSchema, CatalogueCamSchema, camFormValues(current));
  if (!patch.ok) return patch.response;
  const outcome = await updateCam(id, patch.control.version, patch.values, patch.control.archived, user);
  return outcomeResponse(outcome, { label: 'cam' });
}

/** Archives a cam that quotes (or builds, interviews, dyno runs) refer to; deletes one nothing refers to. */
export async function DELETE(request: Request, context: IdParams) {
  const user = await requireRole(request, 'manager');
  if (user instanceof Response) return user;
  const id = await idFrom(context, 'cam');
  if (id instanceof Response) return id;
  return outcomeResponse(await removeCam(id, user), { label: 'cam' });
}
