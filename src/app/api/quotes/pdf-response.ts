import type { PublicQuote, QuoteRecord } from '@/lib/db/queries/quotes';
import { errorResponse } from '@/lib/http/responses';
import { quotePdf } from '@/lib/quotes/pdf';

/** The quote as a PDF download; never cached (it holds a customer's name and prices). */
export async function pdfResponse(quote: QuoteRecord, shop: PublicQuote['shop']): Promise<Response> {
  let bytes: Buffer;
  try {
    bytes = await renderPdf(quote, shop);
  } catch (error) {
    // A missing font file or a bad glyph is the server's problem; say so plainly instead of a bare 500.
    console.error(`[documents] the PDF of quote ${quote.number} could not be made`, error);
    return errorResponse(503, 'The PDF could not be made just now. Please try again, or print the quote page instead.');
  }
  // The number is Q-YYYY-NNNN(-Rn): safe in a header as it is.
  return new Response(new Uint8Array(bytes), {
    status: 200,
    headers: {
      'Content-Type': 'application/pdf',
      'Content-Disposition': `attachment; filename="quote-${quote.number}.pdf"`,
      'Cache-Control': 'no-store',
      'X-Content-Type-Options': 'nosniff',
    },
  });
}

function renderPdf(quote: QuoteRecord, shop: PublicQuote['shop']): Promise<Buffer> {
  return quotePdf({
    number: quote.number, stateWord: quote.stateWord, customerName: quote.customer.name, vehicleLabel: quote.build?.vehicleLabel ?? null,
    lines: quote.lines, subtotalCents: quote.subtotalCents, taxRateBp: quote.taxRateBp, taxCents: quote.taxCents, totalCents: quote.totalCents,
    depositCents: quote.depositCents, paidCents: quote.paidCents, refundedCents: quote.refundedCents, validUntil: quote.validUntil, sentAt: quote.sentAt,
    replacedBy: quote.replacedBy?.number ?? null, shop,
  });
}
