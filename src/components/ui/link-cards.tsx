import Link from 'next/link';

// The grid of cards that open the next page, each with a line saying what is there: the staff home and
// the catalogue's home.
export type LinkCard = { href: string; label: string; text: string };

export function LinkCards({ links }: { links: readonly LinkCard[] }) {
  return (
    <ul className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
      {links.map((link) => (
        <li key={link.href}>
          <Link
            href={link.href}
            className="block h-full rounded-lg border border-steel-300 bg-paper-raised p-4 hover:border-gauge-500"
          >
            <span className="font-semibold">{link.label}</span>
            <span className="mt-1 block text-sm text-ink-soft">{link.text}</span>
          </Link>
        </li>
      ))}
    </ul>
  );
}
