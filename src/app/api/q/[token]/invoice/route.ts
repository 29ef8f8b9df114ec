import { customerDocument, invoiceResponse } from '../../../quotes/document-response';

export const dynamic = 'force-dynamic';

type TokenParams = { params: Promise<{ token: string }> };

/** The customer's final invoice once the job is paid in full; any other token is a plain 404. */
export async function GET(_request: Request, context: TokenParams) {
  const { token } = await context.params;
  return customerDocument(token, invoiceResponse);
}
