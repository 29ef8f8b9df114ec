import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { QuoteWorkbench } from '@/components/quotes/quote-workbench';
import { requireAccessForPage } from '@/lib/auth/guard';
import { springKitShortfalls } from '@/lib/catalogue/spring-kits';
import { getCam } from '@/lib/db/queries/cams';
import { loadSpringKits } from '@/lib/db/queries/parts';
import { getQuote } from '@/lib/db/queries/quotes';
import { presentQuote } from '@/lib/quotes/present';

export const metadata: Metadata = { title: 'Quote' };

export default async function QuotePage({ params }: { params: Promise<{ id: string }> }) {
  const user = await requireAccessForPage('quotes.read');
  const { id } = await params;
  if (!/^\d{1,10}$/.test(id)) notFound();
  const quote = await getQuote(Number(id));
  if (!quote) notFound();
  // Read from the lines as they are now, so a kit changed by hand clears (or raises) the warning.
  const [cam, kits] = quote.camId !== null ? await Promise.all([getCam(quote.camId), loadSpringKits()]) : [null, []];
  const springWarnings = cam
    ? springKitShortfalls(quote.lines, kits, Math.max(cam.intakeLiftIn, cam.exhaustLiftIn))
    : [];
  return <QuoteWorkbench initial={presentQuote(quote, user)} role={user.role} springWarnings={springWarnings} />;
}
