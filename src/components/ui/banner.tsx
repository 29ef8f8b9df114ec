// A message about the whole screen or form. With a title it is a box (title, then detail); without one it
// is a single line that starts with its tone in words ("Problem: …"), so colour never carries the meaning
// alone. A fault is an alert (read out at once), the rest are polite status messages.
export type BannerTone = 'ok' | 'fault' | 'caution' | 'info';

const look: Record<BannerTone, string> = {
  ok: 'border-ok-700/40 bg-ok-100 text-ok-700',
  fault: 'border-fault-700/40 bg-fault-100 text-fault-700',
  caution: 'border-caution-700/40 bg-caution-100 text-caution-700',
  info: 'border-gauge-500/40 bg-gauge-100 text-gauge-700',
};
const word: Record<BannerTone, string> = { ok: 'Done', fault: 'Problem', caution: 'Note', info: 'Info' };

export function Banner({ tone, title, children }: { tone: BannerTone; title?: string; children?: React.ReactNode }) {
  return (
    <div role={tone === 'fault' ? 'alert' : 'status'} className={`rounded border px-3 py-2 text-sm ${look[tone]}`}>
      {title === undefined ? (
        <>
          <span className="font-semibold">{word[tone]}:</span> {children}
        </>
      ) : (
        <>
          <p className="font-semibold">{title}</p>
          {children ? <div className="mt-1 text-ink">{children}</div> : null}
        </>
      )}
    </div>
  );
}
