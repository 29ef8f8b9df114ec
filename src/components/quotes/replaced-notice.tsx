// On the customer's page of a quote that was revised: which quote replaced it and how to reach it. The
// newer link cannot be shown here (only its hash is kept), so the page says where it was sent.
type Props = {
  replacedBy: { number: string; status: string; sentAt: string | null } | null;
  shop: { name: string; phone: string; email: string };
  customerEmail: string | null;
};

export function ReplacedNotice({ replacedBy, shop, customerEmail }: Props) {
  const sent = replacedBy && replacedBy.status !== 'draft' && replacedBy.sentAt;
  return (
    <div role="status" className="mt-6 rounded-lg border-2 border-gauge-500 bg-gauge-100 p-4">
      <p className="text-xl font-semibold">
        This quote was replaced by a newer quote{replacedBy ? ` (${replacedBy.number})` : ''}.
      </p>
      <p className="mt-1 text-base">
        {sent
          ? `We e-mailed the newer quote${customerEmail ? ` to ${customerEmail}` : ''}; open it from the link in that e-mail. This one can no longer be paid.`
          : `${shop.name} is finishing the newer quote and will e-mail you its link${customerEmail ? ` at ${customerEmail}` : ''}. This one can no longer be paid.`}{' '}
        Can’t find it? Call {shop.phone}
        {shop.email ? ` or write to ${shop.email}` : ''} and we will send it again.
      </p>
    </div>
  );
}
