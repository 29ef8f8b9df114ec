import { Text } from '@react-email/components';
import { longDate, MailLayout, money, paragraph, type MailShop } from './layout';

// The receipt for a deposit: how much, when, and what happens next.
export type DepositReceiptProps = {
  shop: MailShop;
  customerName: string;
  number: string;
  amountCents: number;
  paidAt: string;
  totalCents: number;
};

export const depositReceiptSubject = (p: Pick<DepositReceiptProps, 'number' | 'shop'>) =>
  `Deposit received for quote ${p.number} — ${p.shop.name}`;

export function DepositReceiptEmail(p: DepositReceiptProps) {
  const balance = Math.max(0, p.totalCents - p.amountCents);
  return (
    <MailLayout shop={p.shop} preview={`We received your deposit of ${money(p.amountCents)}`}>
      <Text style={paragraph}>Hello {p.customerName},</Text>
      <Text style={paragraph}>
        Thank you: we received your deposit of {money(p.amountCents)} for quote {p.number} on {longDate(p.paidAt)}. Your
        job is booked.
      </Text>
      <Text style={paragraph}>
        What happens next: we will be in touch to agree a date for the work. The balance of {money(balance)} is paid
        when the job is done.
      </Text>
      <Text style={paragraph}>Keep this e-mail as your receipt. Questions? Just reply.</Text>
    </MailLayout>
  );
}
