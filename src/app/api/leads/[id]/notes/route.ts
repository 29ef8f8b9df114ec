import { addLeadNote } from '@/lib/db/queries/lead-notes';
import { outcomeResponse } from '@/lib/http/kit';
import { route } from '@/lib/http/route';
import { LeadNoteSchema } from '@/lib/schemas/lead-note';

/** { body }: one entry in the lead's note log; 201 with the note and its author. */
export const POST = route(
  { permission: 'leads.follow-up', ids: { id: 'lead' }, body: LeadNoteSchema },
  async ({ user, ids, body }) => outcomeResponse(await addLeadNote(ids.id, body, user), { status: 201, label: 'lead' }),
);
