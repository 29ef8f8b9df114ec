import { Text } from '@react-email/components';
import { longDate, MailLayout, money, paragraph, PrivateLinkButton, type MailShop } from './layout';

// The e-mail that carries a quote's private link (also used for a revision, with `replaces` set).
export type QuoteSentProps = {
  shop: MailShop;
  customerName: string;
  number: string;
  vehicleLabel: string | null;
  totalCents: number;
  depositCents: number;
  validUntil: string | null;
  link: string;
  /** The number of the quote this one replaces, for a revised quote. */
  replaces?: string | null;
};

export function quoteSentSubject(p: Pick<QuoteSentProps, 'number' | 'shop' | 'replaces'>): string {
  return p.replaces
    ? `Your revised quote ${p.number} from ${p.shop.name} (replaces ${p.replaces})`
    : `Your quote ${p.number} from ${p.shop.name}`;
}

export function QuoteSentEmail(p: QuoteSentProps) {
  const vehicle = p.vehicleLabel ? ` for your ${p.vehicleLabel}` : '';
  return (
    <MailLayout shop={p.shop} preview={`${money(p.totalCents)} in total, ${money(p.depositCents)} deposit`}>
      <Text style={paragraph}>Hello {p.customerName},</Text>
      {p.replaces ? (
        <Text style={paragraph}>
          We have revised your quote. Quote {p.number} replaces {p.replaces}; the link to the earlier one now only says
          it was replaced.
        </Text>
      ) : null}
      <Text style={paragraph}>
        Here is your cam swap quote{vehicle}: {money(p.totalCents)} in total, with a deposit of {money(p.depositCents)}{' '}
        to book the job.
        {p.validUntil ? ` It is valid until ${longDate(p.validUntil)}.` : ''}
      </Text>
      <PrivateLinkButton href={p.link}>Open your quote</PrivateLinkButton>
      <Text style={paragraph}>
        The page shows every line, the shop’s deposit policy and the checks that go with a cam swap, before you pay
        anything.
      </Text>
    </MailLayout>
  );
}
