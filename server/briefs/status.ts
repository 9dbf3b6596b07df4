// The life of a brief (PRODUCT.md): draft → in review → scheduled (embargoed) → published → corrected / withdrawn.
export const briefStatuses = ["draft", "in_review", "scheduled", "published", "corrected", "withdrawn"] as const;
export type BriefStatus = (typeof briefStatuses)[number];
