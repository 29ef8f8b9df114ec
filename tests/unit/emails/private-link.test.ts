import { createElement } from 'react';
import { renderToStaticMarkup } from 'react-dom/server';
import { BalanceDueEmail } from '@/emails/balance-due';
import { ExpiryReminderEmail } from '@/emails/expiry-reminder';
import { QuoteSentEmail } from '@/emails/quote-sent';

// The three e-mails that carry the customer's private link share one button (PrivateLinkButton in
// src/emails/layout.tsx): the button leads to the link, and the address is written out beside it.

const shop = { name: 'Invented Cam Shop', email: 'shop@example.com', phone: null, address: null };
const link = 'https://shop.example.com/q/invented-private-token-0123456789';
const common = { shop, customerName: 'Invented Customer', number: 'Q-TEST-0007', link };

const mails = [
  [
    'quote sent',
    createElement(QuoteSentEmail, {
      ...common,
      vehicleLabel: null,
      totalCents: 100_000,
      depositCents: 20_000,
      validUntil: null,
    }),
    'Open your quote',
  ],
  [
    'balance due',
    createElement(BalanceDueEmail, {
      ...common,
      vehicleLabel: null,
      totalCents: 100_000,
      paidCents: 20_000,
      balanceCents: 80_000,
    }),
    'Pay the balance',
  ],
  [
    'expiry reminder',
    createElement(ExpiryReminderEmail, {
      ...common,
      totalCents: 100_000,
      depositCents: 20_000,
      validUntil: '2030-01-31',
    }),
    'Open your quote',
  ],
] as const;

describe.each(mails)('the %s e-mail', (_name, element, label) => {
  it('has the button to the private link and the address written out', () => {
    // react-dom's own renderer: @react-email/render loads it through a dynamic import Jest cannot run.
    const html = renderToStaticMarkup(element);
    expect(html).toContain(`href="${link}"`);
    expect(html).toContain(label);
    expect(html).toContain(`copy this address: ${link}`);
    expect(html).toContain('This link is private to you');
  });
});
