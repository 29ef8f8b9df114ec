import { requireRole } from '@/lib/auth/guard';
import { idFrom, outcomeResponse, parseBody, type IdParams } from '@/lib/http/kit';
import { updateLeadStatus } from '@/lib/db/queries/leads';
import { LeadPatchSchema } from '@/lib/schemas/lead';

export const dynamic = 'force-dynamic';

/** { version, status }: managers and counter staff; a stale version answers 409 with the current lead. */
export async function PATCH(request: Request, context: IdParams) {
  const user = await requireRole(request, 'manager', 'counter');
  if (user instanceof Response) return user;
  const id = await idFrom(context, 'lead');
  if (id instanceof Response) return id;
  const body = await parseBody(request, LeadPatchSchema);
  if (!body.ok) return body.response;
  return outcomeResponse(await updateLeadStatus(id, body.value, user), { label: 'lead' });
}
