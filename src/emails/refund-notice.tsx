import { Text } from '@react-email/components';
import type { PaymentPurpose } from '@/lib/quotes/balance';
import { MailLayout, money, paragraph, type MailShop } from './layout';

// A refund of the deposit or of a balance payment: how much, and where the quote stands now (the job still
// booked, cancelled, open to pay again, owing a balance, or paid in full).
export type RefundStanding = 'booked' | 'cancelled' | 'reopened' | 'paid-in-full';

export type RefundNoticeProps = {
  shop: MailShop;
  customerName: string;
  number: string;
  refundedCents: number;
  purpose: PaymentPurpose;
  /** Money taken at the counter is handed back there, not through the card. */
  atCounter: boolean;
  standing: RefundStanding;
  balanceDueCents: number;
};

const WHAT: Record<PaymentPurpose, string> = { deposit: 'deposit', balance: 'balance payment' };

export const refundNoticeSubject = (p: Pick<RefundNoticeProps, 'number' | 'purpose'>) =>
  `Your ${WHAT[p.purpose]} for quote ${p.number} has been refunded`;

function standingText(p: RefundNoticeProps): string {
  switch (p.standing) {
    case 'cancelled':
      return 'The job is cancelled and this quote is closed. If you would like a new quote, just reply or call us.';
    case 'reopened':
      return 'Your quote is open again: you can pay the deposit from the link in our earlier e-mail when you are ready.';
    case 'paid-in-full':
      return 'Nothing is left to pay on this job.';
    case 'booked':
      return p.balanceDueCents > 0 && p.purpose === 'balance'
        ? `${money(p.balanceDueCents)} is now left to pay on the job; we will be in touch about it.`
        : 'Your job stays booked; we will be in touch about the date.';
  }
}

export function RefundNoticeEmail(p: RefundNoticeProps) {
  return (
    <MailLayout shop={p.shop} preview={`We refunded ${money(p.refundedCents)}`}>
      <Text style={paragraph}>Hello {p.customerName},</Text>
      <Text style={paragraph}>
        We have refunded {money(p.refundedCents)} of your {WHAT[p.purpose]} for quote {p.number}.{' '}
        {p.atCounter
          ? 'It was handed back at the counter.'
          : 'Depending on your bank it can take 5 to 10 working days to show on your statement.'}
      </Text>
      <Text style={paragraph}>{standingText(p)}</Text>
    </MailLayout>
  );
}
