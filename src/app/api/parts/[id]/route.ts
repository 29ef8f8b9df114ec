import { NextResponse } from 'next/server';
import { getPart, partFormValues, removePart, updatePart } from '@/lib/db/queries/parts';
import { notFound } from '@/lib/http/errors';
import { withoutCosts } from '@/lib/auth/costs';
import { outcomeResponse } from '@/lib/http/kit';
import { readPatch } from '@/lib/http/parse';
import { route } from '@/lib/http/route';
import { PartPatchControlSchema, PartSchema } from '@/lib/schemas/part';

export const GET = route({ permission: 'catalogue.read', ids: { id: 'part' } }, async ({ user, ids }) => {
  const part = await getPart(ids.id);
  if (!part) throw notFound('part', ids.id);
  return NextResponse.json(withoutCosts(part, user));
});

/** The body is read after the lookup: a missing part is 404 whatever the body says. */
export const PATCH = route({ permission: 'catalogue.write', ids: { id: 'part' } }, async ({ request, user, ids }) => {
  const current = await getPart(ids.id);
  if (!current) throw notFound('part', ids.id);
  const patch = await readPatch(request, PartPatchControlSchema, PartSchema, partFormValues(current));
  return outcomeResponse(await updatePart(ids.id, patch.control.version, patch.values, user), { label: 'part' });
});

/** Refused (409) while a rule uses the part; made inactive when quotes use it; otherwise deleted. */
export const DELETE = route({ permission: 'catalogue.write', ids: { id: 'part' } }, async ({ user, ids }) =>
  outcomeResponse(await removePart(ids.id, user), { label: 'part' }),
);
