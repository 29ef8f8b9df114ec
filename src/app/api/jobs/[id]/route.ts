import { NextResponse } from 'next/server';
import { clientIp } from '@/lib/auth/request-info';
import { getBoardJob } from '@/lib/db/queries/job-board';
import { updateJob } from '@/lib/db/queries/job-writes';
import { HttpError } from '@/lib/http/errors';
import { outcomeResponse } from '@/lib/http/kit';
import { route } from '@/lib/http/route';
import { JobPatchSchema } from '@/lib/schemas/job';

// [id] is the quote's id: a job is a deposit-paid quote, booked or not yet.
export const GET = route({ permission: 'jobs.read', ids: { id: 'job' } }, async ({ ids }) => {
  const job = await getBoardJob(ids.id);
  if (!job) throw new HttpError(404, `No deposit-paid job with id ${ids.id}.`);
  return NextResponse.json(job);
});

/**
 * { version, bookedFor?, bay?, technicianId?, state? }. A stale version answers 409 with the current job;
 * a move the workshop does not allow (or "ready" without a sign-off) answers 409 naming the current state.
 */
export const PATCH = route(
  { permission: 'jobs.record', ids: { id: 'job' }, body: JobPatchSchema },
  async ({ request, user, ids, body }) => {
    const outcome = await updateJob(ids.id, body, user, clientIp(request.headers));
    if (!outcome.ok && outcome.reason === 'refused')
      throw new HttpError(409, outcome.message, { current: await getBoardJob(ids.id) });
    return outcomeResponse(outcome, { label: 'job' });
  },
);
