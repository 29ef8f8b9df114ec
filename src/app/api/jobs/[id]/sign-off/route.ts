import { clientIp } from '@/lib/auth/request-info';
import { getBoardJob } from '@/lib/db/queries/job-board';
import { recordSignOff } from '@/lib/db/queries/job-writes';
import { HttpError } from '@/lib/http/errors';
import { outcomeResponse } from '@/lib/http/kit';
import { route } from '@/lib/http/route';
import { SignOffSchema } from '@/lib/schemas/job';

/**
 * The technician's checks before first start. 201 with the job (its sign-off and the warnings against the
 * usual limits); 409 naming the state when the job is not in the shop or on the dyno.
 */
export const POST = route(
  { permission: 'jobs.record', ids: { id: 'job' }, body: SignOffSchema },
  async ({ request, user, ids, body }) => {
    const outcome = await recordSignOff(ids.id, body, user, clientIp(request.headers));
    if (!outcome.ok && outcome.reason === 'refused')
      throw new HttpError(409, outcome.message, { current: await getBoardJob(ids.id) });
    return outcomeResponse(outcome, { status: 201, label: 'job' });
  },
);
