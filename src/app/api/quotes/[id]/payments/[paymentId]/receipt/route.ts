import { requireRole } from '@/lib/auth/guard';
import { errorResponse } from '@/lib/http/responses';
import { receiptResponse, staffDocument } from '../../../../document-response';

export const dynamic = 'force-dynamic';

type Params = { params: Promise<{ id: string; paymentId: string }> };

/** Any staff member: one payment's receipt as a PDF. */
export async function GET(request: Request, context: Params) {
  const user = await requireRole(request);
  if (user instanceof Response) return user;
  const { id, paymentId } = await context.params;
  if (!/^\d{1,10}$/.test(id)) return errorResponse(404, 'No such quote.');
  if (!/^\d{1,10}$/.test(paymentId)) return errorResponse(404, 'No such payment.');
  return staffDocument(Number(id), (quote, shop) => receiptResponse(quote, Number(paymentId), shop));
}
