import type { WriteOutcome } from '@/lib/db/write';
import { percentFromBp } from '@/lib/format';
import { HttpError } from '@/lib/http/errors';
import { invalidFields, type FieldError } from '@/lib/http/responses';
import { pendingApprovalMessage } from './discount-approval';

// The one place a quote path's refusals become answers: every function in src/lib/quotes/ throws one of
// these, and the route kit (src/lib/http/route.ts) answers it. Statuses and bodies are the API's contract.

export const noQuoteWithId = (id: number) => new HttpError(404, `No quote with id ${id}.`);

/** Any token that is not a live link: never a hint why. */
export const linkOpensNothing = () => new HttpError(404, 'This link does not open a quote.');

/** Counter staff asking for a price or kind only a manager may give: 403 naming the fields, nothing written. */
export const needsManager = (errors: FieldError[]) =>
  new HttpError(403, 'Only a manager may set these prices or kinds.', { errors });

/** The e-mail did not go, so the write it belonged to was rolled back. */
export const mailNotSent = (message: string) => new HttpError(502, message);

/** A quote whose discount waits for a manager never reaches the customer: 409 naming the pending approval. */
export const discountAwaitsApproval = (number: string, discountBp: number) =>
  new HttpError(409, pendingApprovalMessage(number, percentFromBp(discountBp)), { discountApproval: 'pending' });

/** A refusal because of where the quote (or its money) stands: 409 with whatever tells the caller why. */
export const stateRefused = (message: string, extra: Record<string, unknown> = {}) =>
  new HttpError(409, message, extra);

export const fieldsRefused = (errors: FieldError[]) => invalidFields(errors);

/** A versioned write's result: the record, or the same 404/409/422 answers every catalogue write gives. */
export function recordOrThrow<R>(outcome: WriteOutcome<R>, present: (record: R) => unknown): R {
  if (outcome.ok) return outcome.record;
  switch (outcome.reason) {
    case 'not-found':
      throw new HttpError(404, 'That quote no longer exists.');
    case 'conflict':
      throw new HttpError(
        409,
        'Someone else saved this quote after you opened it. Nothing was overwritten; review their changes and save again.',
        {
          current: outcome.current === null ? null : present(outcome.current as R),
        },
      );
    case 'invalid':
      throw invalidFields(outcome.errors);
    case 'refused':
      throw new HttpError(outcome.status, outcome.message);
  }
}
