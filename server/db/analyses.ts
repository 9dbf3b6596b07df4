// Uploaded data sets and engine results of outcomes. A stored result carries the engine version and a
// checksum of everything it was computed from, so a stale result shows as stale.
import { createHash } from "node:crypto";
import { and, desc, eq, sql } from "drizzle-orm";
import { engineVersion, type AnalysisResult } from "#core/nma/analyse";
import type { AnalysisOptions, Format, ParsedDataset } from "#core/nma/types";
import type { Executor } from "./client";
import { analysisResults, datasets } from "./schema";
import type { OutcomeRow } from "./outcomes";

export function analysisSettings(outcome: OutcomeRow): AnalysisOptions {
  return {
    measure: outcome.measure,
    model: outcome.model,
    reference: outcome.referenceTreatment,
    better: outcome.direction,
    draws: 10_000,
    seed: 1,
  };
}

export function inputChecksum(datasetSha256: string, settings: AnalysisOptions): string {
  return createHash("sha256").update(JSON.stringify({ datasetSha256, settings, engineVersion })).digest("hex");
}

/** Keeps an uploaded file with its bytes, SHA-256 and parsed rows; earlier uploads stay in the history. */
export async function insertDataset(
  db: Executor,
  values: { outcomeId: string; format: Format; fileName: string; original: Buffer; sha256: string; parsed: ParsedDataset; uploadedBy: string },
) {
  const [dataset] = await db.insert(datasets).values(values).returning({ id: datasets.id, sha256: datasets.sha256, uploadedAt: datasets.uploadedAt });
  return dataset!;
}

/** Stores one engine run with what it was computed from: the engine version and the input checksum. */
export async function recordResult(
  db: Executor,
  outcomeId: string,
  dataset: { id: string; sha256: string },
  settings: AnalysisOptions,
  result: AnalysisResult,
): Promise<{ id: string }> {
  const [row] = await db
    .insert(analysisResults)
    .values({ outcomeId, datasetId: dataset.id, engineVersion, inputChecksum: inputChecksum(dataset.sha256, settings), settings, result })
    .returning({ id: analysisResults.id });
  return row!;
}

export async function latestDataset(db: Executor, outcomeId: string) {
  return (await db.query.datasets.findFirst({ where: eq(datasets.outcomeId, outcomeId), orderBy: desc(datasets.uploadedAt) })) ?? null;
}

export async function latestResult(db: Executor, outcomeId: string) {
  return (
    (await db.query.analysisResults.findFirst({
      where: eq(analysisResults.outcomeId, outcomeId),
      orderBy: desc(analysisResults.createdAt),
    })) ?? null
  );
}

/** The treatment labels of the outcome's latest result, without loading the whole result. */
export async function latestTreatments(db: Executor, outcomeId: string): Promise<string[]> {
  const [row] = await db
    .select({ treatments: sql<string[]>`${analysisResults.result}->'treatments'` })
    .from(analysisResults)
    .where(eq(analysisResults.outcomeId, outcomeId))
    .orderBy(desc(analysisResults.createdAt))
    .limit(1);
  return row?.treatments ?? [];
}

/** Whether the outcome has data and a result, and whether that result still matches the data and settings. */
export async function analysisStatus(db: Executor, outcome: OutcomeRow) {
  // Only the small columns: the file's bytes, its parsed rows and the result stay in the database.
  const [dataset] = await db
    .select({ id: datasets.id, fileName: datasets.fileName, sha256: datasets.sha256, uploadedAt: datasets.uploadedAt })
    .from(datasets)
    .where(eq(datasets.outcomeId, outcome.id))
    .orderBy(desc(datasets.uploadedAt))
    .limit(1);
  if (!dataset) return { state: "no-data" as const };
  const [result] = await db
    .select({ id: analysisResults.id, inputChecksum: analysisResults.inputChecksum, engineVersion: analysisResults.engineVersion })
    .from(analysisResults)
    .where(and(eq(analysisResults.outcomeId, outcome.id), eq(analysisResults.datasetId, dataset.id)))
    .orderBy(desc(analysisResults.createdAt))
    .limit(1);
  const expected = inputChecksum(dataset.sha256, analysisSettings(outcome));
  return {
    state: result && result.inputChecksum === expected ? ("current" as const) : ("stale" as const),
    datasetId: dataset.id,
    fileName: dataset.fileName,
    sha256: dataset.sha256,
    uploadedAt: dataset.uploadedAt,
    resultId: result?.id ?? null,
    engineVersion: result?.engineVersion ?? null,
  };
}
