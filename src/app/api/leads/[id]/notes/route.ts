import { requireRole } from '@/lib/auth/guard';
import { idFrom, outcomeResponse, parseBody, type IdParams } from '@/lib/http/kit';
import { addLeadNote } from '@/lib/db/queries/lead-notes';
import { LeadNoteSchema } from '@/lib/schemas/lead-note';

export const dynamic = 'force-dynamic';

/** { body }: one entry in the lead's note log. Managers and counter staff; 201 with the note and its author. */
export async function POST(request: Request, context: IdParams) {
  const user = await requireRole(request, 'manager', 'counter');
  if (user instanceof Response) return user;
  const id = await idFrom(context, 'lead');
  if (id instanceof Response) return id;
  const body = await parseBody(request, LeadNoteSchema);
  if (!body.ok) return body.response;
  return outcomeResponse(await addLeadNote(id, body.value, user), { status: 201, label: 'lead' });
}
