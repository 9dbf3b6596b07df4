// The frozen version of a brief, declared: what publishing writes into brief_versions.snapshot and
// every public page, file and API answer reads back (docs/decisions/0012-snapshot-contract.md).
// The types come from this schema, never from the engine's live types, so an engine change cannot
// silently change the type of versions frozen long ago. A change of shape raises
// `snapshotSchemaVersion` and adds a numbered upgrade in ./upgrade.ts.
import { z } from "zod";

export const snapshotSchemaVersion = 6;

const finite = z.number();
const text = z.string();
const interval = z.object({ estimate: finite, lower: finite, upper: finite });
const estimateWithCi = interval.extend({ se: finite });
const rating = z.enum(["very_low", "low", "moderate", "high"]);

/** A message key of locales/<locale>/*.json with its facts: the words are chosen per locale when a page renders. */
export const messageSchema = z.object({ key: text, values: z.record(text, z.union([text, finite])) });

/** One reason a comparison was rated down, for its footnote: the analyst's words, or the computed reason. */
const footnote = z.object({ domainKey: text, levels: finite, reason: text.nullable(), because: messageSchema.nullable() });

/** A study's overall risk of bias (RoB 2: low, some concerns, high); null: not assessed. */
const riskOfBiasLevel = z.enum(["low", "some-concerns", "high"]).nullable();
const perLevel = <T extends z.ZodType>(value: T) => z.object({ low: value, someConcerns: value, high: value, notAssessed: value });

/** One step down of a certainty: the domain (a key of the public pages' words) and the levels. */
const certaintyStep = z.object({ domainKey: text, levels: z.number().int() });

/** How the pair's certainty was reached (METHODS.md §8 step 5; server/core/grade/path.ts). */
const certaintyPath = z.object({
  direct: z.object({ rating, steps: z.array(certaintyStep) }).nullable(),
  indirect: z.object({ rating, via: text.nullable(), sides: z.tuple([rating, rating]).nullable(), steps: z.array(certaintyStep), reason: text.nullable() }).nullable(),
  took: z.enum(["direct", "indirect"]),
  steps: z.array(certaintyStep),
  rating,
});

/** Every fact a page shows about one pair, computed when the version is published (never when it is read). */
const pairFacts = z.object({
  treatment: text,
  comparator: text,
  network: estimateWithCi,
  direct: estimateWithCi.extend({ studies: z.number().int(), participants: z.number().int().nullable() }).nullable(),
  indirect: estimateWithCi.nullable(),
  incoherenceP: finite.nullable(),
  certainty: rating.nullable(),
  /** Null while unrated, and in versions frozen before the path was stored (shape 6). */
  path: certaintyPath.nullable(),
  footnotes: z.array(footnote),
  /** METHODS.md §13: the studies that matter most, largest first; null in versions frozen before importances were computed. */
  importance: z.array(z.object({ study: text, value: finite, riskOfBias: riskOfBiasLevel })).nullable(),
  /** §13: shares of the direct estimate's weight by risk of bias; null without direct evidence or judgements. */
  riskOfBias: perLevel(finite).extend({ suggestedLevels: z.number().int().nullable() }).nullable(),
});

/** "treatment vs comparator", one direction of one comparison, read in words. */
const reading = z.object({
  treatment: text,
  comparator: text,
  certainty: rating.nullable(),
  magnitude: z.enum(["large", "moderate", "small", "trivial", "unclear"]),
  statement: messageSchema.nullable(),
  absolute: z
    .object({ baselinePer1000: finite, treatmentPer1000: interval, differencePer1000: interval, statement: messageSchema })
    .nullable(),
});

/** A study as the upload's parser read it (METHODS.md §1), with the line of the file of each row. */
const parsedStudy = z.discriminatedUnion("format", [
  z.looseObject({ format: z.literal("arm-binary"), study: text, riskOfBias: riskOfBiasLevel.optional(), arms: z.array(z.looseObject({ treatment: text, events: finite, total: finite, row: finite })) }),
  z.looseObject({ format: z.literal("arm-continuous"), study: text, riskOfBias: riskOfBiasLevel.optional(), arms: z.array(z.looseObject({ treatment: text, mean: finite, sd: finite, n: finite, row: finite })) }),
  z.looseObject({ format: z.literal("contrast"), study: text, riskOfBias: riskOfBiasLevel.optional(), contrasts: z.array(z.looseObject({ treatment1: text, treatment2: text, estimate: finite, se: finite, row: finite })) }),
]);

