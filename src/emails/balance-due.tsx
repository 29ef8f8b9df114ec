import { Button, Text } from '@react-email/components';
import { palette } from '@/lib/palette';
import { MailLayout, money, paragraph, type MailShop } from './layout';

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
      <Button
        href={p.link}
        style={{
          backgroundColor: palette.ember[600],
          color: palette.paper.raised,
          padding: '12px 18px',
          borderRadius: '6px',
          fontWeight: 700,
        }}
      >
        Pay the balance
      </Button>
      <Text style={paragraph}>
        This link is private to you; please do not share it. If the button does not work, copy this address: {p.link}
      </Text>
      <Text style={paragraph}>
        You can also pay by card or cash when you collect the car. Your receipt and the final invoice follow by e-mail
        once it is paid.
      </Text>
    </MailLayout>
  );
}
