import { StateTag } from '@/components/catalogue/ui';
import { STATE_TONES, STATE_WORDS, type BoardState } from '@/lib/jobs/states';

// A state is always a word; the colour only repeats it.
export function JobStateTag({ state }: { state: BoardState }) {
  return <StateTag tone={STATE_TONES[state]}>{STATE_WORDS[state]}</StateTag>;
}

export function DueTag({ due }: { due: 'overdue' | 'today' | null }) {
  if (due === 'overdue') return <StateTag tone="fault">Overdue</StateTag>;
  if (due === 'today') return <StateTag tone="caution">Today</StateTag>;
  return null;
}

/** "Tue 3 Mar" for a YYYY-MM-DD date, read as a calendar day (no time zone shift). */
export function dayLabel(date: string): string {
  const d = new Date(`${date}T12:00:00Z`);
  return d.toLocaleDateString('en-GB', { weekday: 'short', day: 'numeric', month: 'short', timeZone: 'UTC' });
}
