// A record's state as a small word on a tint: the word carries the meaning, the tint only helps.
export type StateTone = 'ok' | 'caution' | 'fault' | 'muted';

const look: Record<StateTone, string> = {
  ok: 'bg-ok-100 text-ok-700',
  caution: 'bg-caution-100 text-caution-700',
  fault: 'bg-fault-100 text-fault-700',
  muted: 'bg-steel-100 text-ink-muted',
};

export function StateTag({ tone, children }: { tone: StateTone; children: React.ReactNode }) {
  return <span className={`inline-block rounded px-1.5 py-0.5 text-xs font-semibold ${look[tone]}`}>{children}</span>;
}
