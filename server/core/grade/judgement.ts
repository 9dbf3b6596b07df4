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
/** The risk-of-bias domain may follow a computed suggestion without a reason (§13); whether it departs is checked below. */
const riskOfBias = z.object({ levels: z.union([z.literal(0), z.literal(1), z.literal(2)]), reason });

export const judgementInput = z
  .object({
    direct: z.object({ riskOfBias, inconsistency: downgrade, indirectness: downgrade, publicationBias: downgrade }).optional(),
    intransitivity: downgrade.optional(),
    indirectRating: z.object({ rating: z.enum(ratings), reason: reason.min(1, "give the reason for this rating") }).optional(),
    dominant: z.enum(["direct", "indirect"]).nullable().optional(),
    incoherence: decision.optional(),
    imprecision: decision.optional(),
  })
  .strict();

export type Departure = "incoherence" | "imprecision" | "riskOfBias";

/**
 * The suggestions this judgement departs from without saying why. The risk-of-bias domain without a
 * suggestion keeps the rule of every direct domain: rating down needs a reason.
 */
export function unexplainedDepartures(judgement: z.infer<typeof judgementInput>, current: Pick<ComparisonCertainty, "suggestions">): Departure[] {
  const departed = (["incoherence", "imprecision"] as const).filter((name) => {
    const decision = judgement[name];
    return decision !== undefined && decision.levels !== current.suggestions[name].levels && decision.reason === "";
  });
  const rob = judgement.direct?.riskOfBias;
  if (rob && rob.reason === "" && rob.levels !== (current.suggestions.riskOfBias?.levels ?? 0)) return [...departed, "riskOfBias"];
  return departed;
}
export type JudgementInput = z.infer<typeof judgementInput>;
