// A certainty for every comparison of a connected network, also for the pairs no trial compared
// (METHODS.md §8 steps 4 and 5), on the invented six-option network of tests/support/six-options.ts.
import { describe, expect, it } from "vitest";
import { assessCertainty, type ComparisonJudgement } from "#core/grade/assess";
import { certaintyPath } from "#core/grade/path";
import { analyse } from "#core/nma/analyse";
import { parseDataset } from "#core/nma/parse";
import { pairKey } from "#core/nma/pairs";
import { indirectOnlyPairs, sixOptionsCsv, withoutLoop } from "#tests/support/six-options";

const result = analyse(parseDataset(Buffer.from(sixOptionsCsv), "arm-binary"), { measure: "OR", model: "fixed", reference: "placebo", better: "higher", draws: 200 });
const none = { levels: 0 as const, reason: "" };
const clean = { riskOfBias: none, inconsistency: none, indirectness: none, publicationBias: none };
const thresholds = { small: null, moderate: null, large: null };
const key = (a: string, b: string) => [a, b].sort().join("|");

/** As an analyst confirming the suggestions: direct evidence judged clean except where said, incoherence and imprecision as suggested. */
function judge(extra: (pair: string) => Partial<ComparisonJudgement> = () => ({})) {
  const first = assessCertainty(result, new Map(), thresholds);
  return new Map(
    first.map((c) => [
      pairKey(c.treatment, c.comparator),
      {
        ...(c.pending.includes("direct") ? { direct: key(c.treatment, c.comparator) === "beta|delta" ? { ...clean, riskOfBias: { levels: 1 as const, reason: "Open-label (invented)." } } : clean } : {}),
        incoherence: { levels: c.suggestions.incoherence.levels, reason: "" },
        imprecision: { levels: c.suggestions.imprecision.levels, reason: "" },
        ...extra(key(c.treatment, c.comparator)),
      } satisfies ComparisonJudgement,
    ]),
  );
}

describe("pairs that no trial compared (METHODS.md §8 step 4)", () => {
  it("the network has fifteen pairs, nine of them wholly indirect", () => {
    expect(result.comparisons).toHaveLength(15);
    expect(result.comparisons.filter((c) => c.direct === null).map((c) => key(c.treatment, c.comparator)).sort()).toEqual(indirectOnlyPairs);
  });

  it("take their indirect certainty from the dominant first-order loop, and need no incoherence judgement", () => {
    const assessed = assessCertainty(result, judge(), thresholds);
    const alphaDelta = assessed.find((c) => key(c.treatment, c.comparator) === "alpha|delta")!;
    expect(alphaDelta.direct).toBeNull();
    expect(alphaDelta.indirectVia).toBe("beta");
    // The lower of alpha–beta (high) and beta–delta (moderate: one level down for risk of bias).
    expect(alphaDelta.indirect).toBe("moderate");
    expect(alphaDelta.pending).toEqual([]);
    expect(alphaDelta.network).not.toBeNull();
  });

  it("without a first-order loop wait for the analysts' rating, then every one of the fifteen has a certainty", () => {
    const before = assessCertainty(result, judge(), thresholds);
    expect(before.filter((c) => c.network === null).map((c) => key(c.treatment, c.comparator)).sort()).toEqual(withoutLoop);
    expect(before.filter((c) => c.network === null).every((c) => c.pending.join() === "indirect" && c.indirectVia === null)).toBe(true);

    const set = (pair: string) => (withoutLoop.includes(pair) ? { indirectRating: { rating: "low" as const, reason: "From the path through two other options (invented)." } } : {});
    const after = assessCertainty(result, judge(set), thresholds);
    expect(after.filter((c) => c.network === null)).toEqual([]);
    const deltaEpsilon = after.find((c) => key(c.treatment, c.comparator) === "delta|epsilon")!;
    expect(deltaEpsilon.indirect).toBe("low");
  });
});

describe("the path a reader can add up (METHODS.md §8 step 5)", () => {
  const assessed = assessCertainty(result, judge((pair) => (pair === "alpha|delta" ? { imprecision: { levels: 2, reason: "Crosses the line of no effect widely (invented)." } } : {})), thresholds);
  const directOf = (x: string, y: string) => assessed.find((c) => key(c.treatment, c.comparator) === key(x, y))?.direct ?? null;

  it("for a wholly indirect pair: no direct certainty, the loop and its two sides, the indirect start, the network's steps", () => {
    const c = assessed.find((x) => key(x.treatment, x.comparator) === "alpha|delta")!;
    const path = certaintyPath(c, directOf)!;
    expect(path.direct).toBeNull();
    const sides = c.treatment === "alpha" ? ["high", "moderate"] : ["moderate", "high"];
    expect(path.indirect).toEqual({ rating: "moderate", via: "beta", sides, steps: [], reason: null });
    expect(path.took).toBe("indirect");
    expect(path.steps).toEqual([{ domainKey: "certainty.domain.imprecision", levels: 2 }]);
    // Moderate, two levels down: very low. The steps add up to the published rating.
    expect(path.rating).toBe("very_low");
  });

  it("for a pair with both: the direct steps, and the higher of the two taken", () => {
    const c = assessed.find((x) => key(x.treatment, x.comparator) === "beta|delta")!;
    const path = certaintyPath(c, directOf)!;
    expect(path.direct).toEqual({ rating: "moderate", steps: [{ domainKey: "certainty.domain.riskOfBias", levels: 1 }] });
    expect(path.indirect).toBeNull(); // beta–delta has no indirect evidence: delta is joined to beta alone
    expect(path.took).toBe("direct");
    expect(path.rating).toBe(c.network);
  });
});
