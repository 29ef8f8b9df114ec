import { quotePdf } from '@/lib/quotes/pdf';
import type { DocumentShop, QuoteRecord } from '@/lib/quotes/types';
import { madePdf } from './document-response';

/** The quote as a PDF download (503 in plain words when it cannot be made). */
export function pdfResponse(quote: QuoteRecord, shop: DocumentShop): Promise<Response> {
  // The number is Q-YYYY-NNNN(-Rn): safe in a header as it is.
  return madePdf(
    () => renderPdf(quote, shop),
    `the PDF of quote ${quote.number}`,
    `quote-${quote.number}.pdf`,
    'The PDF could not be made just now. Please try again, or print the quote page instead.',
  );
}

function renderPdf(quote: QuoteRecord, shop: DocumentShop): Promise<Buffer> {
  return quotePdf({
    number: quote.number,
    stateWord: quote.stateWord,
    customerName: quote.customer.name,
    vehicleLabel: quote.build?.vehicleLabel ?? null,
    lines: quote.lines,
    subtotalCents: quote.subtotalCents,
    taxRateBp: quote.taxRateBp,
    taxCents: quote.taxCents,
    totalCents: quote.totalCents,
    depositCents: quote.depositCents,
    paidCents: quote.paidCents,
    refundedCents: quote.refundedCents,
    validUntil: quote.validUntil,
    sentAt: quote.sentAt,
    replacedBy: quote.replacedBy?.number ?? null,
    shop,
  });
}
