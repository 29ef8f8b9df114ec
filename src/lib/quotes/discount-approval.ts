// A manager's approval of a counter discount above the shop's limit (pure: no database, React or Next).
// Counter staff may save a quote whose discounts come to more than the limit in the shop settings; it then
// waits for a manager ('pending') and cannot be sent, so the customer never sees or pays an unapproved
// price. A manager approves it on the quote, or gives the discount themselves ('approved').

export const DISCOUNT_APPROVAL_STATES = ['none', 'pending', 'approved'] as const;
export type DiscountApprovalState = (typeof DISCOUNT_APPROVAL_STATES)[number];

/** How a quote's discount stands, as the API and the staff page read it. */
export type DiscountApproval = {
  state: DiscountApprovalState;
  /** The discounts as a share of the job before discounts (basis points), the figure the limit is about. */
  discountBp: number;
  /** Who approved and when; null unless approved. */
  approvedBy: { id: number; name: string } | null;
  approvedAt: string | null;
};

export type ApprovalAfterSave = {
  /** Who saved the lines: a manager's own discount needs nobody else's approval. */
  byManager: boolean;
  /** The saved lines' discounts are above the counter limit. */
  overLimit: boolean;
  /** The new share of the job taken off, and the one the quote had before this save. */
  discountBp: number;
  before: { state: DiscountApprovalState; discountBp: number } | null;
};

/**
 * The approval a quote has after its lines are saved. Within the limit nothing needs approving. Above it,
 * a manager's save approves it; counter staff's save waits for a manager, unless a manager already approved
 * a share at least as large (counter staff then edited other lines without raising the discount).
 */
export function approvalAfterSave(save: ApprovalAfterSave): DiscountApprovalState {
  if (!save.overLimit) return 'none';
  if (save.byManager) return 'approved';
  const before = save.before;
  if (before?.state === 'approved' && save.discountBp <= before.discountBp) return 'approved';
  return 'pending';
}

/** The 409's words when a quote waiting for discount approval is about to reach the customer. */
export function pendingApprovalMessage(number: string, discountText: string): string {
  return `Quote ${number} has a discount of ${discountText} of the job waiting for a manager's approval (pending discount approval). It cannot be sent to the customer until a manager approves the discount.`;
}
