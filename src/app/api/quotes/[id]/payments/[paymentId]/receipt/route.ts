import { route } from '@/lib/http/route';
import { receiptResponse, staffDocument } from '../../../../document-response';

/** Any staff member: one payment's receipt as a PDF. */
export const GET = route({ permission: 'quotes.read', ids: { id: 'quote', paymentId: 'payment' } }, ({ ids }) =>
  staffDocument(ids.id, (quote, shop) => receiptResponse(quote, ids.paymentId, shop)),
);
