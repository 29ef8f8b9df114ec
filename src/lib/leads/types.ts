import type { LeadAnswers, LeadStatus } from '@/lib/schemas/lead';
import type { Shortlist } from './shortlist';

// Leads and their notes as the API and the staff pages show them (src/lib/db/queries/leads.ts, lead-notes.ts).

export type LeadRecord = {
  id: number;
  name: string;
  email: string | null;
  phone: string | null;
  answers: Partial<LeadAnswers>;
  shortlist: Shortlist | null;
  status: LeadStatus;
  version: number;
  createdAt: string;
  updatedAt: string;
};

export type LeadNoteView = { id: number; leadId: number; body: string; author: string | null; createdAt: string };
