import type { Transaction } from 'sequelize';
import { rankForShop } from '@/lib/ranking/rank-for-shop';
import { recordAudit } from '@/lib/audit';
import type { SessionUser } from '@/lib/auth/guard';
import { conflict, invalid, notFound, refused, runWrite, type WriteOutcome } from '@/lib/db/write';
import {
  type DiscountFields,
  draftSources,
  getQuote,
  insertDraft,
  lockQuote,
  shopSettingsRow,
  writeLines,
} from '@/lib/db/queries/quotes';
import { presentQuote } from './present';
import { writeQuoteTerms, type LinesTerms } from '@/lib/db/queries/quote-writes';
import { catalogueKey, PriceAuthorityRefused, resolveLines, type LineDraft } from '@/lib/db/queries/quote-lines';
import type { FieldError } from '@/lib/http/responses';
import { BuildProfileSchema } from '@/lib/schemas/build-profile';
import type { QuoteLineInput } from '@/lib/schemas/quote';
import { discountShareBp, type AuthorityVerdict } from './authority';
import { approvalAfterSave, type DiscountApprovalState } from './discount-approval';
import { jobLines } from './job-price';
import { stateWord } from './lifecycle';
import { quoteTotals } from './pricing';
import { fieldsRefused, needsManager, recordOrThrow } from './refusals';
import type { QuoteRecord } from './types';

// Drafting a quote: made from a saved build and a chosen cam (the advisor's needed items and the labour
// priced by the same job-price function the shortlist uses), then edited while it is a draft. Lines are
// checked against the catalogue and the user's price authority; every write runs in one transaction.

export type CreateQuoteInput = { buildId: number; camId: number; extraLines?: QuoteLineInput[] };
export type QuotePatch = { version: number; lines?: QuoteLineInput[]; validUntil?: string | null };

/** Runs a write; a price only a manager may give becomes the 403 that names its fields. */
async function withPriceAuthority(write: () => Promise<WriteOutcome<QuoteRecord>>): Promise<WriteOutcome<QuoteRecord>> {
  try {
    return await write();
  } catch (error) {
    if (error instanceof PriceAuthorityRefused) throw needsManager(error.errors);
    throw error;
  }
}

/**
 * Where the discount of lines just saved stands: within the counter limit, waiting for a manager, or
 * approved (by this manager, or kept from a manager's earlier approval of at least this share).
 */
function discountAfterSave(
  lines: readonly LineDraft[],
  limitBp: number,
  user: SessionUser,
  before: { fields: DiscountFields; discountBp: number } | null,
): DiscountFields {
  const discountBp = discountShareBp(lines);
  const state: DiscountApprovalState = approvalAfterSave({
    byManager: user.role === 'manager',
    overLimit: discountBp > limitBp,
    discountBp,
    before: before && { state: before.fields.discountApproval, discountBp: before.discountBp },
  });
  if (state !== 'approved')
    return { discountApproval: state, discountApprovedByUserId: null, discountApprovedAt: null };
  if (user.role !== 'manager' && before) return before.fields;
  return { discountApproval: 'approved', discountApprovedByUserId: user.id, discountApprovedAt: new Date() };
}

/** What a manager allowed beyond the counter's authority, one audit row each; a discount over the limit either way. */
async function auditAuthority(
  verdict: AuthorityVerdict,
  discount: { limitBp: number; bp: number; approval: DiscountApprovalState },
  user: SessionUser,
  quoteId: number,
  t: Transaction,
) {
  if (verdict.overrides.length) {
    await recordAudit(
      {
        user,
        action: 'quote.price-override',
        entityType: 'quote',
        entityId: quoteId,
        after: { overrides: verdict.overrides },
      },
      t,
    );
  }
  if (discount.bp > discount.limitBp) {
    await recordAudit(
      {
        user,
        action: 'quote.discount-over-limit',
        entityType: 'quote',
        entityId: quoteId,
        after: { discountBp: discount.bp, counterLimitBp: discount.limitBp, approval: discount.approval },
      },
      t,
    );
  }
}

async function requiredSettings(t: Transaction) {
  const settings = await shopSettingsRow(t);
  if (!settings)
    throw refused('The shop settings are missing; a manager has to set the labour rate, tax and deposit first.');
  return settings;
}

const policyOf = (s: { depositPercentBp: number; depositMinCents: number; depositMaxCents: number }) => ({
  percentBp: s.depositPercentBp,
  minCents: s.depositMinCents,
  maxCents: s.depositMaxCents,
});

