import { formatMoney } from '@/lib/format';
import type { PaymentRecord } from '@/lib/quotes/types';
import { counts, METHOD_WORDS, PURPOSE_WORDS } from '@/lib/quotes/balance';
import { PaymentStatusTag } from './status';

// Every payment on a quote in words: deposit or balance, how it was paid, who took it at the counter,
// and a receipt for each that took money. Provider ids stay in the database and the audit log.
export function PaymentList({
  payments,
  receiptHref,
}: {
  payments: PaymentRecord[];
  receiptHref: (id: number) => string;
}) {
  if (payments.length === 0)
    return (
      <p className="mt-2 text-sm">
        <PaymentStatusTag status={null} />
      </p>
    );
  return (
    <ul className="mt-2 flex flex-col gap-1 text-sm">
      {payments.map((p) => (
        <li key={p.id} className="flex flex-wrap items-center gap-2">
          <PaymentStatusTag status={p.status} />
          <span>{PURPOSE_WORDS[p.purpose]}</span>
          <span className="spec">{formatMoney(p.amountCents)}</span>
          {p.refundedCents ? <span className="spec">(refunded {formatMoney(p.refundedCents)})</span> : null}
          {p.duplicateOfPaymentId ? <span className="text-ink-muted">paid twice, given back at once</span> : null}
          <span className="text-ink-muted">
            {METHOD_WORDS[p.method]}
            {p.recordedBy ? `, taken by ${p.recordedBy.name}` : ''}
            {p.paidAt ? `, ${p.paidAt.slice(0, 16).replace('T', ' ')} UTC` : ''}
          </span>
          {counts(p) ? (
            <a className="underline" href={receiptHref(p.id)}>
              Receipt (PDF)
            </a>
          ) : null}
        </li>
      ))}
    </ul>
  );
}
