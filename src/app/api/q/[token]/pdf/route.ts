import { route } from '@/lib/http/route';
import { customerDocument } from '../../../quotes/document-response';
import { pdfResponse } from '../../../quotes/pdf-response';

/** The customer's PDF of their quote; the private token is the key, and anything else is a plain 404. */
export const GET = route({ permission: 'public' }, ({ params }) => customerDocument(params.token, pdfResponse));
