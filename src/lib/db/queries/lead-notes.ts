import 'server-only';
import { Op } from 'sequelize';
import type { SessionUser } from '@/lib/auth/guard';
import { recordAudit } from '@/lib/audit';
import { notFound, runWrite, type WriteOutcome } from '@/lib/db/write';
import type { LeadNoteInput } from '@/lib/schemas/lead-note';
import type { LeadNoteView } from '@/lib/leads/types';
import { Lead, LeadNote, User } from '../models';

// The note log per lead: who, when, what was said. Oldest first, as a conversation reads.

type NoteRow = LeadNote & { user?: User | null };
const viewOf = (n: NoteRow): LeadNoteView => ({
  id: n.id,
  leadId: n.leadId,
  body: n.body,
  author: n.user?.name ?? null,
  createdAt: new Date(n.createdAt).toISOString(),
});

export async function listLeadNotes(leadIds: number[]): Promise<Map<number, LeadNoteView[]>> {
  const out = new Map<number, LeadNoteView[]>();
  if (!leadIds.length) return out;
  const rows = (await LeadNote.findAll({
    where: { leadId: { [Op.in]: leadIds } },
    include: [{ model: User, as: 'user', attributes: ['id', 'name'] }],
    order: [['id', 'ASC']],
  })) as NoteRow[];
  for (const row of rows) out.set(row.leadId, [...(out.get(row.leadId) ?? []), viewOf(row)]);
  return out;
}

/** Adds a note with its audit row in one transaction; the lead row is locked so a deleted lead answers 404. */
export async function addLeadNote(
  leadId: number,
  input: LeadNoteInput,
  user: SessionUser,
): Promise<WriteOutcome<LeadNoteView>> {
  return runWrite(async (t) => {
    const lead = await Lead.findByPk(leadId, { transaction: t, lock: t.LOCK.UPDATE });
    if (!lead) throw notFound();
    const note = await LeadNote.create({ leadId, userId: user.id, body: input.body }, { transaction: t });
    await recordAudit(
      { user, action: 'lead.note-added', entityType: 'lead', entityId: leadId, after: { noteId: note.id } },
      t,
    );
    return {
      record: {
        id: note.id,
        leadId,
        body: note.body,
        author: user.name,
        createdAt: new Date(note.createdAt).toISOString(),
      },
    };
  });
}
