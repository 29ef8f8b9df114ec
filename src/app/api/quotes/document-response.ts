import { getQuote, getQuoteByToken, shopForDocuments, type PublicQuote, type QuoteRecord } from '@/lib/db/queries/quotes';
import { errorResponse } from '@/lib/http/responses';
import { counts, invoiceNumber, receiptNumber } from '@/lib/quotes/balance';
import { invoicePdf, receiptPdf } from '@/lib/quotes/payment-pdf';

// A payment's receipt or the final invoice as a PDF download, for staff and for the customer's link.
// A payment that took no money has no receipt (404); a job not yet paid in full has no invoice (409).

function pdf(bytes: Buffer, filename: string): Response {
  return new Response(new Uint8Array(bytes), {
    status: 200,
    headers: { 'Content-Type': 'application/pdf', 'Content-Disposition': `attachment; filename="${filename}"`, 'Cache-Control': 'no-store', 'X-Content-Type-Options': 'nosniff' },
  });
}

async function made(make: () => Promise<Buffer>, what: string, filename: string): Promise<Response> {
  try {
    return pdf(await make(), filename);
  } catch (error) {
    console.error(`[documents] ${what} could not be made`, error);
    return errorResponse(503, 'The PDF could not be made just now. Please try again in a moment.');
  }
}

export function receiptResponse(quote: QuoteRecord, paymentId: number, shop: PublicQuote['shop']): Promise<Response> | Response {
  const payment = quote.payments.find((p) => p.id === paymentId);
  if (!payment || !counts(payment)) return errorResponse(404, `Quote ${quote.number} has no payment ${paymentId} that took money.`);
  const number = receiptNumber(quote.number, paymentId);
  return made(() => receiptPdf(quote, paymentId, shop), `receipt ${number}`, `receipt-${number}.pdf`);
}

export function invoiceResponse(quote: QuoteRecord, shop: PublicQuote['shop']): Promise<Response> | Response {
  if (quote.status !== 'closed' || quote.balanceDueCents > 0) {
    return errorResponse(409, `Quote ${quote.number} is not paid in full yet (${(quote.balanceDueCents / 100).toFixed(2)} dollars left); the final invoice is made once it is.`, { state: { status: quote.status, balanceDueCents: quote.balanceDueCents } });
  }
  const number = invoiceNumber(quote.number);
  return made(() => invoicePdf(quote, shop), `invoice ${number}`, `invoice-${number}.pdf`);
}

type Make = (quote: QuoteRecord, shop: PublicQuote['shop']) => Promise<Response> | Response;

/** A staff document of quote `id`: 404 for no such quote, 409 until the shop's details are filled in. */
export async function staffDocument(id: number, make: Make): Promise<Response> {
  const [quote, shop] = await Promise.all([getQuote(id), shopForDocuments()]);
  if (!quote) return errorResponse(404, `No quote with id ${id}.`);
  if (!shop) return errorResponse(409, 'The shop settings are missing; a manager has to fill them in before documents can be made.');
  return make(quote, shop);
}

/** A customer's document through their private link; any token that is not a live link is a plain 404. */
export async function customerDocument(token: string, make: Make): Promise<Response> {
  const found = await getQuoteByToken(token);
  if (!found) return errorResponse(404, 'This link does not open a quote.');
  return make(found.quote, found.shop);
}
