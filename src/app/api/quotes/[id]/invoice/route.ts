import { route } from '@/lib/http/route';
import { invoiceResponse, staffDocument } from '../../document-response';

/** Any staff member: the final invoice of a job paid in full, as a PDF (409 until it is). */
export const GET = route({ permission: 'quotes.read', ids: { id: 'quote' } }, ({ ids }) =>
  staffDocument(ids.id, invoiceResponse),
);
