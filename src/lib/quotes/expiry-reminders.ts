import { createElement } from 'react';
import { ExpiryReminderEmail, expiryReminderSubject } from '@/emails/expiry-reminder';
import { renderMail } from '@/emails/render';
import { recordAudit } from '@/lib/audit';
import { hashToken, randomToken } from '@/lib/auth/tokens';
import { db } from '@/lib/db/models';
import { dueForReminder, reminderCandidates, stampReminded } from '@/lib/db/queries/expiry-reminders';
import { addQuoteLink } from '@/lib/db/queries/quote-links';
import { getQuote, lockQuote, shopSettingsRow } from '@/lib/db/queries/quotes';
import { appBaseUrl } from '@/lib/env';
import { sendMail } from '@/lib/mail';
import { addDaysUtc, todayUtc } from './deposit-rules';
import { envelope, mailShop } from './quote-notices';

// The expiry reminder: one e-mail per sent quote whose valid-until day is near, with a fresh private
// link. Each quote is locked, checked again, stamped (quotes.expiry_reminded_at) and mailed in one
// transaction, so running the command twice — or on two machines at once — reminds each customer once,
// and a refused e-mail leaves the quote unstamped for the next run.

export type ReminderRun = {
  today: string;
  through: string;
  reminded: string[];
  withoutEmail: string[];
  failed: string[];
};

/** Open quotes valid through today … today + withinDays (UTC days) that were never reminded. */
export async function remindExpiringQuotes(options: { now?: Date; withinDays?: number } = {}): Promise<ReminderRun> {
  const now = options.now ?? new Date();
  const today = todayUtc(now);
  const through = addDaysUtc(today, options.withinDays ?? 3);
  const run: ReminderRun = { today, through, reminded: [], withoutEmail: [], failed: [] };
  for (const { id, number } of await reminderCandidates(today, through)) {
    try {
      const outcome = await db().transaction(async (t) => {
        const quote = await lockQuote(id, t);
        if (!quote || !dueForReminder(quote, today, through)) return 'skipped' as const;
        const record = (await getQuote(id, t))!;
        if (!record.customer.email) return 'no-email' as const;
        const token = randomToken();
        await addQuoteLink(id, hashToken(token), 'reminder', t);
        await stampReminded(id, now, t);
        await recordAudit(
          {
            actor: 'expiry-reminder',
            action: 'quote.expiry-reminded',
            entityType: 'quote',
            entityId: id,
            after: { to: record.customer.email, validUntil: quote.validUntil },
          },
          t,
        );
        const shop = mailShop(await shopSettingsRow(t));
        const props = {
          shop,
          customerName: record.customer.name,
          number: record.number,
          totalCents: record.totalCents,
          depositCents: record.depositCents,
          validUntil: quote.validUntil!,
          link: `${appBaseUrl()}/q/${token}`,
        };
        await sendMail({
          ...envelope(shop, record.customer.email),
          ...(await renderMail(expiryReminderSubject(props), createElement(ExpiryReminderEmail, props))),
        });
        return 'reminded' as const;
      });
      if (outcome === 'reminded') run.reminded.push(number);
      if (outcome === 'no-email') run.withoutEmail.push(number);
    } catch (error) {
      console.error(`[expiry-reminder] quote ${number} was not reminded; the next run tries again`, error);
      run.failed.push(number);
    }
  }
  return run;
}
