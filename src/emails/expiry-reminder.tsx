import { Button, Text } from '@react-email/components';
import { palette } from '@/lib/palette';
import { longDate, MailLayout, money, paragraph, type MailShop } from './layout';

// A friendly note a few days before a sent quote runs out, with a fresh private link to it.
export type ExpiryReminderProps = {
  shop: MailShop;
  customerName: string;
  number: string;
  totalCents: number;
  depositCents: number;
  validUntil: string;
  link: string;
};

export const expiryReminderSubject = (p: Pick<ExpiryReminderProps, 'number' | 'shop' | 'validUntil'>) =>
  `Your quote ${p.number} is good until ${longDate(p.validUntil)} — ${p.shop.name}`;

export function ExpiryReminderEmail(p: ExpiryReminderProps) {
  return (
    <MailLayout shop={p.shop} preview={`Valid until ${longDate(p.validUntil)}`}>
      <Text style={paragraph}>Hello {p.customerName},</Text>
      <Text style={paragraph}>
        A short reminder: your quote {p.number} ({money(p.totalCents)} in total, {money(p.depositCents)} deposit to book
        the job) is valid until {longDate(p.validUntil)}. After that day prices and parts can change, and we would send
        you a fresh quote.
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
        Open your quote
      </Button>
      <Text style={paragraph}>
        This link is private to you; please do not share it. If the button does not work, copy this address: {p.link}
      </Text>
      <Text style={paragraph}>
        Not going ahead, or have a question? Just reply; we will not remind you again about this quote.
      </Text>
    </MailLayout>
  );
}
