import { requireRole } from '@/lib/auth/guard';
import { idFrom, type IdParams } from '@/lib/catalogue/http';
import { getQuote, shopForDocuments } from '@/lib/db/queries/quotes';
import { errorResponse } from '@/lib/http/responses';
import { pdfResponse } from '../../pdf-response';

export const dynamic = 'force-dynamic';

/** Any staff member: the quote as the customer sees it (no costs or margins), as a PDF. */
export async function GET(request: Request, context: IdParams) {
  const user = await requireRole(request);
  if (user instanceof Response) return user;
  const id = await idFrom(context, 'quote');
  if (id instanceof Response) return id;
  const [quote, shop] = await Promise.all([getQuote(id), shopForDocuments()]);
  if (!quote) return errorResponse(404, `No quote with id ${id}.`);
  if (!shop) return errorResponse(409, 'The shop settings are missing; a manager has to fill them in before documents can be made.');
  return pdfResponse(quote, shop);
}
