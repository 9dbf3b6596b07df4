// The certainty rules of METHODS.md §8, each with its published source.
import { describe, expect, it } from "vitest";
import {
  directCertainty,
  dominantLoop,
  imprecisionSuggestion,
  incoherenceSuggestion,
  indirectCertainty,
  networkCertainty,
  rateDown,
  riskOfBiasSuggestion,
} from "#core/grade/certainty";
import { unexplainedDepartures } from "#core/grade/judgement";
import { suggestedLevels } from "#core/nma/risk-of-bias";

const none = { levels: 0 as const, reason: "" };

describe("direct estimates (Puhan et al., BMJ 2014;349:g5630, step 1)", () => {
  it("start high for randomised trials", () => {
    expect(directCertainty({ riskOfBias: none, inconsistency: none, indirectness: none, publicationBias: none })).toBe("high");
  });

  it("go down one level per level in each domain, never below very low", () => {
    const one = { levels: 1 as const, reason: "unclear allocation concealment" };
    expect(directCertainty({ riskOfBias: one, inconsistency: none, indirectness: none, publicationBias: none })).toBe("moderate");
    expect(directCertainty({ riskOfBias: one, inconsistency: one, indirectness: none, publicationBias: none })).toBe("low");
    const two = { levels: 2 as const, reason: "high risk of bias" };
    expect(directCertainty({ riskOfBias: two, inconsistency: two, indirectness: one, publicationBias: none })).toBe("very_low");
    expect(rateDown("low", 5)).toBe("very_low");
  });
});

describe("indirect estimates (Puhan et al. 2014, step 2)", () => {
  // Direct variances of a small network: A–C 0.04, C–B 0.05 (sum 0.09); A–D 0.01, D–B 0.10 (sum 0.11).
  const variances: Record<string, number> = { "A|C": 0.04, "B|C": 0.05, "A|D": 0.01, "B|D": 0.1 };
  const directVariance = (x: string, y: string) => variances[[x, y].sort().join("|")] ?? null;

  it("come from the first-order loop with the smallest sum of direct variances", () => {
    expect(dominantLoop("A", "B", ["A", "B", "C", "D"], directVariance)).toEqual({ via: "C", first: ["A", "C"], second: ["C", "B"] });
  });

  it("have no loop when no treatment shares direct evidence with both", () => {
    expect(dominantLoop("A", "B", ["A", "B", "E"], directVariance)).toBeNull();
  });

  it("take the lower certainty of the loop's two direct estimates, then intransitivity", () => {
    expect(indirectCertainty("high", "moderate", none)).toBe("moderate");
    expect(indirectCertainty("high", "moderate", { levels: 1, reason: "older trials used lower doses" })).toBe("low");
  });
});

describe("network estimates (Brignardello-Petersen et al., J Clin Epidemiol 2018;93:36–44)", () => {
  it("take the higher of the direct and indirect certainties", () => {
    expect(networkCertainty({ direct: "low", indirect: "moderate", incoherence: none, imprecision: none })).toBe("moderate");
  });

  it("take the dominant source where the analyst says one dominates", () => {
    expect(networkCertainty({ direct: "low", indirect: "moderate", dominant: "direct", incoherence: none, imprecision: none })).toBe("low");
  });

  it("use the only source there is, and wait for a judgement when there is none", () => {
    expect(networkCertainty({ direct: null, indirect: "low", incoherence: none, imprecision: none })).toBe("low");
    expect(networkCertainty({ direct: null, indirect: null, incoherence: none, imprecision: none })).toBeNull();
  });

  it("go down by the confirmed incoherence and imprecision levels", () => {
    expect(networkCertainty({ direct: "high", indirect: "moderate", incoherence: { levels: 1, reason: "" }, imprecision: { levels: 2, reason: "" } })).toBe("very_low");
  });
});

describe("suggestions", () => {
  it("rate down one level for incoherence when p < 0.05 (Brignardello-Petersen et al. 2018)", () => {
    expect(incoherenceSuggestion({ z: 2.2, p: 0.028 }).levels).toBe(1);
    expect(incoherenceSuggestion({ z: 1.5, p: 0.13 }).levels).toBe(0);
    expect(incoherenceSuggestion(null).levels).toBe(0);
  });

  it("rate down for imprecision by the thresholds the CI crosses (Brignardello-Petersen et al., J Clin Epidemiol 2021;139:49–56)", () => {
    const thresholds = { small: 0.1, moderate: 0.3, large: 0.6 };
    expect(imprecisionSuggestion({ lower: 0.35, upper: 0.55 }, thresholds).levels).toBe(0);
    expect(imprecisionSuggestion({ lower: 0.2, upper: 0.5 }, thresholds).levels).toBe(1);
    expect(imprecisionSuggestion({ lower: 0.05, upper: 0.5 }, thresholds).levels).toBe(2);
    expect(imprecisionSuggestion({ lower: -0.4, upper: 0.7 }, thresholds).levels).toBe(2);
  });

  it("use the line of no effect when the outcome has no thresholds (minimally contextualised)", () => {
    const noThresholds = { small: null, moderate: null, large: null };
    expect(imprecisionSuggestion({ lower: -0.1, upper: 0.4 }, noThresholds)).toEqual({
      levels: 1,
      because: { key: "certainty.imprecision.crossesNull", values: { count: 1 } },
    });
    expect(imprecisionSuggestion({ lower: 0.1, upper: 0.4 }, noThresholds).levels).toBe(0);
  });
});

