'use client';

import { Banner } from '@/components/ui/banner';
import { Button } from '@/components/ui/button';
import { dateTime, percentFromBp } from '@/lib/format';
import type { QuoteRun } from './quote-run';
import type { QuoteRecord } from '@/lib/quotes/types';

// A counter discount above the shop's limit (src/lib/quotes/discount-approval.ts): everyone sees that the
// quote waits for a manager and cannot be sent; a manager approves it here. The server checks both again.
type Props = { quote: QuoteRecord; url: string; run: QuoteRun; busy: boolean; canApprove: boolean };

export function DiscountApprovalPanel({ quote, url, run, busy, canApprove }: Props) {
  const approval = quote.discountApproval;
  const share = percentFromBp(approval.discountBp);
  if (approval.state === 'pending') {
    return (
      <Banner tone="caution" title="Waiting for a manager to approve the discount">
        <p id="discount-approval-note">
          The discounts come to {share} of the job, more than counter staff may give. The quote cannot be sent to the
          customer until a manager approves the discount.
        </p>
        {canApprove ? (
          <Button
            type="button"
            variant="primary"
            className="mt-2"
            disabled={busy}
            onClick={() =>
              run(
                'Not approved',
                'POST',
                `${url}/approve-discount`,
                { version: quote.version },
                `Discount of ${share} approved; the quote can be sent.`,
              )
            }
          >
            Approve the discount
          </Button>
        ) : null}
      </Banner>
    );
  }
  if (approval.state === 'approved' && approval.approvedAt) {
    return (
      <p className="text-sm text-ink-soft">
        Discount of {share} of the job approved by {approval.approvedBy?.name ?? 'a manager'} on{' '}
        {dateTime(approval.approvedAt)}.
      </p>
    );
  }
  return null;
}
