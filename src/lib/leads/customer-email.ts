// The customer's copy of their questionnaire result: the private link (so they need not keep the page
// open), the promise that the shop will call, and the usual word that the shortlist is an estimate.
// Plain text and simple HTML; every value from the customer or the shop is escaped.
const escape = (s: string) =>
  s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

type Shop = { name: string; phone: string; email: string } | null;

export function customerResultEmail({ name, resultUrl, shop }: { name: string; resultUrl: string; shop: Shop }): {
  subject: string;
  text: string;
  html: string;
} {
  const shopName = shop?.name || 'The shop';
  const subject = `${shopName}: your cam shortlist and what happens next`;
  const call = shop?.phone ? ` If you would rather call first, the number is ${shop.phone}.` : '';
  const lines = [
    `Hello ${name},`,
    '',
    `Thank you for answering our questions. ${shopName} will contact you to check your actual engine before recommending anything.${call}`,
    '',
    'Your shortlist is here (a private link: keep this e-mail, and share the link only with people you trust):',
    resultUrl,
    '',
    'The shortlist is an estimate from your answers, not a quote. Fitting, parts and the tune come on top; the shop works out the whole job with you.',
    'Changes to a road vehicle follow local emissions rules; the shop will tell you what applies.',
  ];
  const html = `<p>Hello ${escape(name)},</p>
<p>Thank you for answering our questions. <strong>${escape(shopName)} will contact you</strong> to check your actual engine before recommending anything.${shop?.phone ? ` If you would rather call first, the number is <strong>${escape(shop.phone)}</strong>.` : ''}</p>
<p><a href="${escape(resultUrl)}">See your shortlist</a> (a private link: keep this e-mail, and share the link only with people you trust).</p>
<p>The shortlist is an estimate from your answers, not a quote. Fitting, parts and the tune come on top; the shop works out the whole job with you.
Changes to a road vehicle follow local emissions rules; the shop will tell you what applies.</p>`;
  return { subject, text: lines.join('\n'), html };
}
