import { requireRole } from '@/lib/auth/guard';
import { idFrom, type IdParams } from '@/lib/http/kit';
import { staffDocument } from '../../document-response';
import { pdfResponse } from '../../pdf-response';

export const dynamic = 'force-dynamic';

/** Any staff member: the quote as the customer sees it (no costs or margins), as a PDF. */
export async function GET(request: Request, context: IdParams) {
  const user = await requireRole(request);
  if (user instanceof Response) return user;
  const id = await idFrom(context, 'quote');
  if (id instanceof Response) return id;
  return staffDocument(id, pdfResponse);
}
