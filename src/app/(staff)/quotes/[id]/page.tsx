import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { QuoteWorkbench } from '@/components/quotes/quote-workbench';
import { requireAccessForPage } from '@/lib/auth/guard';
import { getQuote } from '@/lib/db/queries/quotes';
import { presentQuote } from '@/lib/quotes/present';

export const metadata: Metadata = { title: 'Quote' };

export default async function QuotePage({ params }: { params: Promise<{ id: string }> }) {
  const user = await requireAccessForPage('quotes.read');
  const { id } = await params;
  if (!/^\d{1,10}$/.test(id)) notFound();
  const quote = await getQuote(Number(id));
  if (!quote) notFound();
  return <QuoteWorkbench initial={presentQuote(quote, user)} role={user.role} />;
}
