import { NextResponse } from 'next/server';
import { requireRole } from '@/lib/auth/guard';
import { idFrom, outcomeResponse, parsePatch, withoutCosts, type IdParams } from '@/lib/http/kit';
import { getPart, partFormValues, removePart, updatePart } from '@/lib/db/queries/parts';
import { errorResponse } from '@/lib/http/responses';
import { PartPatchControlSchema, PartSchema } from '@/lib/schemas/part';

export const dynamic = 'force-dynamic';

export async function GET(request: Request, context: IdParams) {
  const user = await requireRole(request);
  if (user instanceof Response) return user;
  const id = await idFrom(context, 'part');
  if (id instanceof Response) return id;
  const part = await getPart(id);
  if (!part) return errorResponse(404, `No part with id ${id}.`);
  return NextResponse.json(withoutCosts(part, user));
}

export async function PATCH(request: Request, context: IdParams) {
  const user = await requireRole(request, 'manager');
  if (user instanceof Response) return user;
  const id = await idFrom(context, 'part');
  if (id instanceof Response) return id;
  const current = await getPart(id);
  if (!current) return errorResponse(404, `No part with id ${id}.`);
  const patch = await parsePatch(request, PartPatchControlSchema, PartSchema, partFormValues(current));
  if (!patch.ok) return patch.response;
  return outcomeResponse(await updatePart(id, patch.control.version, patch.values, user), { label: 'part' });
}

/** Refused (409) while a rule uses the part; made inactive when quotes use it; otherwise deleted. */
export async function DELETE(request: Request, context: IdParams) {
  const user = await requireRole(request, 'manager');
  if (user instanceof Response) return user;
  const id = await idFrom(context, 'part');
  if (id instanceof Response) return id;
  return outcomeResponse(await removePart(id, user), { label: 'part' });
}
