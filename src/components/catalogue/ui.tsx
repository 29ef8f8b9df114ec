import Link from 'next/link';

// Quiet building blocks shared by the catalogue screens.
export function PageHeader({ title, lead, actions, back }: { title: string; lead?: React.ReactNode; actions?: React.ReactNode; back?: { href: string; label: string } }) {
  return (
    <header className="flex flex-col gap-2 sm:flex-row sm:items-end sm:justify-between">
      <div>
        {back ? (
          <Link href={back.href} className="text-sm text-gauge-700 underline-offset-2 hover:underline">
            ← {back.label}
          </Link>
        ) : null}
        <h1 className="text-2xl font-semibold">{title}</h1>
        {lead ? <p className="text-sm text-ink-soft">{lead}</p> : null}
      </div>
      {actions ? <div className="flex flex-wrap gap-2">{actions}</div> : null}
    </header>
  );
}

export function ButtonLink({ href, children, tone = 'quiet' }: { href: string; children: React.ReactNode; tone?: 'primary' | 'quiet' }) {
  const style = tone === 'primary' ? 'bg-ember-500 text-paper-raised hover:bg-ember-600' : 'bg-paper-raised text-ink ring-1 ring-steel-300 hover:ring-gauge-500';
  return (
    <Link href={href} className={`rounded px-3 py-1.5 text-sm font-semibold ${style}`}>
      {children}
    </Link>
  );
}

export const buttonClass = {
  primary: 'rounded bg-ember-500 px-3 py-1.5 text-sm font-semibold text-paper-raised hover:bg-ember-600 disabled:opacity-60',
  quiet: 'rounded bg-paper-raised px-3 py-1.5 text-sm font-semibold text-ink ring-1 ring-steel-300 hover:ring-gauge-500 disabled:opacity-60',
  danger: 'rounded bg-paper-raised px-3 py-1.5 text-sm font-semibold text-fault-700 ring-1 ring-fault-700/50 hover:bg-fault-100 disabled:opacity-60',
};

export function StateTag({ tone, children }: { tone: 'ok' | 'caution' | 'fault' | 'muted'; children: React.ReactNode }) {
  const style = { ok: 'bg-ok-100 text-ok-700', caution: 'bg-caution-100 text-caution-700', fault: 'bg-fault-100 text-fault-700', muted: 'bg-steel-100 text-ink-muted' }[tone];
  return <span className={`inline-block rounded px-1.5 py-0.5 text-xs font-semibold ${style}`}>{children}</span>;
}

export function Banner({ tone, title, children }: { tone: 'ok' | 'fault' | 'caution' | 'info'; title: string; children?: React.ReactNode }) {
  const style = {
    ok: 'border-ok-700/40 bg-ok-100 text-ok-700',
    fault: 'border-fault-700/40 bg-fault-100 text-fault-700',
    caution: 'border-caution-700/40 bg-caution-100 text-caution-700',
    info: 'border-gauge-500/40 bg-gauge-100 text-gauge-700',
  }[tone];
  return (
    <div role={tone === 'fault' ? 'alert' : 'status'} className={`rounded border px-3 py-2 text-sm ${style}`}>
      <p className="font-semibold">{title}</p>
      {children ? <div className="mt-1 text-ink">{children}</div> : null}
    </div>
  );
}

export const tableClass = 'w-full border-collapse text-sm tabular-nums';
export const thClass = 'border-b border-steel-300 px-2 py-1.5 text-left text-xs font-semibold uppercase tracking-wide text-ink-muted';
export const tdClass = 'border-b border-steel-100 px-2 py-1.5 align-top';

/**
 * The box a wide table scrolls sideways in. It takes keyboard focus (arrow keys then scroll it) and is a named
 * region, so a keyboard user can reach columns past the edge of a phone screen (axe: scrollable-region-focusable).
 */
export function TableScroll({ label, className = '', children }: { label: string; className?: string; children: React.ReactNode }) {
  return (
    <div role="region" aria-label={label} tabIndex={0} className={`overflow-x-auto rounded border border-steel-300 bg-paper-raised focus-visible:outline focus-visible:outline-2 focus-visible:outline-gauge-500 ${className}`}>
      {children}
    </div>
  );
}
