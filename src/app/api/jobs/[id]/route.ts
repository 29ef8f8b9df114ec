import { NextResponse } from 'next/server';
import { requireRole } from '@/lib/auth/guard';
import { clientIp } from '@/lib/auth/request-info';
import { idFrom, outcomeResponse, parseBody, type IdParams } from '@/lib/http/kit';
import { getBoardJob } from '@/lib/db/queries/job-board';
import { updateJob } from '@/lib/db/queries/job-writes';
import { errorResponse } from '@/lib/http/responses';
import { JobPatchSchema } from '@/lib/schemas/job';

export const dynamic = 'force-dynamic';

// [id] is the quote's id: a job is a deposit-paid quote, booked or not yet.
export async function GET(request: Request, context: IdParams) {
  const user = await requireRole(request, 'tech', 'manager');
  if (user instanceof Response) return user;
  const id = await idFrom(context, 'job');
  if (id instanceof Response) return id;
  const job = await getBoardJob(id);
  if (!job) return errorResponse(404, `No deposit-paid job with id ${id}.`);
  return NextResponse.json(job);
}

/**
 * { version, bookedFor?, bay?, technicianId?, state? }. A stale version answers 409 with the current job;
 * a move the workshop does not allow (or "ready" without a sign-off) answers 409 naming the current state.
 */
export async function PATCH(request: Request, context: IdParams) {
  const user = await requireRole(request, 'tech', 'manager');
  if (user instanceof Response) return user;
  const id = await idFrom(context, 'job');
  if (id instanceof Response) return id;
  const body = await parseBody(request, JobPatchSchema);
  if (!body.ok) return body.response;
  const outcome = await updateJob(id, body.value, user, clientIp(request.headers));
  if (!outcome.ok && outcome.reason === 'refused') return errorResponse(409, outcome.message, { current: await getBoardJob(id) });
  return outcomeResponse(outcome, { label: 'job' });
}
