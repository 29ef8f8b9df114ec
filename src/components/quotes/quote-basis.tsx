import { adviceWords } from '@/lib/quotes/advice-words';

// What the quote was based on, as frozen when it was first sent: the advisor's plain-words reasons and
// cautions for the quoted cam. Editing the build later changes neither.
export function QuoteBasis({ snapshot, compact = false }: { snapshot: { advice: unknown }; compact?: boolean }) {
  const { reasons, cautions } = adviceWords(snapshot.advice);
  if (!reasons.length && !cautions.length) return null;
  return (
    <section
      aria-labelledby="basis"
      className={compact ? 'rounded border border-steel-300 bg-paper-raised p-3 text-sm' : 'mt-8'}
    >
      <h2 id="basis" className={compact ? 'text-sm font-semibold' : 'text-2xl font-semibold'}>
        Why this cam{compact ? ' (as sent; later build edits do not change it)' : ''}
      </h2>
      {reasons.length ? (
        <ul className="mt-2 flex list-disc flex-col gap-1 pl-6">
          {reasons.map((text) => (
            <li key={text}>{text}</li>
          ))}
        </ul>
      ) : null}
      {cautions.length ? (
        <>
          <h3 className={compact ? 'mt-2 font-semibold' : 'mt-4 text-xl font-semibold'}>Checks for this cam</h3>
          <ul className="mt-2 flex list-disc flex-col gap-1 pl-6">
            {cautions.map((text) => (
              <li key={text}>{text}</li>
            ))}
          </ul>
        </>
      ) : null}
      <p className={compact ? 'mt-2 text-xs text-ink-muted' : 'mt-2 text-base text-ink-muted'}>
        Predictions are indicative; the dyno has the last word.
      </p>
    </section>
  );
}
