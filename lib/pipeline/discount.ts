// The discount-approval rule, named once: a proposal whose largest kit discount is above the
// sales settings' threshold may be sent only after a sales manager approved that discount
// (docs/product.md). The send check, the approval, the pipeline and the proposal page all ask here.

/** The largest kit discount is above the threshold, so it needs a manager's approval. */
export function discountAboveThreshold(maxDiscountPct: number, thresholdPct: number): boolean {
  return maxDiscountPct > thresholdPct;
}

/** The quote needs a manager's approval of its discount and does not have it yet. */
export function needsDiscountApproval(
  quote: { maxDiscountPct: number; discountApprovedAt: string | null },
  thresholdPct: number,
): boolean {
  return discountAboveThreshold(quote.maxDiscountPct, thresholdPct) && !quote.discountApprovedAt;
}