const outcomeSnapshot = z.object({
  name: text,
  kind: z.enum(["binary", "continuous"]),
  settings: z.object({
    measure: z.enum(["OR", "RR", "RD", "MD"]),
    model: z.enum(["fixed", "random"]),
    reference: text,
    better: z.enum(["higher", "lower"]),
    draws: z.number().int().optional(),
    seed: z.number().int().optional(),
  }),
  baselineRisk: finite.nullable(),
  unit: text.nullable(),
  /** The outcome is a harm: its groups speak of harm (absent in versions frozen before it was asked). */
  measuresHarm: z.boolean().optional(),
  /** On the decision scale (METHODS.md §9): per 1000 people for binary outcomes, the outcome's units for continuous ones. */
  thresholds: z.object({ small: finite.nullable(), moderate: finite.nullable(), large: finite.nullable() }),
  /** The uploaded file as parsed: the inputs download. */
  dataset: z.object({
    fileName: text,
    sha256: text,
    format: z.enum(["arm-binary", "arm-continuous", "contrast"]),
    parsed: z.looseObject({ format: text, studies: z.array(parsedStudy) }),
  }),
  /** The engine's whole output as it was then: archived for the results download, never read by a page. */
  result: z.looseObject({ engineVersion: text }),
  /** The certainty assessment as it was then (judgements, suggestions): archived for the results download. */
  certainty: z.array(z.looseObject({ treatment: text, comparator: text })),
  framework: z.enum(["minimal", "partial"]),
  groups: z.array(z.object({ label: messageSchema, firmness: z.enum(["firm", "may", "very-uncertain", "not-assessed"]), level: z.number().int(), treatments: z.array(text) })),
  readings: z.array(reading),
  rankScores: z.object({
    titleKey: text,
    introKey: text,
    cautionKeys: z.array(text),
    rows: z.array(z.object({ treatment: text, pScore: finite, sucra: finite })),
    draws: z.number().int(),
    seed: z.number().int(),
  }),
  /** Every pair once, in the engine's order. */
  pairs: z.array(pairFacts),
  /**
   * How much of the outcome's evidence comes from studies at each risk of bias: studies counted, and
   * their participants where the format has arm sizes. Null when the data carry no judgements.
   */
  riskOfBias: z.object({ studies: perLevel(z.number().int()), participants: perLevel(z.number().int()).nullable() }).nullable(),
  network: z.object({
    nodes: z.array(z.object({ treatment: text, participants: z.number().int().nullable() })),
    edges: z.array(z.object({ treatment: text, comparator: text, studies: z.number().int() })),
  }),
  methods: z.object({
    treatments: z.array(text),
    reference: text,
    studies: z.number().int(),
    excludedStudies: z.array(text),
    tau2: finite,
    I2: finite,
    Q: finite,
    df: finite,
    Qbetween: finite,
    dfBetween: finite,
    pBetween: finite.nullable(),
    engineVersion: text,
  }),
});

export const draftSnapshotSchema = z.object({
  schemaVersion: z.literal(snapshotSchemaVersion),
  // authorTeam: optional, so versions frozen before it read as before (the product's name as author).
  brief: z.object({ slug: text, title: text, topic: text, condition: text, population: text, demo: z.boolean(), authorTeam: text.nullable().optional() }),
  /** `phrase` and `number`: how an English sentence names it (server/core/languages/grammar.ts); absent in versions frozen before. */
  treatments: z.array(z.object({ label: text, displayName: text, phrase: text.nullable().optional(), number: z.enum(["singular", "plural"]).optional() })),
  texts: z.object({ laySummaryHtml: text, shortTakeHtml: text }),
  outcomes: z.array(outcomeSnapshot),
});

/** A published version: the draft's snapshot with its number, release time and correction note. */
export const versionSnapshotSchema = draftSnapshotSchema.extend({
  version: z.number().int().positive(),
  releaseAt: text,
  note: text.nullable(),
});

export type Message = z.infer<typeof messageSchema>;
export type Footnote = z.infer<typeof footnote>;
export type PairFacts = z.infer<typeof pairFacts>;
export type CertaintyPathFacts = z.infer<typeof certaintyPath>;
export type Reading = z.infer<typeof reading>;
export type OutcomeSnapshot = z.infer<typeof outcomeSnapshot>;
export type DraftSnapshot = z.infer<typeof draftSnapshotSchema>;
export type VersionSnapshot = z.infer<typeof versionSnapshotSchema>;
