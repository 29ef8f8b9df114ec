import { rankForShop } from '@/lib/ranking/rank-for-shop';
import { randomToken } from '@/lib/auth/tokens';
import { listBaselineCards } from '@/lib/db/queries/builds';
import { createLead, emissionsCertifiedIds } from '@/lib/db/queries/leads';
import { getShopSettings } from '@/lib/db/queries/settings';
import { appBaseUrl } from '@/lib/env';
import { HttpError } from '@/lib/http/errors';
import { sendMail } from '@/lib/mail';
import type { LeadAnswers } from '@/lib/schemas/lead';
import { reserveLeadPost } from '@/lib/throttle/lead-limits';
import { customerResultEmail } from './customer-email';
import { newLeadEmail } from './email';
import { buildProfileFromAnswers, engineLiters } from './profile';
import { shortlistFrom, type Shortlist } from './shortlist';

// The questionnaire's answers, start to finish: ranks the shop's cams for a conservative build made from
// them, stores the lead with the shortlist it shows, e-mails the shop and the customer, and gives back the
// shortlist and a private result token (only its SHA-256 is stored). Refusals throw an HttpError.

export type LeadSubmitted = {
  id: number;
  token: string;
  resultUrl: string;
  shortlist: Shortlist | { entries: []; notice: '' };
  shopNotified: boolean;
  customerNotified?: boolean;
};

export async function submitLead(answers: LeadAnswers, ip: string): Promise<LeadSubmitted> {
  // A filled honeypot is a robot: it gets an answer that looks like success, but no lead, no e-mail, no count.
  if (answers.website) {
    const token = randomToken();
    return {
      id: 0,
      token,
      resultUrl: `/ask/result/${token}`,
      shortlist: { entries: [], notice: '' },
      shopNotified: true,
    };
  }

  const reservation = await reserveLeadPost(answers, ip);
  if (!reservation.ok) {
    const message =
      reservation.reason === 'contact'
        ? 'We already have your answers from the last hour. The shop will contact you; there is no need to send them again.'
        : 'Many answers came from your network in the last hour. Please try again later, or call the shop.';
    throw new HttpError(
      429,
      message,
      { retryAfterSeconds: reservation.retryAfterSeconds },
      { 'Retry-After': String(reservation.retryAfterSeconds) },
    );
  }

  // Nothing was stored: give the reserved post back, so the visitor may try again.
  const unavailable = async (message: string) => {
    await reservation.release();
    return new HttpError(503, message);
  };
  const profile = buildProfileFromAnswers(answers, await listBaselineCards());
  if (!profile)
    throw await unavailable('The shop’s catalogue is not ready for this engine yet. Please call the shop instead.');
  const ranked = await rankForShop(profile, { includeCurves: false });
  if (!ranked.ok) throw await unavailable('The shop’s catalogue changed while we were working. Please try again.');
  // Every ranked cam, not just the top three: when emissions rule some out, the next ones move up.
  const certified = await emissionsCertifiedIds(ranked.result.rankings.map((r) => r.camId));
  const shortlist = shortlistFrom(ranked.result, answers, engineLiters(answers), profile.use.emissionsRequired, (id) =>
    certified.has(String(id)),
  );

  const token = randomToken();
  const lead = await createLead(answers, shortlist, token, ip);
  const { shopNotified, customerNotified } = await notifyAboutLead(lead.id, answers, shortlist, token);
  return { id: lead.id, token, resultUrl: `/ask/result/${token}`, shortlist, shopNotified, customerNotified };
}

/** After the commit: a lead is never lost because the mail service is away; the leads page has it. */
async function notifyAboutLead(
  leadId: number,
  answers: LeadAnswers,
  shortlist: Shortlist,
  token: string,
): Promise<{ shopNotified: boolean; customerNotified: boolean }> {
  const settings = await getShopSettings();
  let shopNotified = false;
  if (settings?.email) {
    try {
      await sendMail({
        to: settings.email,
        ...newLeadEmail({ leadId, answers, shortlist, leadsUrl: `${appBaseUrl()}/leads` }),
        replyTo: answers.email,
      });
      shopNotified = true;
    } catch (error) {
      console.error(`lead ${leadId}: the shop e-mail was not sent:`, error instanceof Error ? error.message : error);
    }
  }

  // The customer's own copy of the private link: a refused e-mail loses nothing.
  let customerNotified = false;
  if (answers.email) {
    try {
      const shop = settings ? { name: settings.name, phone: settings.phone, email: settings.email } : null;
      await sendMail({
        to: answers.email,
        ...customerResultEmail({ name: answers.name, resultUrl: `${appBaseUrl()}/ask/result/${token}`, shop }),
        replyTo: settings?.email || undefined,
      });
      customerNotified = true;
    } catch (error) {
      console.error(
        `lead ${leadId}: the customer's copy was not sent:`,
        error instanceof Error ? error.message : error,
      );
    }
  }
  return { shopNotified, customerNotified };
}
