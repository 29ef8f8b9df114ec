import Link from 'next/link';

// The top of every staff page: an optional way back, the title (the page's one h1), a line saying what the
// page is for, and the page's actions on the right.
export function PageHeader({
  title,
  lead,
  actions,
  back,
}: {
  title: string;
  lead?: React.ReactNode;
  actions?: React.ReactNode;
  back?: { href: string; label: string };
}) {
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
