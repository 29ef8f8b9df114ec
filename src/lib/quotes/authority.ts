// Who may set a quote line's price (pure: no database, React or Next). Counter staff sell catalogue
// items at the catalogue price and may give a discount up to the share of the job the manager set in
// the shop settings; a different price or an untaxed line that names no catalogue item needs a manager.
// A discount above that share is saved but waits for a manager's approval before the quote can be sent
// (discount-approval.ts). A manager may do each of these; the caller audits what was allowed.
import { formatMoney } from '@/lib/format';
import type { FieldError } from '@/lib/http/responses';
import { divideRoundHalfUp, lineTotalCents, type QuoteLineKind } from './pricing';

export type PricingRole = 'manager' | 'counter' | 'tech';

export type LineForAuthority = {
  kind: QuoteLineKind;
  quantity: number;
  unitPriceCents: number;
  discountCents: number;
  /** The catalogue's price for the item the line names (labour: the shop's rate); null for a free line. */
  cataloguePriceCents: number | null;
  /** The price this item already has on the quote (kept when staff edit other lines); null when new. */
  keptPriceCents: number | null;
  description: string;
};

export type Override = {
  index: number;
  description: string;
  what: 'price' | 'untaxed-free-line';
  cataloguePriceCents: number | null;
  unitPriceCents: number;
};
export type AuthorityVerdict = {
  forbidden: FieldError[];
  overrides: Override[];
  discountBp: number;
  discountOverLimit: boolean;
};

/** The discount as a share of the job before discounts, in basis points (rounded half up). */
export function discountShareBp(
  lines: readonly Pick<LineForAuthority, 'quantity' | 'unitPriceCents' | 'discountCents'>[],
): number {
  const gross = lines.reduce((s, l) => s + lineTotalCents(l.quantity, l.unitPriceCents), 0);
  const discount = lines.reduce((s, l) => s + l.discountCents, 0);
  if (discount <= 0) return 0;
  if (gross <= 0) return 10_000;
  return divideRoundHalfUp(discount * 10_000, gross);
}

export function checkPriceAuthority(
  lines: readonly LineForAuthority[],
  options: { role: PricingRole; maxCounterDiscountBp: number; field: string },
): AuthorityVerdict {
  const manager = options.role === 'manager';
  const forbidden: FieldError[] = [];
  const overrides: Override[] = [];
  lines.forEach((line, index) => {
    const at = `${options.field}.${index}`;
    if (line.cataloguePriceCents === null) {
      // A free line is taxed goods at the counter; an untaxed one could carry a cam at a labour line's tax.
      if (line.kind !== 'other') {
        if (!manager)
          forbidden.push({
            field: `${at}.kind`,
            message: `a line that names no catalogue item is "other" (taxed) for counter staff; a ${line.kind} line needs a manager`,
          });
        else
          overrides.push({
            index,
            description: line.description,
            what: 'untaxed-free-line',
            cataloguePriceCents: null,
            unitPriceCents: line.unitPriceCents,
          });
      }
      return;
    }
    const allowed = line.unitPriceCents === line.cataloguePriceCents || line.unitPriceCents === line.keptPriceCents;
    if (allowed) return;
    if (!manager) {
      forbidden.push({
        field: `${at}.unitPriceCents`,
        message: `counter staff sell at the catalogue price (${formatMoney(line.cataloguePriceCents)}); a different price needs a manager`,
      });
    } else
      overrides.push({
        index,
        description: line.description,
        what: 'price',
        cataloguePriceCents: line.cataloguePriceCents,
        unitPriceCents: line.unitPriceCents,
      });
  });
  const discountBp = discountShareBp(lines);
  // Not refused: the caller marks the quote as waiting for a manager's approval (discount-approval.ts).
  const discountOverLimit = discountBp > options.maxCounterDiscountBp;
  return { forbidden, overrides, discountBp, discountOverLimit };
}
