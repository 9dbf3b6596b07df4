// The life of a brief (PRODUCT.md): draft → in review → scheduled (embargoed) → published → corrected / withdrawn.
export const briefStatuses = ["draft", "in_review", "scheduled", "published", "corrected", "withdrawn"] as const;
export type BriefStatus = (typeof briefStatuses)[number];

/**
 * The steps of a review: an analyst or editor submits, an editor returns it with comments or approves
 * it; whoever submitted may recall the submission while nobody has decided on it.
 */
export const reviewDecisions = ["submitted", "returned", "approved", "recalled"] as const;
export type ReviewDecision = (typeof reviewDecisions)[number];
