import { route } from '@/lib/http/route';
import { customerDocument, receiptResponse } from '../../../../quotes/document-response';

/** The customer's receipt for one of their payments; any other token is a plain 404. */
export const GET = route({ permission: 'public', ids: { paymentId: 'payment' } }, ({ params, ids }) =>
  customerDocument(params.token, (quote, shop) => receiptResponse(quote, ids.paymentId, shop)),
);
