// The snapshot of a brief: what a version freezes and what its public pages render from, built from
// the current draft. Types here are shared with the pages (type imports only reach the browser).
import { createHash } from "node:crypto";
import { analysisSettings, latestDataset, latestResult } from "../analysis/run";
import { renderMarkdown } from "../content/markdown";
import type { Database } from "../db/client";
import { assessCertainty, type ComparisonCertainty, type Thresholds } from "../grade/assess";
import { concludeOutcome, type OutcomeConclusions } from "../grade/conclusions";
import { loadJudgements } from "../grade/judgements";
import type { AnalysisResult } from "../nma/analyse";
import type { AnalysisOptions, Format, ParsedDataset } from "../nma/types";
import { briefWithOutcomes } from "./briefs";

export interface OutcomeSnapshot extends OutcomeConclusions {
  name: string;
  kind: "binary" | "continuous";
  settings: AnalysisOptions;
  baselineRisk: number | null;
  unit: string | null;
  thresholds: Thresholds;
  dataset: { fileName: string; sha256: string; format: Format; parsed: ParsedDataset };
  result: AnalysisResult;
  certainty: ComparisonCertainty[];
}

export interface DraftSnapshot {
  brief: { slug: string; title: string; topic: string; condition: string; population: string; demo: boolean };
  treatments: { label: string; displayName: string }[];
  texts: { laySummaryHtml: string; keyMessagesHtml: string };
  outcomes: OutcomeSnapshot[];
}

/** A published version: the draft's snapshot with its number, release time and correction note. */
export interface VersionSnapshot extends DraftSnapshot {
  version: number;
  releaseAt: string;
  note: string | null;
}

export type DraftResult = { ok: true; snapshot: DraftSnapshot } | { ok: false; reason: "not-found" | "not-ready"; detail: string };

/** Every outcome must have a current analysis; the snapshot is what a version would freeze now. */
export async function draftSnapshot(db: Database, briefId: string): Promise<DraftResult> {
  const brief = await briefWithOutcomes(db, briefId);
  if (!brief) return { ok: false, reason: "not-found", detail: "there is no such brief" };
  const notReady = brief.outcomes.filter((o) => o.analysis.state !== "current").map((o) => o.name);
  if (brief.outcomes.length === 0) return { ok: false, reason: "not-ready", detail: "the brief has no outcome" };
  if (notReady.length > 0) return { ok: false, reason: "not-ready", detail: `outcomes without a current analysis: ${notReady.join(", ")}` };
  const names = Object.fromEntries(brief.treatments.map((t) => [t.label, t.displayName]));
  const outcomes: OutcomeSnapshot[] = [];
  for (const outcome of brief.outcomes) {
    const result = (await latestResult(db, outcome.id))!.result as AnalysisResult;
    const dataset = (await latestDataset(db, outcome.id))!;
    const thresholds = { small: outcome.thresholdSmall, moderate: outcome.thresholdModerate, large: outcome.thresholdLarge };
    const certainty = assessCertainty(result, await loadJudgements(db, outcome.id), thresholds);
    outcomes.push({
      name: outcome.name,
      kind: outcome.kind,
      settings: analysisSettings(outcome),
      baselineRisk: outcome.baselineRisk,
      unit: outcome.unit,
      thresholds,
      dataset: { fileName: dataset.fileName, sha256: dataset.sha256, format: dataset.format, parsed: dataset.parsed as ParsedDataset },
      result,
      certainty,
      ...concludeOutcome(result, certainty, { name: outcome.name, baselineRisk: outcome.baselineRisk, thresholds, names }),
    });
  }
  return {
    ok: true,
    snapshot: {
      brief: { slug: brief.slug, title: brief.title, topic: brief.topic, condition: brief.condition, population: brief.population, demo: brief.demo },
      treatments: brief.treatments,
      texts: { laySummaryHtml: renderMarkdown(brief.laySummary), keyMessagesHtml: renderMarkdown(brief.keyMessages) },
      outcomes,
    },
  };
}

/** The checksum of a draft's content as it would be frozen: what an approval vouches for. */
export function contentChecksum(snapshot: DraftSnapshot): string {
  return createHash("sha256").update(JSON.stringify(snapshot)).digest("hex");
}
