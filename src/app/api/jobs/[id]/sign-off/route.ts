import { requireRole } from '@/lib/auth/guard';
import { clientIp } from '@/lib/auth/request-info';
import { idFrom, outcomeResponse, parseBody, type IdParams } from '@/lib/http/kit';
import { getBoardJob } from '@/lib/db/queries/job-board';
import { recordSignOff } from '@/lib/db/queries/job-writes';
import { errorResponse } from '@/lib/http/responses';
import { SignOffSchema } from '@/lib/schemas/job';

export const dynamic = 'force-dynamic';

/**
 * The technician's checks before first start. 201 with the job (its sign-off and the warnings against the
 * usual limits); 409 naming the state when the job is not in the shop or on the dyno.
 */
export async function POST(request: Request, context: IdParams) {
  const user = await requireRole(request, 'tech', 'manager');
  if (user instanceof Response) return user;
  const id = await idFrom(context, 'job');
  if (id instanceof Response) return id;
  const body = await parseBody(request, SignOffSchema);
  if (!body.ok) return body.response;
  const outcome = await recordSignOff(id, body.value, user, clientIp(request.headers));
  if (!outcome.ok && outcome.reason === 'refused') return errorResponse(409, outcome.message, { current: await getBoardJob(id) });
  return outcomeResponse(outcome, { status: 201, label: 'job' });
}
