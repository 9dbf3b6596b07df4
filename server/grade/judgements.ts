// Reading and writing certainty judgements, and the zod shape an analyst's judgement must have.
import { and, eq } from "drizzle-orm";
import { z } from "zod";
import { recordAudit } from "../audit";
import type { Database } from "../db/client";
import { certaintyJudgements } from "../db/schema";
import type { ComparisonJudgement } from "./assess";
import { pairKey, ratings } from "./certainty";

const reason = z.string().trim().max(2000);
const downgrade = z
  .object({ levels: z.union([z.literal(0), z.literal(1), z.literal(2)]), reason })
  .refine((d) => d.levels === 0 || d.reason.length > 0, { message: "give the reason for rating down", path: ["reason"] });
const decision = z.object({ levels: z.number().int().min(0).max(3), reason });

export const judgementInput = z
  .object({
    direct: z.object({ riskOfBias: downgrade, inconsistency: downgrade, indirectness: downgrade, publicationBias: downgrade }).optional(),
    intransitivity: downgrade.optional(),
    indirectRating: z.object({ rating: z.enum(ratings), reason: reason.min(1, "give the reason for this rating") }).optional(),
    dominant: z.enum(["direct", "indirect"]).nullable().optional(),
    incoherence: decision.optional(),
    imprecision: decision.optional(),
  })
  .strict();

export async function loadJudgements(db: Database, outcomeId: string): Promise<Map<string, ComparisonJudgement>> {
  const rows = await db.select().from(certaintyJudgements).where(eq(certaintyJudgements.outcomeId, outcomeId));
  return new Map(rows.map((row) => [pairKey(row.treatment, row.comparator), row.judgement as ComparisonJudgement]));
}

export async function saveJudgement(
  db: Database,
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
