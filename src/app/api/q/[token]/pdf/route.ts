import { customerDocument } from '../../../quotes/document-response';
import { pdfResponse } from '../../../quotes/pdf-response';

export const dynamic = 'force-dynamic';

type TokenParams = { params: Promise<{ token: string }> };

/** The customer's PDF of their quote; the private token is the key, and anything else is a plain 404. */
export async function GET(_request: Request, context: TokenParams) {
  const { token } = await context.params;
  return customerDocument(token, pdfResponse);
}
