import { route } from '@/lib/http/route';
import { customerDocument, invoiceResponse } from '../../../quotes/document-response';

/** The customer's final invoice once the job is paid in full; any other token is a plain 404. */
export const GET = route({ permission: 'public' }, ({ params }) => customerDocument(params.token, invoiceResponse));
