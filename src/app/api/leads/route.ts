import { NextResponse } from 'next/server';
import { rankForShop } from '@/lib/advisor-service';
import { requireRole } from '@/lib/auth/guard';
import { clientIp, isCrossSite } from '@/lib/auth/request-info';
import { randomToken } from '@/lib/auth/tokens';
import { paged, parseBody, parseQuery } from '@/lib/http/kit';
import { listBaselineCards } from '@/lib/db/queries/builds';
import { createLead, emissionsCertifiedIds, listLeads } from '@/lib/db/queries/leads';
import { getShopSettings } from '@/lib/db/queries/settings';
import { appBaseUrl } from '@/lib/env';
import { errorResponse } from '@/lib/http/responses';
import { customerResultEmail } from '@/lib/leads/customer-email';
import { newLeadEmail } from '@/lib/leads/email';
import { buildProfileFromAnswers, engineLiters } from '@/lib/leads/profile';
import { shortlistFrom } from '@/lib/leads/shortlist';
import { sendMail } from '@/lib/mail';
import { LeadAnswersSchema, LeadListQuerySchema } from '@/lib/schemas/lead';
import { reserveLeadPost } from '@/lib/throttle/lead-limits';

export const dynamic = 'force-dynamic';

/** Managers and counter staff: the leads, newest first, paged, optionally by ?status=. */
export async function GET(request: Request) {
  const user = await requireRole(request, 'manager', 'counter');
  if (user instanceof Response) return user;
  const query = parseQuery(request, LeadListQuerySchema);
  if (!query.ok) return query.response;
  const { items, total } = await listLeads(query.value);
  return NextResponse.json(paged(items, total, query.value.page, query.value.pageSize));
}

/**
 * Public: the questionnaire's answers. Ranks the shop's cams for a conservative build made from them,
 * stores the lead with the shortlist it shows, e-mails the shop, and answers with the shortlist and a
 * private result token (only its SHA-256 is stored).
 */
export async function POST(request: Request) {
  // No session to ride on, but another site's page must still not post leads in a visitor's name.
  if (isCrossSite(request)) return errorResponse(403, 'This request came from another site and was refused.');
  const body = await parseBody(request, LeadAnswersSchema);
  if (!body.ok) return body.response;
  const answers = body.value;

  // A filled honeypot is a robot: it gets an answer that looks like success, but no lead, no e-mail, no count.
  if (answers.website) {
    const token = randomToken();
    return NextResponse.json({ id: 0, token, resultUrl: `/ask/result/${token}`, shortlist: { entries: [], notice: '' }, shopNotified: true }, { status: 201, headers: { 'Cache-Control': 'no-store' } });
  }

  const reservation = await reserveLeadPost(answers, clientIp(request.headers));
  if (!reservation.ok) {
    const message =
      reservation.reason === 'contact'
        ? 'We already have your answers from the last hour. The shop will contact you; there is no need to send them again.'
        : 'Many answers came from your network in the last hour. Please try again later, or call the shop.';
    return errorResponse(429, message, { retryAfterSeconds: reservation.retryAfterSeconds }, { 'Retry-After': String(reservation.retryAfterSeconds) });
  }

  const profile = buildProfileFromAnswers(answers, await listBaselineCards());
  const unavailable = async (message: string) => {
    await reservation.release();
    return errorResponse(503, message);
  };
  if (!profile) return unavailable('The shop’s catalogue is not ready for this engine yet. Please call the shop instead.');
  const ranked = await rankForShop(profile, { includeCurves: false });
  if (!ranked.ok) return unavailable('The shop’s catalogue changed while we were working. Please try again.');
  // Every ranked cam, not just the top three: when emissions rule some out, the next ones move up.
  const certified = await emissionsCertifiedIds(ranked.result.rankings.map((r) => r.camId));
  const shortlist = shortlistFrom(ranked.result, answers, engineLiters(answers), profile.use.emissionsRequired, (id) => certified.has(String(id)));

  const token = randomToken();
  const lead = await createLead(answers, shortlist, token, clientIp(request.headers));

  // After the commit: a lead is never lost because the mail service is away; the leads page has it.
  const settings = await getShopSettings();
  let shopNotified = false;
  if (settings?.email) {
    try {
      await sendMail({ to: settings.email, ...newLeadEmail({ leadId: lead.id, answers, shortlist, leadsUrl: `${appBaseUrl()}/leads` }), replyTo: answers.email });
      shopNotified = true;
    } catch (error) {
      console.error(`lead ${lead.id}: the shop e-mail was not sent:`, error instanceof Error ? error.message : error);
    }
  }

  // The customer's own copy of the private link, also after the commit: a refused e-mail loses nothing.
  let customerNotified = false;
  if (answers.email) {
    try {
      const shop = settings ? { name: settings.name, phone: settings.phone, email: settings.email } : null;
      await sendMail({ to: answers.email, ...customerResultEmail({ name: answers.name, resultUrl: `${appBaseUrl()}/ask/result/${token}`, shop }), replyTo: settings?.email || undefined });
      customerNotified = true;
    } catch (error) {
      console.error(`lead ${lead.id}: the customer's copy was not sent:`, error instanceof Error ? error.message : error);
    }
  }

  return NextResponse.json(
    { id: lead.id, token, resultUrl: `/ask/result/${token}`, shortlist, shopNotified, customerNotified },
    { status: 201, headers: { 'Cache-Control': 'no-store' } },
  );
}
