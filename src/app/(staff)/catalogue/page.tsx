import type { Metadata } from 'next';
import { LinkCards } from '@/components/ui/link-cards';
import { requireAccessForPage } from '@/lib/auth/guard';
import { can } from '@/lib/auth/policy';

export const metadata: Metadata = { title: 'Catalogue' };

export default async function CataloguePage() {
  const user = await requireAccessForPage('catalogue.read');
  const manager = can(user, 'catalogue.write');
  const links = [
    {
      href: '/catalogue/cams',
      label: 'Cams',
      text: 'Every grind the shop sells, with its card, valve events and spec sheets.',
    },
    {
      href: '/catalogue/parts',
      label: 'Parts',
      text: 'Springs, pushrods, lifters, delete kits, timing sets, gaskets, converters and tunes.',
    },
    { href: '/catalogue/labor', label: 'Labour', text: 'Operations, their hours and the engines they apply to.' },
    { href: '/catalogue/rules', label: 'What a cam needs', text: 'The rules that add parts and labour to a cam swap.' },
    ...(manager
      ? [
          {
            href: '/catalogue/cams/import',
            label: 'Import a spreadsheet',
            text: 'Bring in a supplier’s cam cards from CSV, with a preview first.',
          },
        ]
      : []),
    ...(can(user, 'settings.manage')
      ? [
          {
            href: '/catalogue/settings',
            label: 'Prices and deposit',
            text: 'Labour rate, tax rate and the deposit policy.',
          },
        ]
      : []),
  ];
  return (
    <div className="flex flex-col gap-6">
      <header>
        <h1 className="text-2xl font-semibold">Catalogue</h1>
        <p className="text-sm text-ink-soft">
          {manager
            ? 'Keep what the shop sells and what each cam needs.'
            : 'What the shop sells and what each cam needs. Managers make the changes.'}
        </p>
      </header>
      <LinkCards links={links} />
    </div>
  );
}
