import { recordAudit } from '@/lib/audit';
import type { SessionUser } from '@/lib/auth/guard';
import { conflict, notFound, refused, runWrite } from '@/lib/db/write';
import { writeDiscountApproval } from '@/lib/db/queries/quote-writes';
import { getQuote, lockQuote } from '@/lib/db/queries/quotes';
import { presentQuote } from './present';
import { recordOrThrow } from './refusals';
import type { QuoteRecord } from './types';

// A manager approving a counter discount above the shop's limit (discount-approval.ts): the quote may then
// be sent. The caller names the version it saw, so an approval never covers lines changed since.

export async function approveDiscount(id: number, input: { version: number }, user: SessionUser): Promise<QuoteRecord> {
  const outcome = await runWrite(
    async (t) => {
      const quote = await lockQuote(id, t);
      if (!quote) throw notFound();
      if (quote.version !== input.version) throw conflict(await getQuote(id, t));
      const before = (await getQuote(id, t))!;
      if (quote.discountApproval !== 'pending')
        throw refused(
          `Quote ${quote.number} has no discount waiting for approval (${quote.discountApproval === 'approved' ? 'it is already approved' : 'its discounts are within the counter limit'}).`,
        );
      await writeDiscountApproval(quote, user.id, new Date(), t);
      await recordAudit(
        {
          user,
          action: 'quote.discount-approved',
          entityType: 'quote',
          entityId: id,
          before: { discountApproval: 'pending' },
          after: { discountApproval: 'approved', discountBp: before.discountApproval.discountBp },
        },
        t,
      );
      return { record: (await getQuote(id, t))! };
    },
    { reload: () => getQuote(id) },
  );
  return recordOrThrow(outcome, (r) => presentQuote(r, user));
}
