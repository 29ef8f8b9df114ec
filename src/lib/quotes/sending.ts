import { recordAudit } from '@/lib/audit';
import type { SessionUser } from '@/lib/auth/guard';
import { hashToken, randomToken } from '@/lib/auth/tokens';
import { invalid, notFound, refused, runWrite } from '@/lib/db/write';
import { LifecycleRefused } from '@/lib/db/queries/quote-lifecycle';
import { writeSent } from '@/lib/db/queries/quote-writes';
import { getQuote, lockQuoteWithParts, shopSettingsRow, snapshotSource } from '@/lib/db/queries/quotes';
import { presentQuote } from './present';
import { appBaseUrl } from '@/lib/env';
import { MailError, sendMail } from '@/lib/mail';
import { stateWord, validUntilFrom } from './lifecycle';
import { mailShop, quoteSentMail } from './quote-notices';
import { discountShareBp } from './authority';
import { discountAwaitsApproval, mailNotSent, recordOrThrow } from './refusals';
import { takeSnapshot } from './snapshot';
import type { QuoteRecord } from './types';

// Sending a quote: a fresh private link e-mailed to the customer, the quote moved to "sent".

/**
 * Sends (or sends again) the quote: a fresh private token whose hash alone is stored, an e-mail with
 * the link, status → sent (through the lifecycle). The mail goes out inside the transaction, so a refused
 * mail changes nothing (502); sending again replaces the token, and the old link stops working. The first
 * send sets a missing valid-until day and freezes the build profile and the advisor's result for the cam.
 */
export async function sendQuote(id: number, user: SessionUser): Promise<QuoteRecord> {
  // Ranking takes a while: worked out before the transaction, with no row locked meanwhile.
  const source = await snapshotSource(id);
  const snapshot = source && !source.frozen ? await takeSnapshot(source.buildId, source.camId) : null;
  try {
    const outcome = await runWrite(async (t) => {
      const quote = await lockQuoteWithParts(id, t);
      if (!quote) throw notFound();
      // The customer never sees (or pays) a discount a manager has not approved.
      if (quote.discountApproval === 'pending') {
        const lines = (quote.lines ?? []).map((l) => ({ ...l.get(), quantity: Number(l.quantity) }));
        throw discountAwaitsApproval(quote.number, discountShareBp(lines));
      }
      const email = quote.customer?.email;
      if (quote.status === 'draft' || quote.status === 'sent') {
        if (!email)
          throw invalid([
            { field: 'customer.email', message: 'the customer has no e-mail address; add one before sending' },
          ]);
        if (!(quote.lines ?? []).length) throw invalid([{ field: 'lines', message: 'the quote has no lines' }]);
      }
      const token = randomToken();
      const now = new Date();
      try {
        await writeSent(
          quote,
          { tokenHash: hashToken(token), sentAt: now, validUntil: quote.validUntil ?? validUntilFrom(now), snapshot },
          { user },
          t,
          { to: email },
        );
      } catch (error) {
        if (error instanceof LifecycleRefused)
          throw refused(
            `Quote ${quote.number} is ${stateWord(quote.status).toLowerCase()}; only a draft or a sent quote can be sent.`,
          );
        throw error;
      }
      const settings = await shopSettingsRow(t);
      if (!settings)
        throw refused('The shop settings are missing; a manager has to set the labour rate, tax and deposit first.');
      const record = (await getQuote(id, t))!;
      await recordAudit(
        {
          user,
          action: 'quote.sent',
          entityType: 'quote',
          entityId: id,
          before: null,
          after: { to: email, revision: record.revision },
        },
        t,
      );
      await sendMail(
        await quoteSentMail(
          record,
          mailShop(settings),
          `${appBaseUrl()}/q/${token}`,
          record.revisionOf?.number ?? null,
        ),
      );
      return { record };
    });
    return recordOrThrow(outcome, (r) => presentQuote(r, user));
  } catch (error) {
    if (error instanceof MailError)
      throw mailNotSent('The e-mail could not be sent, so the quote was not marked as sent. Try again in a moment.');
    throw error;
  }
}
