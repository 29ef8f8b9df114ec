// The e-mail that carries a quote's private link: plain words, the total and the deposit, no prices
// beyond what the customer's own quote page shows.
type QuoteForMail = { number: string; totalCents: number; depositCents: number; customer: { name: string }; build: { vehicleLabel: string } | null };

const money = (cents: number) => (cents / 100).toLocaleString('en-US', { style: 'currency', currency: 'USD' });
const escape = (s: string) => s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

export function quoteEmail({ quote, shopName, link }: { quote: QuoteForMail; shopName: string; link: string }): { subject: string; text: string; html: string } {
  const vehicle = quote.build ? ` for your ${quote.build.vehicleLabel}` : '';
  const subject = `Your quote ${quote.number} from ${shopName}`;
  const lines = [
    `Hello ${quote.customer.name},`,
    '',
    `Here is your cam swap quote${vehicle}: ${money(quote.totalCents)} in total, with a deposit of ${money(quote.depositCents)} to book the job.`,
    '',
    'Open your quote (this link is private to you; please do not share it):',
    link,
    '',
    'The page shows every line, the shop’s deposit policy and the checks that go with a cam swap, before you pay anything.',
    '',
    shopName,
  ];
  const html = `<p>Hello ${escape(quote.customer.name)},</p>
<p>Here is your cam swap quote${escape(vehicle)}: <strong>${money(quote.totalCents)}</strong> in total, with a deposit of <strong>${money(quote.depositCents)}</strong> to book the job.</p>
<p><a href="${escape(link)}">Open your quote</a> (this link is private to you; please do not share it).</p>
<p>The page shows every line, the shop’s deposit policy and the checks that go with a cam swap, before you pay anything.</p>
<p>${escape(shopName)}</p>`;
  return { subject, text: lines.join('\n'), html };
}