describe("assessing every comparison of an outcome (METHODS.md §8)", async () => {
  const { assessCertainty } = await import("#core/grade/assess");
  const { analyse } = await import("#core/nma/analyse");
  const { parseDataset } = await import("#core/nma/parse");
  const { pairKey } = await import("#core/nma/pairs");
  // The hand-worked triangle of tests/unit/core/nma/worked-example.test.ts: every pair has direct evidence.
  const csv = "study,treatment1,treatment2,estimate,se\nS1,B,A,1.0,0.5\nS2,C,A,2.0,0.5\nS3,C,B,0.5,1.0\n";
  const result = analyse(parseDataset(csv, "contrast"), { measure: "MD", model: "fixed", reference: "A", better: "higher" });
  const thresholds = { small: null, moderate: null, large: null };
  const clean = { riskOfBias: none, inconsistency: none, indirectness: none, publicationBias: none };
  const oneDown = { ...clean, riskOfBias: { levels: 1 as const, reason: "open-label trial" } };

  it("lists every part as pending before any judgement", () => {
    const [first] = assessCertainty(result, new Map(), thresholds);
    expect(first!.pending).toEqual(["direct", "indirect", "incoherence", "imprecision"]);
    expect(first!.network).toBeNull();
  });

  it("derives indirect certainty from the loop's direct judgements and the network certainty from the decisions", () => {
    const judgements = new Map([
      [pairKey("A", "B"), { direct: clean, incoherence: { levels: 0, reason: "" }, imprecision: { levels: 0, reason: "" } }],
      [pairKey("A", "C"), { direct: clean }],
      [pairKey("B", "C"), { direct: oneDown }],
    ]);
    const ab = assessCertainty(result, judgements, thresholds).find((c) => c.treatment === "A" && c.comparator === "B")!;
    expect(ab.direct).toBe("high");
    expect(ab.indirectVia).toBe("C");
    expect(ab.indirect).toBe("moderate"); // the lower of A–C (high) and C–B (moderate)
    expect(ab.network).toBe("high"); // the higher of direct and indirect, nothing confirmed against it
    expect(ab.pending).toEqual([]);
  });
});

describe("the risk-of-bias suggestion (METHODS.md §13, common practice)", () => {
  const shares = (low: number, someConcerns: number, high: number, notAssessed: number) => {
    const s = { low, someConcerns, high, notAssessed };
    return { ...s, suggestedLevels: suggestedLevels(s) };
  };

  it("rates down by the level carrying the largest share of the weight", () => {
    expect(riskOfBiasSuggestion(shares(0.6, 0.3, 0.1, 0))).toEqual({ levels: 0, because: { key: "certainty.riskOfBias.low", values: { share: 60 } } });
    expect(riskOfBiasSuggestion(shares(0.2, 0.5, 0.3, 0))?.levels).toBe(1);
    expect(riskOfBiasSuggestion(shares(0.1, 0.2, 0.4, 0.3))).toEqual({ levels: 2, because: { key: "certainty.riskOfBias.high", values: { share: 40 } } });
  });

  it("gives a tie to the worse level", () => {
    expect(riskOfBiasSuggestion(shares(0.5, 0.5, 0, 0))?.levels).toBe(1);
    expect(riskOfBiasSuggestion(shares(0.4, 0.2, 0.4, 0))?.levels).toBe(2);
  });

  it("suggests nothing when more than half of the weight is not assessed, or there are no shares", () => {
    expect(riskOfBiasSuggestion(shares(0.2, 0.1, 0.1, 0.6))).toBeNull();
    expect(riskOfBiasSuggestion(shares(0.5, 0, 0, 0.5))?.levels).toBe(0);
    expect(riskOfBiasSuggestion(null)).toBeNull();
  });

  it("lets a confirmed suggestion stand without a reason, and asks for one to depart from it", () => {
    const suggestion = riskOfBiasSuggestion(shares(0.1, 0.2, 0.7, 0));
    const current = { suggestions: { incoherence: { levels: 0, because: { key: "", values: {} } }, imprecision: { levels: 0, because: { key: "", values: {} } }, riskOfBias: suggestion } };
    const direct = (levels: 0 | 1 | 2, reason: string) => ({ direct: { riskOfBias: { levels, reason }, inconsistency: none, indirectness: none, publicationBias: none } });
    expect(unexplainedDepartures(direct(2, ""), current)).toEqual([]);
    expect(unexplainedDepartures(direct(1, ""), current)).toEqual(["riskOfBias"]);
    expect(unexplainedDepartures(direct(1, "Blinded outcome assessment in the largest trial"), current)).toEqual([]);
    // Without a suggestion, rating down needs its reason as in every direct domain.
    expect(unexplainedDepartures(direct(1, ""), { suggestions: { ...current.suggestions, riskOfBias: null } })).toEqual(["riskOfBias"]);
  });
});
