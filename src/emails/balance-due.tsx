import { Text } from '@react-email/components';
import { MailLayout, money, paragraph, PrivateLinkButton, type MailShop } from './layout';

// The job is done: what it came to, what was paid already, what is left, and a private link to pay the
// rest online (or at the counter when the car is collected).
export type BalanceDueProps = {
  shop: MailShop;
  customerName: string;
  number: string;
  vehicleLabel: string | null;
  totalCents: number;
  paidCents: number;
  balanceCents: number;
  link: string;
};

export const balanceDueSubject = (p: Pick<BalanceDueProps, 'number' | 'shop' | 'balanceCents'>) =>
  `Your job is done: ${money(p.balanceCents)} left to pay on quote ${p.number} — ${p.shop.name}`;

export function BalanceDueEmail(p: BalanceDueProps) {
  const vehicle = p.vehicleLabel ? ` on your ${p.vehicleLabel}` : '';
  return (
    <MailLayout shop={p.shop} preview={`${money(p.balanceCents)} left to pay`}>
      <Text style={paragraph}>Hello {p.customerName},</Text>
      <Text style={paragraph}>
        The work{vehicle} is done. Quote {p.number} came to {money(p.totalCents)}; you have paid {money(p.paidCents)},
        so {money(p.balanceCents)} is left to pay.
      </Text>
      <PrivateLinkButton href={p.link}>Pay the balance</PrivateLinkButton>
      <Text style={paragraph}>
        You can also pay by card or cash when you collect the car. Your receipt and the final invoice follow by e-mail
        once it is paid.
      </Text>
    </MailLayout>
  );
}
