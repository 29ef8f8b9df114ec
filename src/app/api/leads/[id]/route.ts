import { updateLeadStatus } from '@/lib/db/queries/leads';
import { outcomeResponse } from '@/lib/http/kit';
import { route } from '@/lib/http/route';
import { LeadPatchSchema } from '@/lib/schemas/lead';

/** { version, status }: a stale version answers 409 with the current lead. */
export const PATCH = route(
  { permission: 'leads.follow-up', ids: { id: 'lead' }, body: LeadPatchSchema },
  async ({ user, ids, body }) => outcomeResponse(await updateLeadStatus(ids.id, body, user), { label: 'lead' }),
);