/** A draft from a saved build and a chosen cam: the cam, what the need rules add, the staff's extra lines. */
export async function createQuoteFromBuild(input: CreateQuoteInput, user: SessionUser): Promise<QuoteRecord> {
  const { build, cam } = await draftSources(input.buildId, input.camId);
  const errors: FieldError[] = [];
  if (!build) errors.push({ field: 'buildId', message: `there is no build with id ${input.buildId}` });
  if (!cam) errors.push({ field: 'camId', message: `there is no cam with id ${input.camId}` });
  else if (cam.isFactoryBaseline)
    errors.push({ field: 'camId', message: 'a factory baseline card is a reference, not a cam the shop sells' });
  if (errors.length || !build || !cam) throw fieldsRefused(errors);
  const profile = BuildProfileSchema.safeParse(build.profile);
  if (!profile.success)
    throw fieldsRefused([{ field: 'buildId', message: 'the saved build is incomplete; finish the interview first' }]);
  const ranked = await rankForShop(profile.data, { camIds: [cam.id], includeCurves: false });
  const ranking = ranked.ok ? ranked.result.rankings.find((r) => String(r.camId) === String(cam.id)) : undefined;
  if (!ranking)
    throw fieldsRefused([{ field: 'camId', message: 'the advisor could not rank this cam for this build' }]);

  for (let attempt = 0; ; attempt++) {
    const outcome = await withPriceAuthority(() =>
      runWrite(
        async (t) => {
          const settings = await requiredSettings(t);
          // The very lines the shortlist priced (jobLines), so the draft's pre-tax total is its job price.
          const lines: LineDraft[] = jobLines(
            { id: cam.id, description: `${cam.sku} ${cam.name}`, priceCents: cam.priceCents },
            ranking.neededItems,
            settings.laborRateCents,
          );
          const extra = await resolveLines(
            input.extraLines ?? [],
            {
              field: 'extraLines',
              laborRateCents: settings.laborRateCents,
              maxCounterDiscountBp: settings.maxCounterDiscountBp,
              user,
            },
            t,
          );
          lines.push(...extra.lines);
          const totals = quoteTotals(lines, settings.taxRateBp, policyOf(settings));
          // The limit is a share of the whole job, so the drafted lines count as well as the extra ones.
          const discount = discountAfterSave(lines, settings.maxCounterDiscountBp, user, null);
          const id = await insertDraft(
            {
              customerId: build.customerId,
              buildId: build.id,
              camId: cam.id,
              createdByUserId: user.id,
              totals,
              discount,
            },
            lines,
            t,
          );
          const record = (await getQuote(id, t))!;
          await recordAudit(
            {
              user,
              action: 'quote.created',
              entityType: 'quote',
              entityId: id,
              before: null,
              after: { number: record.number, totalCents: record.totalCents },
            },
            t,
          );
          const discountBp = discountShareBp(lines);
          await auditAuthority(
            extra.verdict,
            { limitBp: settings.maxCounterDiscountBp, bp: discountBp, approval: discount.discountApproval },
            user,
            id,
            t,
          );
          return { record };
        },
        { uniqueFields: { number: 'number' } },
      ),
    );
    // Two creators racing for the same number: the loser tries again with the next one.
    const numberClash = !outcome.ok && outcome.reason === 'invalid' && outcome.errors.some((e) => e.field === 'number');
    if (!numberClash || attempt >= 3) return recordOrThrow(outcome, (r) => presentQuote(r, user));
  }
}

/** Lines (replaced as a whole) and the validity date, while the quote is a draft; totals follow. */
export async function updateQuote(id: number, patch: QuotePatch, user: SessionUser): Promise<QuoteRecord> {
  const outcome = await withPriceAuthority(() =>
    runWrite(
      async (t) => {
        const quote = await lockQuote(id, t);
        if (!quote) throw notFound();
        if (quote.version !== patch.version) throw conflict(await getQuote(id, t));
        // Lines change only on a draft (a sent quote is revised instead); the valid-until day may be moved
        // while the customer can still act on the quote.
        if (patch.lines && quote.status !== 'draft')
          throw refused(
            `Quote ${quote.number} is ${stateWord(quote.status).toLowerCase()}; only a draft's lines can be changed. Revise it for new lines.`,
          );
        if (!['draft', 'sent', 'accepted'].includes(quote.status))
          throw refused(
            `Quote ${quote.number} is ${stateWord(quote.status).toLowerCase()} and can no longer be changed.`,
          );
        if (
          patch.validUntil !== undefined &&
          quote.status !== 'draft' &&
          (patch.validUntil === null || patch.validUntil < new Date().toISOString().slice(0, 10))
        ) {
          throw invalid([{ field: 'validUntil', message: 'a sent quote needs a valid-until day of today or later' }]);
        }
        const before = await getQuote(id, t);
        const settings = await requiredSettings(t);
        let newLines: LinesTerms | undefined;
        if (patch.lines) {
          // A price already on the quote (a manager's, or last month's catalogue price) may stay as it is.
          const kept = new Map<string, number>();
          for (const l of before?.lines ?? []) {
            const key = catalogueKey(l);
            if (key) kept.set(key, l.unitPriceCents);
          }
          const { lines, verdict } = await resolveLines(
            patch.lines,
            {
              field: 'lines',
              laborRateCents: settings.laborRateCents,
              maxCounterDiscountBp: settings.maxCounterDiscountBp,
              user,
              kept,
            },
            t,
          );
          await writeLines(id, lines, t);
          const discount = discountAfterSave(lines, settings.maxCounterDiscountBp, user, {
            fields: {
              discountApproval: quote.discountApproval,
              discountApprovedByUserId: quote.discountApprovedByUserId,
              discountApprovedAt: quote.discountApprovedAt,
            },
            discountBp: before?.discountApproval.discountBp ?? 0,
          });
          await auditAuthority(
            verdict,
            { limitBp: settings.maxCounterDiscountBp, bp: discountShareBp(lines), approval: discount.discountApproval },
            user,
            id,
            t,
          );
          newLines = { totals: quoteTotals(lines, quote.taxRateBp, policyOf(settings)), discount };
        }
        const written = await writeQuoteTerms(quote, { lines: newLines, validUntil: patch.validUntil }, t);
        if (!written) return { record: before!, changed: false };
        const after = (await getQuote(id, t))!;
        await recordAudit(
          {
            user,
            action: 'quote.updated',
            entityType: 'quote',
            entityId: id,
            before: {
              totalCents: before?.totalCents,
              validUntil: before?.validUntil,
              discountApproval: before?.discountApproval.state,
            },
            after: {
              totalCents: after.totalCents,
              validUntil: after.validUntil,
              discountApproval: after.discountApproval.state,
            },
          },
          t,
        );
        return { record: after };
      },
      { reload: () => getQuote(id) },
    ),
  );
  return recordOrThrow(outcome, (r) => presentQuote(r, user));
}
