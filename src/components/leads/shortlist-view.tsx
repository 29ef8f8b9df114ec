import type { Shortlist } from '@/lib/leads/shortlist';
import { fromPrice, jobPrice, type ShortlistEntry } from '@/lib/leads/shortlist';

// The customer's indicative shortlist in plain words (also shown to staff on the leads page, compact).
export const CUSTOMER_CAUTIONS = [
  'Emissions: many places do not allow an aftermarket cam on a road vehicle unless the part is certified for that vehicle. If yours is tested, ask the shop which choices are allowed where you live.',
  'Brakes: a bigger cam can lower engine vacuum at idle, and most power brakes rely on it. The shop checks brake assist before the vehicle leaves.',
  'Valve springs and piston-to-valve clearance are checked on your engine by a qualified technician, not assumed.',
  'The engine must be re-tuned after the swap. A changed converter alters how the vehicle creeps and pulls away.',
  'Local codes and licensed practice come first: where they ask for more than this, the shop follows them.',
];

/** The job price the shop would quote, before tax; older saved shortlists carried only "from" the cam and parts. */
function priceWords(entry: ShortlistEntry): string {
  if (typeof entry.jobPriceCents === 'number')
    return `About ${jobPrice(entry.jobPriceCents)} for the whole job — the cam, the parts it needs, fitting and the tune — before tax`;
  if (typeof entry.fromPriceCents === 'number')
    return `${fromPrice(entry.fromPriceCents)} for the cam and what it needs; fitting comes on top`;
  return 'Ask the shop for the price';
}

export function ShortlistCards({ shortlist, compact = false }: { shortlist: Shortlist; compact?: boolean }) {
  if (!shortlist.entries.length) {
    return <p>The shop has no cam on its list that suits these answers. The shop will talk it through with you.</p>;
  }
  return (
    <ol className={`flex flex-col ${compact ? 'gap-2' : 'gap-5'}`}>
      {shortlist.entries.map((entry) => (
        <li
          key={String(entry.camId)}
          className={`rounded-lg border border-steel-300 bg-paper-raised ${compact ? 'p-3' : 'p-5'}`}
        >
          <h3 className={compact ? 'font-semibold' : 'text-2xl font-semibold'}>
            Choice {entry.rank}: {entry.camName}
          </h3>
          <p className={compact ? 'text-sm text-ink-soft' : 'mt-1 text-base text-ink-soft'}>
            {priceWords(entry)} ·{' '}
            {entry.emissionsCertified
              ? 'certified for emissions-tested road use'
              : 'not certified for emissions-tested road use'}
            {compact
              ? ` · peak power ${entry.gainPctPeakHp >= 0 ? '+' : ''}${entry.gainPctPeakHp.toLocaleString('en-US', { maximumFractionDigits: 1 })} % (indicative)`
              : ''}
          </p>
          {compact ? null : (
            <>
              <h4 className="mt-4 text-xl font-semibold">Why it fits</h4>
              <ul className="mt-1 list-disc pl-6">
                {entry.reasons.map((text) => (
                  <li key={text}>{text}</li>
                ))}
              </ul>
              {entry.alsoNeeds.length ? (
                <>
                  <h4 className="mt-4 text-xl font-semibold">What else the job needs</h4>
                  <ul className="mt-1 list-disc pl-6">
                    {entry.alsoNeeds.map((text) => (
                      <li key={text}>{text}</li>
                    ))}
                  </ul>
                </>
              ) : null}
              {entry.cautions.length ? (
                <>
                  <h4 className="mt-4 text-xl font-semibold">Keep in mind</h4>
                  <ul className="mt-1 list-disc pl-6">
                    {entry.cautions.map((text) => (
                      <li key={text}>{text}</li>
                    ))}
                  </ul>
                </>
              ) : null}
            </>
          )}
        </li>
      ))}
    </ol>
  );
}
