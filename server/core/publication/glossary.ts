// The words a reader meets on a brief's pages and may not know, each with one entry on the glossary
// page (pages/glossary) and linked from its first use on a page (components/Term.tsx). The order is
// the order in which a reader meets them on a brief's page; the ids are the entries' anchors, the
// same in every language, so that a link can be cited.
export const glossaryTerms = [
  "certainty",
  "confidence-interval",
  "network-estimate",
  "direct-estimate",
  "indirect-estimate",
  "per-1000",
  "heterogeneity",
  "incoherence",
  "risk-of-bias",
  "rank-scores",
] as const;

export type GlossaryTerm = (typeof glossaryTerms)[number];
