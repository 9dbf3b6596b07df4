// Outcomes of a brief: what was measured, how it is analysed and what counts as a small, moderate or large effect.
import { and, eq, sql } from "drizzle-orm";
import type { OutcomeInput } from "#core/editorial/outcome";
import { recordAudit } from "./audit";
import type { Database, Executor } from "./client";
import { analysisResults, certaintyJudgements, datasets, outcomes, pendingUploads } from "./schema";

export type OutcomeRow = typeof outcomes.$inferSelect;

export async function createOutcome(db: Database, briefId: string, input: OutcomeInput, actorId: string): Promise<OutcomeRow> {
  return db.transaction(async (tx) => {
    const [{ next }] = (await tx
      .select({ next: sql<number>`coalesce(max(${outcomes.position}), 0) + 1` })
      .from(outcomes)
      .where(eq(outcomes.briefId, briefId))) as [{ next: number }];
    const [row] = await tx.insert(outcomes).values({ ...input, briefId, position: Number(next) }).returning();
    await recordAudit(tx, { actorId, action: "create", entity: "outcome", entityId: row!.id, before: null, after: row });
    return row!;
  });
}

export async function findOutcome(db: Executor, id: string): Promise<OutcomeRow | null> {
  return (await db.query.outcomes.findFirst({ where: eq(outcomes.id, id) })) ?? null;
}

/** The settings as an analyst would send them, from a stored outcome. */
export function outcomeInputOf(row: OutcomeRow): OutcomeInput {
  const { name, kind, measure, model, referenceTreatment, direction, baselineRisk, unit, statementPhrase, thresholdSmall, thresholdModerate, thresholdLarge } = row;
  return { name, kind, measure, model, referenceTreatment, direction, baselineRisk, unit, statementPhrase, thresholdSmall, thresholdModerate, thresholdLarge };
}

/** Writes new settings if the row is still at `rowVersion`; null when someone else changed it first. */
export async function updateOutcomeSettings(tx: Executor, id: string, rowVersion: number, settings: OutcomeInput): Promise<OutcomeRow | null> {
  const [row] = await tx
    .update(outcomes)
    .set({ ...settings, rowVersion: rowVersion + 1 })
    .where(and(eq(outcomes.id, id), eq(outcomes.rowVersion, rowVersion)))
    .returning();
  return row ?? null;
}

/** Removes an outcome with its uploads, results and judgements; published versions keep their frozen copy. */
export async function deleteOutcome(db: Database, id: string, actorId: string): Promise<boolean> {
  return db.transaction(async (tx) => {
    const before = await findOutcome(tx, id);
    if (!before) return false;
    await tx.delete(certaintyJudgements).where(eq(certaintyJudgements.outcomeId, id));
    await tx.delete(analysisResults).where(eq(analysisResults.outcomeId, id));
    await tx.delete(datasets).where(eq(datasets.outcomeId, id));
    await tx.delete(pendingUploads).where(eq(pendingUploads.outcomeId, id));
    await tx.delete(outcomes).where(eq(outcomes.id, id));
    await recordAudit(tx, { actorId, action: "delete", entity: "outcome", entityId: id, before, after: null });
    return true;
  });
}
