import 'server-only';
import type { Transaction } from 'sequelize';
import type { SessionUser } from '@/lib/auth/guard';
import { invalid } from '@/lib/db/write';
import type { FieldError } from '@/lib/http/responses';
import { checkPriceAuthority, type AuthorityVerdict } from '@/lib/quotes/authority';
import type { JobLine } from '@/lib/quotes/job-price';
import { lineTotalCents, type QuoteLineKind } from '@/lib/quotes/pricing';
import type { QuoteLineInput } from '@/lib/schemas/quote';
import { Cam, LaborOperation, Part } from '../models';

// Staff-typed quote lines, checked against the catalogue: a line that names a cam, part or labour
// operation takes its kind from it (so tax follows the item) and, unless a manager says otherwise,
// its price. Who may price differently is decided in src/lib/quotes/authority.ts.

/** A line ready to write: the same shape the job-price function builds a drafted quote's lines in. */
export type LineDraft = JobLine;

/** Counter staff asked for a price or kind only a manager may give: answered 403 naming the fields. */
export class PriceAuthorityRefused extends Error {
  constructor(readonly errors: FieldError[]) {
    super('price authority refused');
  }
}

/** "cam:13", "part:5", "labor:1": the catalogue item a line names, for keeping a price already on the quote. */
export const catalogueKey = (l: { camId: number | null; partId: number | null; laborOperationId: number | null }) =>
  l.camId
    ? `cam:${l.camId}`
    : l.partId
      ? `part:${l.partId}`
      : l.laborOperationId
        ? `labor:${l.laborOperationId}`
        : null;

type CatalogueItem = { kind: QuoteLineKind; priceCents: number; description: string; hours: number | null };

async function catalogueItem(
  input: QuoteLineInput,
  at: string,
  laborRateCents: number,
  t: Transaction,
  errors: FieldError[],
): Promise<CatalogueItem | null> {
  if (input.partId) {
    const part = await Part.findByPk(input.partId, { transaction: t });
    if (!part)
      return (errors.push({ field: `${at}.partId`, message: `there is no part with id ${input.partId}` }), null);
    return {
      kind: part.category === 'tune' ? 'tune' : 'part',
      priceCents: part.priceCents,
      description: `${part.sku} ${part.name}`,
      hours: null,
    };
  }
  if (input.camId) {
    const cam = await Cam.findByPk(input.camId, { transaction: t });
    if (!cam) return (errors.push({ field: `${at}.camId`, message: `there is no cam with id ${input.camId}` }), null);
    return { kind: 'cam', priceCents: cam.priceCents, description: `${cam.sku} ${cam.name}`, hours: null };
  }
  if (input.laborOperationId) {
    const op = await LaborOperation.findByPk(input.laborOperationId, { transaction: t });
    if (!op)
      return (
        errors.push({
          field: `${at}.laborOperationId`,
          message: `there is no labour operation with id ${input.laborOperationId}`,
        }),
        null
      );
    return { kind: 'labor', priceCents: laborRateCents, description: op.name, hours: Number(op.hours) };
  }
  return null;
}

export type ResolveOptions = {
  field: string;
  laborRateCents: number;
  maxCounterDiscountBp: number;
  user: SessionUser;
  kept?: ReadonlyMap<string, number>;
};

/**
 * Lines with catalogue references filled in. Bad input answers 422 (invalid); a price or kind the user's
 * role may not give throws PriceAuthorityRefused. The verdict lists what a manager allowed and whether the
 * discount is above the counter limit (the caller decides its approval).
 */
export async function resolveLines(
  inputs: readonly QuoteLineInput[],
  options: ResolveOptions,
  t: Transaction,
): Promise<{ lines: LineDraft[]; verdict: AuthorityVerdict }> {
  const errors: FieldError[] = [];
  const out: (LineDraft & { cataloguePriceCents: number | null; keptPriceCents: number | null })[] = [];
  for (const [i, input] of inputs.entries()) {
    const at = `${options.field}.${i}`;
    const refs = [input.camId, input.partId, input.laborOperationId].filter(Boolean).length;
    if (refs > 1) {
      errors.push({
        field: at,
        message: 'a line names one catalogue item at most (camId, partId or laborOperationId)',
      });
      continue;
    }
    const item = await catalogueItem(input, at, options.laborRateCents, t, errors);
    if (refs && !item) continue;
    if (item && input.kind !== item.kind) {
      errors.push({
        field: `${at}.kind`,
        message: `kind follows the catalogue item: ${item.description} is a ${item.kind} line, not ${input.kind}`,
      });
      continue;
    }
    const description = input.description ?? item?.description;
    const unitPriceCents = input.unitPriceCents ?? item?.priceCents;
    const quantity = input.quantity ?? item?.hours ?? 1;
    if (description === undefined)
      errors.push({
        field: `${at}.description`,
        message: 'description is required for a line that names no catalogue item',
      });
    if (unitPriceCents === undefined)
      errors.push({
        field: `${at}.unitPriceCents`,
        message: 'unitPriceCents is required for a line that names no catalogue item',
      });
    if (description === undefined || unitPriceCents === undefined) continue;
    const discountCents = input.discountCents ?? 0;
    const gross = lineTotalCents(quantity, unitPriceCents);
    if (discountCents > gross) {
      errors.push({
        field: `${at}.discountCents`,
        message: `a discount cannot be more than the line itself (${gross} cents)`,
      });
      continue;
    }
    const ref = {
      camId: input.camId ?? null,
      partId: input.partId ?? null,
      laborOperationId: input.laborOperationId ?? null,
    };
    const key = catalogueKey(ref);
    out.push({
      kind: input.kind,
      ...ref,
      description,
      quantity,
      unitPriceCents,
      discountCents,
      cataloguePriceCents: item?.priceCents ?? null,
      keptPriceCents: key ? (options.kept?.get(key) ?? null) : null,
    });
  }
  if (errors.length) throw invalid(errors);
  const verdict = checkPriceAuthority(out, {
    role: options.user.role,
    maxCounterDiscountBp: options.maxCounterDiscountBp,
    field: options.field,
  });
  if (verdict.forbidden.length) throw new PriceAuthorityRefused(verdict.forbidden);
  return {
    lines: out.map(({ cataloguePriceCents: _c, keptPriceCents: _k, ...line }) => (void _c, void _k, line)),
    verdict,
  };
}
