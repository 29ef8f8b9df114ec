import { NextResponse } from 'next/server';
import { notFound } from '@/lib/http/errors';
import { withoutCosts } from '@/lib/auth/costs';
import { outcomeResponse } from '@/lib/http/kit';
import { readPatch } from '@/lib/http/parse';
import { route } from '@/lib/http/route';
import { camFormValues, getCam, removeCam, updateCam } from '@/lib/db/queries/cams';
import { CamPatchControlSchema, CatalogueCamSchema } from '@/lib/schemas/catalogue-cam';

export const GET = route({ permission: 'catalogue.read', ids: { id: 'cam' } }, async ({ user, ids }) => {
  const cam = await getCam(ids.id);
  if (!cam) throw notFound('cam', ids.id);
  return NextResponse.json(withoutCosts(cam, user));
});

/** Changes a cam. The body carries the `version` the form loaded; a stale one answers 409 with the current cam. */
export const PATCH = route({ permission: 'catalogue.write', ids: { id: 'cam' } }, async ({ request, user, ids }) => {
  const current = await getCam(ids.id);
  if (!current) throw notFound('cam', ids.id);
  const patch = await readPatch(request, CamPatchControlSchema, CatalogueCamSchema, camFormValues(current));
  return outcomeResponse(await updateCam(ids.id, patch.control.version, patch.values, patch.control.archived, user), {
    label: 'cam',
  });
});

/** Archives a cam that quotes (or builds, interviews, dyno runs) refer to; deletes one nothing refers to. */
export const DELETE = route({ permission: 'catalogue.write', ids: { id: 'cam' } }, async ({ user, ids }) =>
  outcomeResponse(await removeCam(ids.id, user), { label: 'cam' }),
);
