import 'server-only';
import type { Transaction } from 'sequelize';
import { QuoteLink } from '../models';

// Extra private links to a customer's quote page (the pay-the-balance e-mail, the expiry reminder).
// Only the SHA-256 of a token is stored; the token itself lives in the one e-mail that carries it.

export async function quoteIdByLinkHash(tokenHash: string): Promise<number | null> {
  const link = await QuoteLink.findOne({ where: { tokenHash }, attributes: ['quoteId'] });
  return link?.quoteId ?? null;
}

export async function addQuoteLink(
  quoteId: number,
  tokenHash: string,
  purpose: QuoteLink['purpose'],
  t: Transaction,
): Promise<void> {
  await QuoteLink.create({ quoteId, tokenHash, purpose }, { transaction: t });
}
