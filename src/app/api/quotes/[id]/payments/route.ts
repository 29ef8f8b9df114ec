import { requireRole } from '@/lib/auth/guard';
import { idFrom, parseBody, type IdParams } from '@/lib/http/kit';
import { recordCounterPayment } from '@/lib/db/queries/balance';
import { CounterPaymentSchema } from '@/lib/schemas/quote-payment';
import { balanceResponse } from '../../balance-response';

export const dynamic = 'force-dynamic';

/**
 * Managers and counter staff: money taken at the counter towards the balance, { version, amountCents,
 * method: 'cash' | 'card-present' }. 201 with the quote (closed when nothing is left to pay).
 */
export async function POST(request: Request, context: IdParams) {
  const user = await requireRole(request, 'manager', 'counter');
  if (user instanceof Response) return user;
  const id = await idFrom(context, 'quote');
  if (id instanceof Response) return id;
  const body = await parseBody(request, CounterPaymentSchema);
  if (!body.ok) return body.response;
  return balanceResponse(await recordCounterPayment(id, body.value, user), user, 201);
}
