// Data tables: figures in tabular digits, headings small and muted, one quiet rule between rows.
export const tableClass = 'w-full border-collapse text-sm tabular-nums';
export const thClass =
  'border-b border-steel-300 px-2 py-1.5 text-left text-xs font-semibold uppercase tracking-wide text-ink-muted';
export const tdClass = 'border-b border-steel-100 px-2 py-1.5 align-top';

/**
 * The box a wide table scrolls sideways in. It takes keyboard focus (arrow keys then scroll it) and is a named
 * region, so a keyboard user can reach columns past the edge of a phone screen (axe: scrollable-region-focusable).
 */
export function TableScroll({
  label,
  className = '',
  children,
}: {
  label: string;
  className?: string;
  children: React.ReactNode;
}) {
  return (
    <div
      role="region"
      aria-label={label}
      tabIndex={0}
      className={`overflow-x-auto rounded border border-steel-300 bg-paper-raised focus-visible:outline focus-visible:outline-2 focus-visible:outline-gauge-500 ${className}`}
    >
      {children}
    </div>
  );
}
