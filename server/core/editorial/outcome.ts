// An outcome's settings (PRODUCT.md, the desk: name, binary or continuous, measure, model, reference,
// direction, baseline risk, thresholds) and the rules a valid outcome keeps. Pure.
import { z } from "zod";
import { lineText } from "./text";

export const outcomeFields = z.object({
    name: lineText(200),
    kind: z.enum(["binary", "continuous"]),
    measure: z.enum(["OR", "RR", "RD", "MD"]),
    model: z.enum(["fixed", "random"]),
    referenceTreatment: z.string().trim().min(1).max(200),
    direction: z.enum(["higher", "lower"]),
    baselineRisk: z.number().gt(0).lt(1).nullish(),
    unit: lineText(50, 0).nullish(),
    statementPhrase: lineText(200, 0).nullish(),
    /** The outcome is a harm (an adverse effect): its groups speak of harm, not of effectiveness (METHODS.md §10). */
    measuresHarm: z.boolean().optional(),
    thresholdSmall: z.number().positive().nullish(),
    thresholdModerate: z.number().positive().nullish(),
    thresholdLarge: z.number().positive().nullish(),
});

export const outcomeInput = outcomeFields
  .refine((o) => (o.kind === "binary" ? o.measure !== "MD" : o.measure === "MD"), {
    message: "binary outcomes take OR, RR or RD; continuous outcomes take MD",
    path: ["measure"],
  })
  .refine(
    (o) => {
      const given = [o.thresholdSmall, o.thresholdModerate, o.thresholdLarge].filter((t): t is number => t != null);
      return given.every((t, i) => i === 0 || t > given[i - 1]!);
    },
    { message: "thresholds must grow from small to moderate to large", path: ["thresholdModerate"] },
  )
  // Thresholds of a binary outcome are differences per 1000 people at its baseline risk (METHODS.md §9).
  .refine((o) => o.kind !== "binary" || o.baselineRisk != null || [o.thresholdSmall, o.thresholdModerate, o.thresholdLarge].every((t) => t == null), {
    message: "thresholds of a binary outcome are per 1000 people at its baseline risk: give the baseline risk",
    path: ["baselineRisk"],
  })
  .refine((o) => o.kind !== "binary" || [o.thresholdSmall, o.thresholdModerate, o.thresholdLarge].every((t) => t == null || t <= 1000), {
    message: "a threshold of a binary outcome is a difference per 1000 people: at most 1000",
    path: ["thresholdLarge"],
  });

export type OutcomeInput = z.infer<typeof outcomeInput>;

/** A PATCH names the row version it read and any fields to change; the merged outcome is checked whole. */
export const outcomePatch = outcomeFields.partial().extend({ rowVersion: z.number().int().positive().max(2_147_483_647) }).strict();
