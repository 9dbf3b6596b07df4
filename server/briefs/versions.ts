// Publishing: a version is a frozen snapshot of a brief — data, results, certainty, groups — built
// once and never changed (the database refuses it too). Version 1 publishes; later versions correct.
import { and, desc, eq, lte, sql } from "drizzle-orm";
import { analysisSettings, latestDataset, latestResult } from "../analysis/run";
import { recordAudit } from "../audit";
import type { Role } from "../auth/roles";
import type { Database } from "../db/client";
import { briefs, briefVersions } from "../db/schema";
import { assessCertainty } from "../grade/assess";
import { concludeOutcome } from "../grade/conclusions";
import { loadJudgements } from "../grade/judgements";
import type { AnalysisResult } from "../nma/analyse";
import { renderMarkdown } from "../content/markdown";
import { briefWithOutcomes } from "./briefs";

export type PublishOutcome =
  | { ok: true; version: number; url: string }
  | { ok: false; reason: "not-found" | "not-ready"; detail: string }
  | { ok: false; reason: "note-required"; detail: string };

/** Builds the snapshot from the current draft: every outcome must have a current analysis. */
async function buildSnapshot(db: Database, briefId: string) {
  const brief = await briefWithOutcomes(db, briefId);
  if (!brief) return null;
  const notReady = brief.outcomes.filter((o) => o.analysis.state !== "current").map((o) => o.name);
  if (brief.outcomes.length === 0 || notReady.length > 0) {
    return { error: brief.outcomes.length === 0 ? "the brief has no outcome" : `outcomes without a current analysis: ${notReady.join(", ")}` };
  }
  const outcomes = [];
  for (const outcome of brief.outcomes) {
    const result = (await latestResult(db, outcome.id))!.result as AnalysisResult;
    const dataset = (await latestDataset(db, outcome.id))!;
    const thresholds = { small: outcome.thresholdSmall, moderate: outcome.thresholdModerate, large: outcome.thresholdLarge };
    const certainty = assessCertainty(result, await loadJudgements(db, outcome.id), thresholds);
    const conclusions = concludeOutcome(result, certainty, { name: outcome.name, baselineRisk: outcome.baselineRisk, thresholds, names: Object.fromEntries(brief.treatments.map((t) => [t.label, t.displayName])) });
    outcomes.push({
      name: outcome.name,
      kind: outcome.kind,
      settings: analysisSettings(outcome),
      baselineRisk: outcome.baselineRisk,
      unit: outcome.unit,
      thresholds,
      dataset: { fileName: dataset.fileName, sha256: dataset.sha256, format: dataset.format, parsed: dataset.parsed },
      result,
      certainty,
      ...conclusions,
    });
  }
  return {
    snapshot: {
      brief: { slug: brief.slug, title: brief.title, topic: brief.topic, condition: brief.condition, population: brief.population, demo: brief.demo },
      treatments: brief.treatments,
      texts: { laySummaryHtml: renderMarkdown(brief.laySummary), keyMessagesHtml: renderMarkdown(brief.keyMessages) },
      outcomes,
    },
  };
}

export async function publishVersion(
  db: Database,
  briefId: string,
  options: { releaseAt?: Date; note?: string },
  actorId: string,
): Promise<PublishOutcome> {
  const built = await buildSnapshot(db, briefId);
  if (!built) return { ok: false, reason: "not-found", detail: "there is no such brief" };
  if ("error" in built) return { ok: false, reason: "not-ready", detail: built.error! };
  return db.transaction(async (tx) => {
    const [brief] = await tx.select().from(briefs).where(eq(briefs.id, briefId)).for("update");
    const [last] = await tx.select({ number: briefVersions.number }).from(briefVersions).where(eq(briefVersions.briefId, briefId)).orderBy(desc(briefVersions.number)).limit(1);
    const number = (last?.number ?? 0) + 1;
    if (number > 1 && !options.note?.trim()) return { ok: false, reason: "note-required", detail: "a correction needs a public note saying what changed" };
    const releaseAt = options.releaseAt ?? new Date();
    const snapshot = { ...built.snapshot, version: number, releaseAt: releaseAt.toISOString(), note: options.note ?? null };
    await tx.insert(briefVersions).values({ briefId, number, releaseAt, note: options.note ?? null, snapshot, createdBy: actorId });
    const status = releaseAt.getTime() > Date.now() ? "scheduled" : number > 1 ? "corrected" : "published";
    await tx.update(briefs).set({ status, rowVersion: brief!.rowVersion + 1, updatedAt: new Date() }).where(eq(briefs.id, briefId));
    await recordAudit(tx, { actorId, action: "publish", entity: "brief", entityId: briefId, before: { status: brief!.status }, after: { status, version: number, releaseAt } });
    return { ok: true, version: number, url: `/briefs/${brief!.slug}/v/${number}` };
  });
}

/** Who may read a version before its release: the press, and the editors who scheduled it. */
const embargoReaders: Role[] = ["press", "editor"];

/** The stored snapshot as JSON text, exactly as frozen; null when it does not exist or is not yet released for this reader. */
export async function readVersion(db: Database, slug: string, number: number, roles: Role[]): Promise<string | null> {
  const [row] = await db
    .select({ releaseAt: briefVersions.releaseAt, snapshot: briefVersions.snapshot })
    .from(briefVersions)
    .innerJoin(briefs, eq(briefs.id, briefVersions.briefId))
    .where(and(eq(briefs.slug, slug), eq(briefVersions.number, number)));
  if (!row) return null;
  const released = row.releaseAt.getTime() <= Date.now();
  if (!released && !roles.some((role) => embargoReaders.includes(role))) return null;
  return JSON.stringify(row.snapshot);
}

export interface ReleasedBrief {
  slug: string;
  title: string;
  topic: string;
  demo: boolean;
  version: number;
  releasedAt: string;
}

/** The latest released version of every brief, newest first: what the public may see now. */
export async function listReleasedBriefs(db: Database): Promise<ReleasedBrief[]> {
  const rows = await db
    .select({
      slug: briefs.slug,
      // The title a reader sees is the frozen one; the draft's may have moved on.
      title: sql<string>`${briefVersions.snapshot}->'brief'->>'title'`,
      topic: sql<string>`${briefVersions.snapshot}->'brief'->>'topic'`,
      demo: briefs.demo,
      version: briefVersions.number,
      releaseAt: briefVersions.releaseAt,
    })
    .from(briefVersions)
    .innerJoin(briefs, eq(briefs.id, briefVersions.briefId))
    .where(lte(briefVersions.releaseAt, new Date()))
    .orderBy(desc(briefVersions.releaseAt));
  const latest = new Map<string, ReleasedBrief>();
  for (const row of rows) {
    if (latest.has(row.slug)) continue;
    latest.set(row.slug, { slug: row.slug, title: row.title, topic: row.topic, demo: row.demo, version: row.version, releasedAt: row.releaseAt.toISOString() });
  }
  return [...latest.values()];
}
