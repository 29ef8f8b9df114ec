import { NextResponse } from 'next/server';
import { requireRole } from '@/lib/auth/guard';
import { idFrom, outcomeResponse, parsePatch, type IdParams } from '@/lib/http/kit';
import { getLabor, laborFormValues, removeLabor, updateLabor } from '@/lib/db/queries/labor';
import { errorResponse } from '@/lib/http/responses';
import { LaborPatchControlSchema, LaborSchema } from '@/lib/schemas/labor';

export const dynamic = 'force-dynamic';

export async function GET(request: Request, context: IdParams) {
  const user = await requireRole(request);
  if (user instanceof Response) return user;
  const id = await idFrom(context, 'labour operation');
  if (id instanceof Response) return id;
  const op = await getLabor(id);
  if (!op) return errorResponse(404, `No labour operation with id ${id}.`);
  return NextResponse.json(op);
}

export async function PATCH(request: Request, context: IdParams) {
  const user = await requireRole(request, 'manager');
  if (user instanceof Response) return user;
  const id = await idFrom(context, 'labour operation');
  if (id instanceof Response) return id;
  const current = await getLabor(id);
  if (!current) return errorResponse(404, `No labour operation with id ${id}.`);
  const patch = await parsePatch(request, LaborPatchControlSchema, LaborSchema, laborFormValues(current));
  if (!patch.ok) return patch.response;
  return outcomeResponse(await updateLabor(id, patch.control.version, patch.values, user), { label: 'labour operation' });
}

export async function DELETE(request: Request, context: IdParams) {
  const user = await requireRole(request, 'manager');
  if (user instanceof Response) return user;
  const id = await idFrom(context, 'labour operation');
  if (id instanceof Response) return id;
  return outcomeResponse(await removeLabor(id, user), { label: 'labour operation' });
}
