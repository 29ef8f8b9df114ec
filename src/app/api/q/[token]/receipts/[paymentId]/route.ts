import { errorResponse } from '@/lib/http/responses';
import { customerDocument, receiptResponse } from '../../../../quotes/document-response';

export const dynamic = 'force-dynamic';

type Params = { params: Promise<{ token: string; paymentId: string }> };

/** The customer's receipt for one of their payments; any other token is a plain 404. */
export async function GET(_request: Request, context: Params) {
  const { token, paymentId } = await context.params;
  if (!/^\d{1,10}$/.test(paymentId)) return errorResponse(404, 'No such payment.');
  return customerDocument(token, (quote, shop) => receiptResponse(quote, Number(paymentId), shop));
}
