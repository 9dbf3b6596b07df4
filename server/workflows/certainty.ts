// Certainty of an outcome's comparisons (METHODS.md §8): the rules of server/core/grade applied to
// its latest result and the judgements recorded so far, and recording a judgement, where a departure
// from a computed suggestion needs a reason. The desk and publishing read certainty from here alone.
import { assessCertainty, type ComparisonCertainty } from "#core/grade/assess";
import { unexplainedDepartures, type Departure, type JudgementInput } from "#core/grade/judgement";
import type { AnalysisResult } from "#core/nma/analyse";
import { latestResult } from "#db/analyses";
import type { Database } from "#db/client";
import { loadJudgements, saveJudgement } from "#db/judgements";
import type { OutcomeRow } from "#db/outcomes";

export const thresholdsOf = (outcome: OutcomeRow) => ({ small: outcome.thresholdSmall, moderate: outcome.thresholdModerate, large: outcome.thresholdLarge });

/** Every comparison of the outcome's latest result with its ratings, suggestions and what is pending; null without a result. */
export async function outcomeCertainty(db: Database, outcome: OutcomeRow, result?: AnalysisResult): Promise<ComparisonCertainty[] | null> {
  const analysed = result ?? (await latestResult(db, outcome.id))?.result;
  if (!analysed) return null;
  return assessCertainty(analysed, await loadJudgements(db, outcome.id), thresholdsOf(outcome), outcome.baselineRisk);
}

type Pair = { treatment: string; comparator: string };

export type JudgementOutcome =
  | { ok: true; comparisons: ComparisonCertainty[] }
  | { ok: false; reason: "no-result" }
  | { ok: false; reason: "no-comparison"; pair: Pair }
  | { ok: false; reason: "unexplained"; pair: Pair; domains: Departure[] };

/**
 * Records the analyst's judgements of one or many comparisons, each named in the order the result
 * lists the pair, all or none: one pair that is not in the result, or departs from a suggestion
 * without a reason, refuses the whole set (the bulk actions of the desk rely on it).
 */
export async function judgeComparisons(db: Database, outcome: OutcomeRow, items: (Pair & { judgement: JudgementInput })[], actorId: string): Promise<JudgementOutcome> {
  const before = await outcomeCertainty(db, outcome);
  if (!before) return { ok: false, reason: "no-result" };
  const find = (list: ComparisonCertainty[], pair: Pair) => list.find((c) => c.treatment === pair.treatment && c.comparator === pair.comparator);
  for (const { judgement, ...pair } of items) {
    const current = find(before, pair);
    if (!current) return { ok: false, reason: "no-comparison", pair };
    const unexplained = unexplainedDepartures(judgement, current);
    if (unexplained.length > 0) return { ok: false, reason: "unexplained", pair, domains: unexplained };
  }
  await db.transaction(async (tx) => {
    for (const { judgement, ...pair } of items) await saveJudgement(tx, { outcomeId: outcome.id, ...pair }, judgement, actorId);
  });
  const after = (await outcomeCertainty(db, outcome))!;
  return { ok: true, comparisons: items.map((pair) => find(after, pair)!) };
}
