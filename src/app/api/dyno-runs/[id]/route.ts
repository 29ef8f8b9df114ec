import { NextResponse } from 'next/server';
import { requireRole } from '@/lib/auth/guard';
import { clientIp } from '@/lib/auth/request-info';
import { idFrom, outcomeResponse, type IdParams } from '@/lib/http/kit';
import { deleteDynoRun, getDynoRun } from '@/lib/db/queries/dyno-runs';
import { errorResponse } from '@/lib/http/responses';

export const dynamic = 'force-dynamic';

export async function GET(request: Request, context: IdParams) {
  const user = await requireRole(request);
  if (user instanceof Response) return user;
  const id = await idFrom(context, 'dyno run');
  if (id instanceof Response) return id;
  const run = await getDynoRun(id);
  if (!run) return errorResponse(404, `No dyno run with id ${id}.`);
  return NextResponse.json(run);
}

/** A mistaken run (wrong build, a typo) is deleted outright; the audit log keeps what it said. */
export async function DELETE(request: Request, context: IdParams) {
  const user = await requireRole(request, 'tech', 'manager');
  if (user instanceof Response) return user;
  const id = await idFrom(context, 'dyno run');
  if (id instanceof Response) return id;
  return outcomeResponse(await deleteDynoRun(id, user, clientIp(request.headers)), { label: 'dyno run' });
}
