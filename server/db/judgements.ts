// Reading and writing certainty judgements, one per outcome and pair.
import { and, eq } from "drizzle-orm";
import { recordAudit } from "./audit";
import type { Executor } from "./client";
import { certaintyJudgements } from "./schema";
import type { ComparisonJudgement } from "#core/grade/assess";
import { pairKey } from "#core/nma/pairs";

export async function loadJudgements(db: Executor, outcomeId: string): Promise<Map<string, ComparisonJudgement>> {
  const rows = await db.select().from(certaintyJudgements).where(eq(certaintyJudgements.outcomeId, outcomeId));
  return new Map(rows.map((row) => [pairKey(row.treatment, row.comparator), row.judgement]));
}

/** One judgement, with its audit row; inside the caller's transaction when it passes one. */
export async function saveJudgement(
  db: Executor,
  key: { outcomeId: string; treatment: string; comparator: string },
  judgement: ComparisonJudgement,
  actorId: string,
): Promise<void> {
  await db.transaction(async (tx) => {
    const where = and(
      eq(certaintyJudgements.outcomeId, key.outcomeId),
      eq(certaintyJudgements.treatment, key.treatment),
      eq(certaintyJudgements.comparator, key.comparator),
    );
    const before = await tx.query.certaintyJudgements.findFirst({ where });
    await tx
      .insert(certaintyJudgements)
      .values({ ...key, judgement, updatedBy: actorId })
      .onConflictDoUpdate({
        target: [certaintyJudgements.outcomeId, certaintyJudgements.treatment, certaintyJudgements.comparator],
        set: { judgement, updatedBy: actorId, updatedAt: new Date() },
      });
    await recordAudit(tx, {
      actorId,
      action: "judge-certainty",
      entity: "outcome",
      entityId: key.outcomeId,
      before: before ? { ...key, judgement: before.judgement } : null,
      after: { ...key, judgement },
    });
  });
}
