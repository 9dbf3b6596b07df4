// The snapshot of a brief as its next version would freeze it, built from the current draft: the
// engine's result, the certainty assessment, the conclusions and every fact a page shows, checked
// against the declared contract (server/core/snapshot/schema.ts) before anyone approves or freezes it.
import { createHash } from "node:crypto";
import { concludeOutcome } from "#core/grade/conclusions";
import { renderMarkdown } from "#core/editorial/markdown";
import { outcomeFacts } from "#core/snapshot/facts";
import { draftSnapshotSchema, snapshotSchemaVersion, type DraftSnapshot, type VersionSnapshot } from "#core/snapshot/schema";
import { changesView, versionChanges, type ChangesView } from "#core/snapshot/changes";
import { grammaticalSnapshot } from "#core/languages/grammar";
import type { Locale } from "#core/languages/locales";
import { versionGrammar } from "#core/languages/translation";
import { lastVersionNumber, snapshotOf } from "#db/versions";
import { analysisSettings, latestDataset, latestResult } from "#db/analyses";
import { briefWithOutcomes } from "#db/briefs";
import type { Database } from "#db/client";
import { outcomeCertainty, thresholdsOf } from "./certainty";

export type DraftResult = { ok: true; snapshot: DraftSnapshot } | { ok: false; reason: "not-found" | "not-ready"; detail: string };

/** Every outcome must have a current analysis; the snapshot is what a version would freeze now. */
export async function draftSnapshot(db: Database, briefId: string): Promise<DraftResult> {
  const brief = await briefWithOutcomes(db, briefId);
  if (!brief) return { ok: false, reason: "not-found", detail: "there is no such brief" };
  const notReady = brief.outcomes.filter((o) => o.analysis.state !== "current").map((o) => o.name);
  if (brief.outcomes.length === 0) return { ok: false, reason: "not-ready", detail: "the brief has no outcome" };
  if (notReady.length > 0) return { ok: false, reason: "not-ready", detail: `outcomes without a current analysis: ${notReady.join(", ")}` };
  const names = Object.fromEntries(brief.treatments.map((t) => [t.label, t.displayName]));
  const outcomes = [];
  for (const outcome of brief.outcomes) {
    const result = (await latestResult(db, outcome.id))!.result;
    const dataset = (await latestDataset(db, outcome.id))!;
    const parsed = dataset.parsed;
    const thresholds = thresholdsOf(outcome);
    const certainty = (await outcomeCertainty(db, outcome, result))!;
    outcomes.push({
      name: outcome.name,
      kind: outcome.kind,
      settings: analysisSettings(outcome),
      baselineRisk: outcome.baselineRisk,
      unit: outcome.unit,
      measuresHarm: outcome.measuresHarm,
      thresholds,
      dataset: { fileName: dataset.fileName, sha256: dataset.sha256, format: dataset.format, parsed },
      result,
      certainty,
      ...concludeOutcome(result, certainty, { name: outcome.name, statementPhrase: outcome.statementPhrase, baselineRisk: outcome.baselineRisk, thresholds, names, measuresHarm: outcome.measuresHarm }),
      ...outcomeFacts(result, certainty, parsed.studies),
    });
  }
  const snapshot = draftSnapshotSchema.parse({
    schemaVersion: snapshotSchemaVersion,
    brief: { slug: brief.slug, title: brief.title, topic: brief.topic, condition: brief.condition, population: brief.population, demo: brief.demo, authorTeam: brief.authorTeam },
    treatments: brief.treatments,
    texts: { laySummaryHtml: renderMarkdown(brief.laySummary), shortTakeHtml: renderMarkdown(brief.shortTake) },
    outcomes,
  });
  return { ok: true, snapshot };
}

/** The checksum of a draft's content as it would be frozen: what an approval vouches for. */
export function contentChecksum(snapshot: DraftSnapshot): string {
  return createHash("sha256").update(JSON.stringify(snapshot)).digest("hex");
}

/**
 * What publishing the draft now would change since the brief's last version, worded for the desk
 * (names as the analyst wrote them, sentences in `locale`): what the editor reads before a
 * correction. Null before a first version, or while the draft cannot be frozen; undefined when there
 * is no such brief.
 */
export async function draftChanges(db: Database, briefId: string, locale: Locale): Promise<ChangesView | null | undefined> {
  const draft = await draftSnapshot(db, briefId);
  if (!draft.ok && draft.reason === "not-found") return undefined;
  const last = await lastVersionNumber(db, briefId);
  const before = last > 0 ? await snapshotOf(db, briefId, last) : null;
  if (!draft.ok || !before) return null;
  const after: VersionSnapshot = { ...draft.snapshot, version: last + 1, releaseAt: new Date().toISOString(), note: null };
  const worded = (snapshot: VersionSnapshot) => grammaticalSnapshot(snapshot, locale, versionGrammar(snapshot, locale, null));
  return changesView(versionChanges(before, after), worded(before), worded(after));
}
