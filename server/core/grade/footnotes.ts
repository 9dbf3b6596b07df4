// The footnotes of a comparison's certainty (METHODS.md §8: a reason for rating down, or for
// departing from a suggestion, is published as a footnote). Pure: one assessment in, footnotes out.
import type { Footnote } from "../snapshot/schema";
import type { ComparisonCertainty } from "./assess";

/** The reasons a comparison's certainty went down, domain by domain, as its footnotes. */
export function certaintyFootnotes(certainty: ComparisonCertainty): Footnote[] {
  const { judgement, suggestions } = certainty;
  const notes: Footnote[] = [];
  if (judgement.direct) {
    for (const [domain, downgrade] of Object.entries(judgement.direct)) {
      if (downgrade.levels === 0) continue;
      // A confirmed risk-of-bias suggestion (§13) is explained by what it was computed from.
      const because = domain === "riskOfBias" && !downgrade.reason ? (suggestions.riskOfBias?.because ?? null) : null;
      notes.push({ domainKey: `certainty.domain.${domain}`, levels: downgrade.levels, reason: downgrade.reason || null, because });
    }
  }
  if (judgement.intransitivity && judgement.intransitivity.levels > 0) {
    notes.push({ domainKey: "certainty.footnote.intransitivity", levels: judgement.intransitivity.levels, reason: judgement.intransitivity.reason, because: null });
  }
  if (judgement.indirectRating) {
    notes.push({ domainKey: "certainty.footnote.indirectSet", levels: 0, reason: judgement.indirectRating.reason, because: null });
  }
  // Without direct evidence incoherence does not apply (METHODS.md §8 step 4), whatever was recorded.
  const domains = certainty.direct === null ? (["imprecision"] as const) : (["incoherence", "imprecision"] as const);
  for (const domain of domains) {
    const decision = judgement[domain];
    if (decision && decision.levels > 0) {
      notes.push({ domainKey: `certainty.domain.${domain}`, levels: decision.levels, reason: decision.reason || null, because: decision.reason ? null : suggestions[domain].because });
    }
  }
  return notes;
}
