import { requireRole } from '@/lib/auth/guard';
import { idFrom, parseBody, type IdParams } from '@/lib/http/kit';
import { requestBalance } from '@/lib/db/queries/balance';
import { BalanceRequestSchema } from '@/lib/schemas/quote-payment';
import { balanceResponse } from '../../balance-response';

export const dynamic = 'force-dynamic';

/** Managers and counter staff: e-mail the customer the balance due and a private link to pay it online. */
export async function POST(request: Request, context: IdParams) {
  const user = await requireRole(request, 'manager', 'counter');
  if (user instanceof Response) return user;
  const id = await idFrom(context, 'quote');
  if (id instanceof Response) return id;
  const body = await parseBody(request, BalanceRequestSchema);
  if (!body.ok) return body.response;
  return balanceResponse(await requestBalance(id, body.value, user), user);
}
