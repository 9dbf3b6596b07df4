// The publish-readiness checklist of a draft (server/core/editorial/readiness.ts) from what is stored now.
import { concludeOutcome } from "#core/grade/conclusions";
import { readinessOf, type Readiness } from "#core/editorial/readiness";
import { latestResult } from "#db/analyses";
import { briefWithOutcomes } from "#db/briefs";
import type { Database } from "#db/client";
import { outcomeCertainty, thresholdsOf } from "./certainty";

/** Null when there is no such brief. */
export async function briefReadiness(db: Database, briefId: string): Promise<Readiness | null> {
  const brief = await briefWithOutcomes(db, briefId);
  if (!brief) return null;
  const names = Object.fromEntries(brief.treatments.map((t) => [t.label, t.displayName]));
  const outcomes = [];
  for (const outcome of brief.outcomes) {
    const current = outcome.analysis.state === "current";
    const result = current ? (await latestResult(db, outcome.id))?.result ?? null : null;
    const certainty = result ? await outcomeCertainty(db, outcome, result) : null;
    const groups = result && certainty ? concludeOutcome(result, certainty, { name: outcome.name, baselineRisk: outcome.baselineRisk, thresholds: thresholdsOf(outcome), names }).groups : null;
    outcomes.push({ name: outcome.name, current, result, certainty, groups });
  }
  return readinessOf({ laySummary: brief.laySummary, shortTake: brief.shortTake, outcomes, treatments: brief.treatments });
}
