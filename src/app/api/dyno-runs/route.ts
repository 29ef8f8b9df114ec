import { NextResponse } from 'next/server';
import { clientIp } from '@/lib/auth/request-info';
import { buildExists, createDynoRun, listDynoRuns } from '@/lib/db/queries/dyno-runs';
import { notFound } from '@/lib/http/errors';
import { outcomeResponse } from '@/lib/http/kit';
import { route } from '@/lib/http/route';
import { DynoRunListQuerySchema, DynoRunSchema } from '@/lib/schemas/dyno-run';

/** GET /api/dyno-runs?buildId=N — the build's runs, oldest first, observed and corrected. */
export const GET = route({ permission: 'dyno.read', query: DynoRunListQuerySchema }, async ({ query }) => {
  if (!(await buildExists(query.buildId))) throw notFound('build', query.buildId);
  return NextResponse.json({ buildId: query.buildId, runs: await listDynoRuns(query.buildId) });
});

/** POST /api/dyno-runs — record one run. */
export const POST = route({ permission: 'dyno.record', body: DynoRunSchema }, async ({ request, user, body }) =>
  outcomeResponse(await createDynoRun(body, user, clientIp(request.headers)), { status: 201, label: 'dyno run' }),
);
