import { createElement } from 'react';
import { Op } from 'sequelize';
import { ExpiryReminderEmail, expiryReminderSubject } from '@/emails/expiry-reminder';
import { renderMail } from '@/emails/render';
import { recordAudit } from '@/lib/audit';
import { appBaseUrl } from '@/lib/env';
import { sendMail } from '@/lib/mail';
import { addDaysUtc, todayUtc } from '@/lib/quotes/deposit-rules';
import { db, Quote, ShopSettings } from '../models';
import { addQuoteLink } from './quote-links';
import { mailShop } from './quote-notices';
import { getQuote, newQuoteToken, sha256 } from './quotes';

// The expiry reminder: one e-mail per sent quote whose valid-until day is near, with a fresh private
// link. Each quote is locked, checked again, stamped (quotes.expiry_reminded_at) and mailed in one
// transaction, so running the command twice — or on two machines at once — reminds each customer once,
// and a refused e-mail leaves the quote unstamped for the next run.

export type ReminderRun = { today: string; through: string; reminded: string[]; withoutEmail: string[]; failed: string[] };

/** Open quotes valid through today … today + withinDays (UTC days) that were never reminded. */
export async function remindExpiringQuotes(options: { now?: Date; withinDays?: number } = {}): Promise<ReminderRun> {
  db();
  const now = options.now ?? new Date();
  const today = todayUtc(now);
  const through = addDaysUtc(today, options.withinDays ?? 3);
  const due = (q: Pick<Quote, 'status' | 'validUntil' | 'expiryRemindedAt'>) =>
    (q.status === 'sent' || q.status === 'accepted') && q.expiryRemindedAt === null && q.validUntil !== null && q.validUntil >= today && q.validUntil <= through;
  const candidates = await Quote.findAll({
    where: { status: { [Op.in]: ['sent', 'accepted'] }, expiryRemindedAt: null, validUntil: { [Op.between]: [today, through] } },
    attributes: ['id', 'number'],
    order: [['validUntil', 'ASC'], ['id', 'ASC']],
  });
  const run: ReminderRun = { today, through, reminded: [], withoutEmail: [], failed: [] };
  for (const { id, number } of candidates) {
    try {
      const outcome = await db().transaction(async (t) => {
        const quote = await Quote.findByPk(id, { transaction: t, lock: t.LOCK.UPDATE });
        if (!quote || !due(quote)) return 'skipped' as const;
        const record = (await getQuote(id, t))!;
        if (!record.customer.email) return 'no-email' as const;
        const token = newQuoteToken();
        await addQuoteLink(id, sha256(token), 'reminder', t);
        // A plain UPDATE: the reminder must not move the quote's version under a colleague's open page.
        await Quote.update({ expiryRemindedAt: now }, { where: { id }, transaction: t, silent: true });
        await recordAudit({ actor: 'expiry-reminder', action: 'quote.expiry-reminded', entityType: 'quote', entityId: id, after: { to: record.customer.email, validUntil: quote.validUntil } }, t);
        const shop = mailShop(await ShopSettings.findOne({ order: [['id', 'ASC']], transaction: t }));
        const props = { shop, customerName: record.customer.name, number: record.number, totalCents: record.totalCents, depositCents: record.depositCents, validUntil: quote.validUntil!, link: `${appBaseUrl()}/q/${token}` };
        await sendMail({ to: record.customer.email, fromName: shop.name, ...(shop.email ? { replyTo: shop.email } : {}), ...(await renderMail(expiryReminderSubject(props), createElement(ExpiryReminderEmail, props))) });
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
