import { Text } from '@react-email/components';
import { MailLayout, money, paragraph, type MailShop } from './layout';

// A full refund of the deposit: how much, and where the quote stands now (closed, or open to pay again).
export type RefundNoticeProps = {
  shop: MailShop;
  customerName: string;
  number: string;
  refundedCents: number;
  reopened: boolean;
};

export const refundNoticeSubject = (p: Pick<RefundNoticeProps, 'number'>) =>
  `Your deposit for quote ${p.number} has been refunded`;

export function RefundNoticeEmail(p: RefundNoticeProps) {
  return (
    <MailLayout shop={p.shop} preview={`We refunded ${money(p.refundedCents)}`}>
      <Text style={paragraph}>Hello {p.customerName},</Text>
      <Text style={paragraph}>
        We have refunded your deposit of {money(p.refundedCents)} for quote {p.number}. Depending on your bank it can
        take 5 to 10 working days to show on your statement.
      </Text>
      <Text style={paragraph}>
        {p.reopened
          ? 'Your quote is open again: you can pay the deposit from the link in our earlier e-mail when you are ready.'
          : 'The job is cancelled and this quote is closed. If you would like a new quote, just reply or call us.'}
      </Text>
    </MailLayout>
  );
}
