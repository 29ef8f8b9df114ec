import { requireRole } from '@/lib/auth/guard';
import { idFrom, outcomeResponse, type IdParams } from '@/lib/http/kit';
import { presentQuote, sendQuote } from '@/lib/db/queries/quotes';
import { errorResponse } from '@/lib/http/responses';

export const dynamic = 'force-dynamic';

/** E-mails the customer a fresh private link; status → sent. A refused e-mail changes nothing (502). */
export async function POST(request: Request, context: IdParams) {
  const user = await requireRole(request, 'manager', 'counter');
  if (user instanceof Response) return user;
  const id = await idFrom(context, 'quote');
  if (id instanceof Response) return id;
  const outcome = await sendQuote(id, user);
  if (!outcome.ok && outcome.reason === 'mail-failed') return errorResponse(502, outcome.message);
  return outcomeResponse(outcome as Exclude<typeof outcome, { reason: 'mail-failed' }>, { label: 'quote', present: (r) => presentQuote(r, user) });
}
