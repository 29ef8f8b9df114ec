import { getQuote, shopForDocuments } from '@/lib/db/queries/quotes';
import { getPublicQuote } from '@/lib/quotes/public-quote';
import { centsToText } from '@/lib/format';
import { HttpError } from '@/lib/http/errors';
import { counts, invoiceNumber, receiptNumber } from '@/lib/quotes/balance';
import { invoicePdf, receiptPdf } from '@/lib/quotes/payment-pdf';
import { linkOpensNothing, noQuoteWithId } from '@/lib/quotes/refusals';
import type { DocumentShop, QuoteRecord } from '@/lib/quotes/types';

// A payment's receipt or the final invoice as a PDF download, for staff and for the customer's link.
// A payment that took no money has no receipt (404); a job not yet paid in full has no invoice (409).

/** A PDF download; never cached (it holds a customer's name and prices). The file name is safe in a header as it is. */
export function pdfDownload(bytes: Buffer, filename: string): Response {
  return new Response(new Uint8Array(bytes), {
    status: 200,
    headers: {
      'Content-Type': 'application/pdf',
      'Content-Disposition': `attachment; filename="${filename}"`,
      'Cache-Control': 'no-store',
      'X-Content-Type-Options': 'nosniff',
    },
  });
}

/** Makes a PDF; a missing font file or a bad glyph is the server's problem, said plainly (503) instead of a bare 500. */
export async function madePdf(
  make: () => Promise<Buffer>,
  what: string,
  filename: string,
  failure = 'The PDF could not be made just now. Please try again in a moment.',
): Promise<Response> {
  let bytes: Buffer;
  try {
    bytes = await make();
  } catch (error) {
    console.error(`[documents] ${what} could not be made`, error);
    throw new HttpError(503, failure);
  }
  return pdfDownload(bytes, filename);
}

export function receiptResponse(quote: QuoteRecord, paymentId: number, shop: DocumentShop): Promise<Response> {
  const payment = quote.payments.find((p) => p.id === paymentId);
  if (!payment || !counts(payment))
    throw new HttpError(404, `Quote ${quote.number} has no payment ${paymentId} that took money.`);
  const number = receiptNumber(quote.number, paymentId);
  return madePdf(() => receiptPdf(quote, paymentId, shop), `receipt ${number}`, `receipt-${number}.pdf`);
}

export function invoiceResponse(quote: QuoteRecord, shop: DocumentShop): Promise<Response> {
  if (quote.status !== 'closed' || quote.balanceDueCents > 0) {
    throw new HttpError(
      409,
      `Quote ${quote.number} is not paid in full yet (${centsToText(quote.balanceDueCents)} dollars left); the final invoice is made once it is.`,
      { state: { status: quote.status, balanceDueCents: quote.balanceDueCents } },
    );
  }
  const number = invoiceNumber(quote.number);
  return madePdf(() => invoicePdf(quote, shop), `invoice ${number}`, `invoice-${number}.pdf`);
}

type Make = (quote: QuoteRecord, shop: DocumentShop) => Promise<Response>;

/** A staff document of quote `id`: 404 for no such quote, 409 until the shop's details are filled in. */
export async function staffDocument(id: number, make: Make): Promise<Response> {
  const [quote, shop] = await Promise.all([getQuote(id), shopForDocuments()]);
  if (!quote) throw noQuoteWithId(id);
  if (!shop)
    throw new HttpError(
      409,
      'The shop settings are missing; a manager has to fill them in before documents can be made.',
    );
  return make(quote, shop);
}

/** A customer's document through their private link; any token that is not a live link is a plain 404. */
export async function customerDocument(token: string, make: Make): Promise<Response> {
  const found = await getPublicQuote(token);
  if (!found) throw linkOpensNothing();
  return make(found.quote, found.shop);
}
