import { NextResponse } from 'next/server';
import { requireRole } from '@/lib/auth/guard';
import { clientIp } from '@/lib/auth/request-info';
import { outcomeResponse, parseBody, parseQuery } from '@/lib/http/kit';
import { buildExists, createDynoRun, listDynoRuns } from '@/lib/db/queries/dyno-runs';
import { errorResponse } from '@/lib/http/responses';
import { DynoRunListQuerySchema, DynoRunSchema } from '@/lib/schemas/dyno-run';

export const dynamic = 'force-dynamic';

/** GET /api/dyno-runs?buildId=N — the build's runs, oldest first, observed and corrected. Any staff member. */
export async function GET(request: Request) {
  const user = await requireRole(request);
  if (user instanceof Response) return user;
  const query = parseQuery(request, DynoRunListQuerySchema);
  if (!query.ok) return query.response;
  if (!(await buildExists(query.value.buildId))) return errorResponse(404, `No build with id ${query.value.buildId}.`);
  return NextResponse.json({ buildId: query.value.buildId, runs: await listDynoRuns(query.value.buildId) });
}

/** POST /api/dyno-runs — record one run. Technicians and managers. */
export async function POST(request: Request) {
  const user = await requireRole(request, 'tech', 'manager');
  if (user instanceof Response) return user;
  const body = await parseBody(request, DynoRunSchema);
  if (!body.ok) return body.response;
  return outcomeResponse(await createDynoRun(body.value, user, clientIp(request.headers)), { status: 201, label: 'dyno run' });
}
