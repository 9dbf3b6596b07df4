// Whether a draft may be approved and published (PRODUCT.md: nothing goes out with unrated
// comparisons against the reference or empty texts). Pure: the draft's facts in, the checklist out.
// Blocking items refuse approval and publishing; warnings must be acknowledged by the approving editor.
import { textClaims } from "./claims";
import type { ComparisonCertainty } from "../grade/assess";
import type { TreatmentGroup } from "../grade/groups";
import type { AnalysisResult } from "../nma/analyse";

export interface ReadinessItem {
  /** A message key (locales/…) naming the item; `values` are its facts. */
  key: string;
  values: Record<string, string | number>;
}

export interface Readiness {
  blocking: ReadinessItem[];
  warnings: ReadinessItem[];
}

export interface DraftFacts {
  laySummary: string;
  shortTake: string;
  /** `groups`: the conclusions a version would freeze now (null without a current analysis). */
  outcomes: { name: string; current: boolean; result: AnalysisResult | null; certainty: ComparisonCertainty[] | null; groups?: TreatmentGroup[] | null }[];
  /** Every treatment label of the data, the name readers see, and whether the analysts gave that name. */
  treatments: { label: string; named: boolean; displayName?: string }[];
}

/** I² from 50% is substantial heterogeneity (common practice; the Cochrane Handbook's rough guide, section 10.10.2). */
const substantialI2 = 0.5;
/** p < 0.05 for design inconsistency and for incoherence of a pair (METHODS.md §4, §8: the same level the suggestions use). */
const alpha = 0.05;

export function readinessOf(draft: DraftFacts): Readiness {
  const blocking: ReadinessItem[] = [];
  const warnings: ReadinessItem[] = [];
  if (draft.shortTake.trim() === "") blocking.push({ key: "readiness.noShortTake", values: {} });
  if (draft.laySummary.trim() === "") blocking.push({ key: "readiness.noSummary", values: {} });
  const unnamed = draft.treatments.filter((t) => !t.named).map((t) => t.label);
  if (unnamed.length > 0) blocking.push({ key: "readiness.unnamed", values: { count: unnamed.length, labels: unnamed.join(", ") } });
  if (draft.outcomes.length === 0) blocking.push({ key: "readiness.noOutcome", values: {} });
  for (const outcome of draft.outcomes) {
    if (!outcome.current || !outcome.result || !outcome.certainty) {
      blocking.push({ key: "readiness.noAnalysis", values: { outcome: outcome.name } });
      continue;
    }
    const { result } = outcome;
    // Comparisons against the reference drive the groups and the statements: each needs its rating.
    const unrated = outcome.certainty.filter((c) => (c.treatment === result.reference || c.comparator === result.reference) && c.network === null);
    if (unrated.length > 0) blocking.push({ key: "readiness.unrated", values: { outcome: outcome.name, count: unrated.length } });
    // Every other pair is published too, on its own page (METHODS.md §8 step 4): one without a
    // certainty reads "not assessed" there, which the approving editor must accept knowingly.
    const unratedOthers = outcome.certainty.filter((c) => c.treatment !== result.reference && c.comparator !== result.reference && c.network === null);
    if (unratedOthers.length > 0) warnings.push({ key: "readiness.unratedOthers", values: { outcome: outcome.name, count: unratedOthers.length } });
    if (result.heterogeneity.I2 >= substantialI2) warnings.push({ key: "readiness.heterogeneity", values: { outcome: outcome.name, I2: Math.round(100 * result.heterogeneity.I2) } });
    if (result.inconsistency.pBetween !== null && result.inconsistency.pBetween < alpha) {
      warnings.push({ key: "readiness.inconsistency", values: { outcome: outcome.name, p: Number(result.inconsistency.pBetween.toPrecision(2)) } });
    }
    const incoherent = result.comparisons.filter((c) => c.incoherence !== null && c.incoherence.p < alpha);
    if (incoherent.length > 0) warnings.push({ key: "readiness.incoherence", values: { outcome: outcome.name, count: incoherent.length } });
  }
  warnings.push(...claimsAgainstFindings(draft));
  return { blocking, warnings };
}

/** The editor's texts read against what the analysis found (server/core/editorial/claims.ts), once every outcome is analysed. */
function claimsAgainstFindings(draft: DraftFacts): ReadinessItem[] {
  const analysed = draft.outcomes.filter((o) => o.current && o.result && o.certainty && o.groups);
  if (analysed.length === 0 || analysed.length < draft.outcomes.length) return [];
  return textClaims({
    texts: [
      { field: "shortTake", markdown: draft.shortTake },
      { field: "laySummary", markdown: draft.laySummary },
    ],
    treatments: draft.treatments.map((t) => ({ label: t.label, displayName: t.displayName ?? t.label })),
    outcomes: analysed.map((o) => {
      const reference = o.result!.reference;
      const against = o.certainty!.filter((c) => c.treatment === reference || c.comparator === reference);
      return {
        name: o.name,
        reference,
        certainty: new Map(against.map((c) => [c.treatment === reference ? c.comparator : c.treatment, c.network])),
        level: new Map(o.groups!.flatMap((g) => g.treatments.map((t) => [t, g.level] as const))),
      };
    }),
  });
}
