import { NextResponse } from 'next/server';
import { getLabor, laborFormValues, removeLabor, updateLabor } from '@/lib/db/queries/labor';
import { notFound } from '@/lib/http/errors';
import { outcomeResponse } from '@/lib/http/kit';
import { readPatch } from '@/lib/http/parse';
import { route } from '@/lib/http/route';
import { LaborPatchControlSchema, LaborSchema } from '@/lib/schemas/labor';

const LABEL = 'labour operation';

export const GET = route({ permission: 'catalogue.read', ids: { id: LABEL } }, async ({ ids }) => {
  const op = await getLabor(ids.id);
  if (!op) throw notFound(LABEL, ids.id);
  return NextResponse.json(op);
});

/** The body is read after the lookup: a missing operation is 404 whatever the body says. */
export const PATCH = route({ permission: 'catalogue.write', ids: { id: LABEL } }, async ({ request, user, ids }) => {
  const current = await getLabor(ids.id);
  if (!current) throw notFound(LABEL, ids.id);
  const patch = await readPatch(request, LaborPatchControlSchema, LaborSchema, laborFormValues(current));
  return outcomeResponse(await updateLabor(ids.id, patch.control.version, patch.values, user), { label: LABEL });
});

export const DELETE = route({ permission: 'catalogue.write', ids: { id: LABEL } }, async ({ user, ids }) =>
  outcomeResponse(await removeLabor(ids.id, user), { label: LABEL }),
);
