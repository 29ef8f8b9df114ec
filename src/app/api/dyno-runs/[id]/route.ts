import { NextResponse } from 'next/server';
import { clientIp } from '@/lib/auth/request-info';
import { deleteDynoRun, getDynoRun } from '@/lib/db/queries/dyno-runs';
import { notFound } from '@/lib/http/errors';
import { outcomeResponse } from '@/lib/http/kit';
import { route } from '@/lib/http/route';

export const GET = route({ permission: 'dyno.read', ids: { id: 'dyno run' } }, async ({ ids }) => {
  const run = await getDynoRun(ids.id);
  if (!run) throw notFound('dyno run', ids.id);
  return NextResponse.json(run);
});

/** A mistaken run (wrong build, a typo) is deleted outright; the audit log keeps what it said. */
export const DELETE = route({ permission: 'dyno.record', ids: { id: 'dyno run' } }, async ({ request, user, ids }) =>
  outcomeResponse(await deleteDynoRun(ids.id, user, clientIp(request.headers)), { label: 'dyno run' }),
);
