import { requireRole } from '@/lib/auth/guard';
import { idFrom, parseBody, type IdParams } from '@/lib/http/kit';
import { transitionQuote } from '@/lib/db/queries/quote-lifecycle';
import { QuoteTransitionSchema } from '@/lib/schemas/quote';
import { lifecycleResponse } from '../../lifecycle-response';

export const dynamic = 'force-dynamic';

/**
 * { to, version, reason? }: accepted, declined, expired, cancelled, closed (balance paid). A move the
 * lifecycle does not allow, or one that belongs to another flow (sending, paying, refunding, revising),
 * answers 409 with the current state and the moves allowed from it.
 */
export async function POST(request: Request, context: IdParams) {
  const user = await requireRole(request, 'manager', 'counter');
  if (user instanceof Response) return user;
  const id = await idFrom(context, 'quote');
  if (id instanceof Response) return id;
  const body = await parseBody(request, QuoteTransitionSchema);
  if (!body.ok) return body.response;
  return lifecycleResponse(await transitionQuote(id, body.value, user), user);
}
