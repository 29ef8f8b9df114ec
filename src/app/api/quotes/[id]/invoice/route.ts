import { requireRole } from '@/lib/auth/guard';
import { idFrom, type IdParams } from '@/lib/http/kit';
import { invoiceResponse, staffDocument } from '../../document-response';

export const dynamic = 'force-dynamic';

/** Any staff member: the final invoice of a job paid in full, as a PDF (409 until it is). */
export async function GET(request: Request, context: IdParams) {
  const user = await requireRole(request);
  if (user instanceof Response) return user;
  const id = await idFrom(context, 'quote');
  if (id instanceof Response) return id;
  return staffDocument(id, invoiceResponse);
}
