import { Text } from '@react-email/components';
import { longDate, MailLayout, money, paragraph, PrivateLinkButton, type MailShop } from './layout';

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
      <PrivateLinkButton href={p.link}>Open your quote</PrivateLinkButton>
      <Text style={paragraph}>
        Not going ahead, or have a question? Just reply; we will not remind you again about this quote.
      </Text>
    </MailLayout>
  );
}
