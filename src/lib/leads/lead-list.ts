import { listLeadNotes } from '@/lib/db/queries/lead-notes';
import { countStaleLeads, listLeads } from '@/lib/db/queries/leads';
import { getShopSettings } from '@/lib/db/queries/settings';
import type { LeadStatus } from '@/lib/schemas/lead';
import { staleCutoff, staleDays } from './stale';
import type { LeadNoteView, LeadRecord } from './types';

// One page of the leads list with the follow-up facts the leads page and GET /api/leads both show: how
// long each new lead has waited without contact (when past the shop's limit) and how many are waiting
// in all. The server's clock decides "now"; the shop's setting decides how long a new lead may wait.

export type LeadListEntry = LeadRecord & { staleDays: number | null };
export type LeadListPage = {
  items: LeadListEntry[];
  total: number;
  notes: Map<number, LeadNoteView[]>;
  staleTotal: number;
  staleAfterDays: number;
};

export async function leadListPage(
  query: { status?: LeadStatus; page: number; pageSize: number },
  now = new Date(),
): Promise<LeadListPage> {
  const [{ items, total }, settings] = await Promise.all([listLeads(query), getShopSettings()]);
  const staleAfterDays = settings?.leadStaleDays ?? 2;
  const [notes, staleTotal] = await Promise.all([
    listLeadNotes(items.map((l) => l.id)),
    countStaleLeads(staleCutoff(now, staleAfterDays)),
  ]);
  const noteTimes = (id: number) => (notes.get(id) ?? []).map((n) => n.createdAt);
  return {
    items: items.map((lead) => ({ ...lead, staleDays: staleDays(lead, noteTimes(lead.id), now, staleAfterDays) })),
    total,
    notes,
    staleTotal,
    staleAfterDays,
  };
}
