import { requireRole } from '@/lib/auth/guard';
import { idFrom, parseBody, type IdParams } from '@/lib/http/kit';
import { reviseQuote } from '@/lib/db/queries/quote-lifecycle';
import { QuoteReviseSchema } from '@/lib/schemas/quote';
import { lifecycleResponse } from '../../lifecycle-response';

export const dynamic = 'force-dynamic';

/** { version }: a new draft revision (-R2, -R3, ...) of an unpaid quote; answers 201 with the new draft. */
export async function POST(request: Request, context: IdParams) {
  const user = await requireRole(request, 'manager', 'counter');
  if (user instanceof Response) return user;
  const id = await idFrom(context, 'quote');
  if (id instanceof Response) return id;
  const body = await parseBody(request, QuoteReviseSchema);
  if (!body.ok) return body.response;
  return lifecycleResponse(await reviseQuote(id, body.value, user), user, 201);
}
