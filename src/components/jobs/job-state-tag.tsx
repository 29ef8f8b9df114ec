export { dayLabel } from '@/lib/format';
import { StateTag } from '@/components/ui/state-tag';
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
