import { route } from '@/lib/http/route';
import { staffDocument } from '../../document-response';
import { pdfResponse } from '../../pdf-response';

/** Any staff member: the quote as the customer sees it (no costs or margins), as a PDF. */
export const GET = route({ permission: 'quotes.read', ids: { id: 'quote' } }, ({ ids }) =>
  staffDocument(ids.id, pdfResponse),
);
