import { StateTag } from '@/components/ui/state-tag';
import type { LeadStatus } from '@/lib/schemas/lead';

// Lead states, always as a word (the colour only repeats it).
export const LEAD_STATUS_WORDS: Record<LeadStatus, string> = {
  new: 'New, not contacted',
  contacted: 'Contacted',
  quoted: 'Quoted',
  closed: 'Closed',
};
const TONE: Record<LeadStatus, 'ok' | 'caution' | 'fault' | 'muted'> = {
  new: 'caution',
  contacted: 'muted',
  quoted: 'ok',
  closed: 'muted',
};

export function LeadStatusTag({ status }: { status: LeadStatus }) {
  return <StateTag tone={TONE[status]}>{LEAD_STATUS_WORDS[status]}</StateTag>;
}
