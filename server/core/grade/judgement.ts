// What an analyst records for one comparison (METHODS.md §8), and the rule that a departure from a
// computed suggestion needs a reason, which is published as a footnote. Pure.
import { z } from "zod";
import type { ComparisonCertainty } from "./assess";
import { ratings } from "./certainty";

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

/** The suggestions (incoherence, imprecision) this judgement departs from without saying why. */
export function unexplainedDepartures(judgement: z.infer<typeof judgementInput>, current: Pick<ComparisonCertainty, "suggestions">): ("incoherence" | "imprecision")[] {
  return (["incoherence", "imprecision"] as const).filter((name) => {
    const decision = judgement[name];
    return decision !== undefined && decision.levels !== current.suggestions[name].levels && decision.reason === "";
  });
}
export type JudgementInput = z.infer<typeof judgementInput>;
