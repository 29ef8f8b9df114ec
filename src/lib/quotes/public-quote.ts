import { getQuote, quoteIdByToken, shopForDocuments } from '@/lib/db/queries/quotes';
import { customerQuote } from './present';
import type { PublicQuote } from './types';

// The customer's private link: the quote it opens, as the customer may read it, and the shop's details.

/** Null for any token that is not a live link, a draft, or a shop without settings (never a hint why). */
export async function getPublicQuote(token: string): Promise<PublicQuote | null> {
  const quoteId = await quoteIdByToken(token);
  if (!quoteId) return null;
  const [quote, shop] = await Promise.all([getQuote(quoteId), shopForDocuments()]);
  if (!quote || !shop || quote.status === 'draft') return null;
  return { quote: customerQuote(quote), shop };
}
