import { Text } from '@react-email/components';
import { METHOD_WORDS, type PaymentMethod } from '@/lib/quotes/balance';
import { longDate, MailLayout, money, paragraph, type MailShop } from './layout';

// The receipt for a payment towards the balance, online or at the counter. Paid in full, it says so and
// the final invoice travels with it; otherwise it says what is still left.
export type BalanceReceiptProps = {
  shop: MailShop;
  customerName: string;
  number: string;
  amountCents: number;
  method: PaymentMethod;
  paidAt: string;
  balanceDueCents: number;
};

export const balanceReceiptSubject = (p: Pick<BalanceReceiptProps, 'number' | 'shop' | 'balanceDueCents'>) =>
  p.balanceDueCents === 0
    ? `Paid in full: quote ${p.number} — ${p.shop.name}`
    : `Payment received for quote ${p.number} — ${p.shop.name}`;

export function BalanceReceiptEmail(p: BalanceReceiptProps) {
  return (
    <MailLayout shop={p.shop} preview={`We received ${money(p.amountCents)}`}>
      <Text style={paragraph}>Hello {p.customerName},</Text>
      <Text style={paragraph}>
        Thank you: we received {money(p.amountCents)} towards quote {p.number} on {longDate(p.paidAt)} (
        {METHOD_WORDS[p.method].toLowerCase()}).
      </Text>
      <Text style={paragraph}>
        {p.balanceDueCents === 0
          ? 'The job is paid in full. Your receipt and the final invoice are attached as PDFs.'
          : `${money(p.balanceDueCents)} is still left to pay. Your receipt is attached as a PDF.`}
      </Text>
      <Text style={paragraph}>Questions? Just reply.</Text>
    </MailLayout>
  );
}
