// What the editor's texts claim, read against the findings (readiness, METHODS.md §9–§10): a treatment
// named beside a certainty word other than its computed certainty, a rank claim or a rank score used
// as evidence, a treatment called beneficial or harmful that its group does not show to differ.
// Pure: the texts, the treatments' names and each outcome's conclusions in; warnings out, each
// naming what was matched and why, so that the editor can mend the text or give a reason.
//
// Texts are written in the source language, English; the word lists below are ours, chosen from the
// GRADE wording the statements use. A sentence with a negation ("not", "no", "cannot") is not read as
// a claim of benefit or rank: the check advises, it does not parse grammar.
import type { Rating } from "../grade/certainty";
import type { ReadinessItem } from "./readiness";
import { sentencesOf } from "./readability";

export interface ClaimFacts {
  /** The editor's texts in Markdown, by field. */
  texts: { field: "shortTake" | "laySummary"; markdown: string }[];
  treatments: { label: string; displayName: string }[];
  outcomes: {
    name: string;
    reference: string;
    /** Each treatment's certainty against the reference (null: not rated). */
    certainty: Map<string, Rating | null>;
    /** Each treatment's group level: 0 is "not shown to differ" (or listed apart), above 0 benefit, below harm. */
    level: Map<string, number>;
  }[];
}

/** Case and accents do not count: "Sleep aid K" matches "sleep aid k" and "Sleep áid K". */
const fold = (text: string) => text.normalize("NFD").replace(/\p{M}/gu, "").toLowerCase();

/** "very low certainty" before "low certainty": the longest phrase wins. */
const certaintyWords: [RegExp, Rating][] = [
  [/\bvery low(?:[- ]certainty| certainty of evidence)\b/, "very_low"],
  [/\bhigh(?:[- ]certainty)\b/, "high"],
  [/\bmoderate(?:[- ]certainty)\b/, "moderate"],
  [/\blow(?:[- ]certainty)\b/, "low"],
];
const negation = /\b(?:not|no|cannot|can't|don't|doesn't|isn't|aren't|neither|nor|unclear|without)\b/;
const rankWords = /\b(?:best|first|top|winner|wins|optimal|number one|ranked|ranks|ranking|highest score|sucra|p-scores?|rank scores?)\b/;
const benefitWords = /\b(?:benefits?|beneficial|helps?|helped|improves?|improved|effective|works|better than|gives? relief)\b/;
const harmWords = /\b(?:harms?|harmful|worse than|dangerous)\b/;
const everyWords = /\b(?:every|all|each)\b/;

const escape = (text: string) => text.replace(/[.*+?^${}()|[\]\\]/g, "\\$&");

/** The ways a reader may write a treatment: its display name, and the same without a trailing "(…)". */
function namePatterns(displayName: string): RegExp[] {
  const names = new Set([displayName, displayName.replace(/\s*\([^)]*\)\s*$/, "")].map((n) => fold(n).trim()).filter((n) => n.length > 1));
  return [...names].map((name) => new RegExp(`(?<![\\p{L}\\p{N}])${escape(name)}(?![\\p{L}\\p{N}])`, "u"));
}

/** A sentence as the warning quotes it: whole, or cut at 90 characters; never read as a nested message. */
const quote = (sentence: string) => (sentence.length > 90 ? `${sentence.slice(0, 89)}…` : sentence).replaceAll("$t(", "$\u200bt(");

export function textClaims(facts: ClaimFacts): ReadinessItem[] {
  const items: ReadinessItem[] = [];
  const named = facts.treatments.map((t) => ({ ...t, patterns: namePatterns(t.displayName) }));
  const isReference = (label: string) => facts.outcomes.length > 0 && facts.outcomes.every((o) => o.reference === label);
  const notShownToDiffer = (label: string) => facts.outcomes.length > 0 && facts.outcomes.every((o) => !o.level.has(label) || o.level.get(label) === 0);

  for (const { field, markdown } of facts.texts) {
    for (const sentence of sentencesOf(markdown)) {
      const folded = fold(sentence);
      const mentioned = named.filter((t) => !isReference(t.label) && t.patterns.some((p) => p.test(folded)));
      const negated = negation.test(folded);
      const at = { field, sentence: quote(sentence) };

      const written = certaintyWords.find(([pattern]) => pattern.test(folded))?.[1];
      if (written) {
        for (const t of mentioned) {
          const computed = [...new Set(facts.outcomes.map((o) => o.certainty.get(t.label) ?? null))];
          if (computed.includes(written)) continue;
          const rated = computed.filter((r): r is Rating => r !== null);
          const values = { ...at, treatment: t.displayName, written };
          if (rated.length === 0) items.push({ key: "readiness.claim.certaintyUnrated", values });
          else if (rated.length === 1) items.push({ key: "readiness.claim.certainty", values: { ...values, computed: rated[0]! } });
          else items.push({ key: "readiness.claim.certaintyByOutcome", values: { ...values, computed: rated[0]!, other: rated[1]! } });
        }
      }

      if (mentioned.length > 0 && !negated) {
        const rank = rankWords.exec(folded);
        if (rank) for (const t of mentioned) items.push({ key: "readiness.claim.rank", values: { ...at, treatment: t.displayName, word: rank[0] } });
        const claimed = benefitWords.exec(folded) ?? harmWords.exec(folded);
        if (claimed) {
          for (const t of mentioned.filter((x) => notShownToDiffer(x.label))) items.push({ key: "readiness.claim.noDifference", values: { ...at, treatment: t.displayName, word: claimed[0] } });
        }
      }

      if (mentioned.length === 0 && !negated && everyWords.test(folded) && benefitWords.test(folded)) {
        const undiffering = named.filter((t) => !isReference(t.label) && notShownToDiffer(t.label));
        if (undiffering.length > 0) items.push({ key: "readiness.claim.every", values: { ...at, count: undiffering.length, treatments: undiffering.map((t) => t.displayName).join(", ") } });
      }
    }
  }
  return items;
}
