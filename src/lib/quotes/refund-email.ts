// The e-mail a customer gets when their deposit is refunded in full: how much, and where the quote
// stands now (closed, or open to pay again). Plain words; the same escaping as the quote e-mail.
type RefundForMail = { number: string; customer: { name: string }; refundedCents: number; reopened: boolean };

const money = (cents: number) => (cents / 100).toLocaleString('en-US', { style: 'currency', currency: 'USD' });
const escape = (s: string) => s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

export function refundEmail({ refund, shopName }: { refund: RefundForMail; shopName: string }): { subject: string; text: string; html: string } {
  const subject = `Your deposit for quote ${refund.number} has been refunded`;
  const state = refund.reopened
    ? 'Your quote is open again: you can pay the deposit from the link in our earlier e-mail when you are ready.'
    : 'The job is cancelled and this quote is closed. If you would like a new quote, just reply or call us.';
  const timing = 'Depending on your bank it can take 5 to 10 working days to show on your statement.';
  const text = [`Hello ${refund.customer.name},`, '', `We have refunded your deposit of ${money(refund.refundedCents)} for quote ${refund.number}.`, timing, '', state, '', shopName].join('\n');
  const html = `<p>Hello ${escape(refund.customer.name)},</p>
<p>We have refunded your deposit of <strong>${money(refund.refundedCents)}</strong> for quote ${escape(refund.number)}. ${escape(timing)}</p>
<p>${escape(state)}</p>
<p>${escape(shopName)}</p>`;
  return { subject, text, html };
}
