// Rank scores come only with their three cautions, and never as a sorted leaderboard (PRODUCT.md).
import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { createI18n } from "#components/i18n";
import { rankExplainer } from "#core/grade/rank-explainer";
import { analyse } from "#core/nma/analyse";
import { parseDataset } from "#core/nma/parse";

const csv = readFileSync(path.resolve(__dirname, "../../../fixtures/reference/senn2013.csv"));
const result = analyse(parseDataset(csv, "arm-continuous"), { measure: "MD", model: "random", reference: "placebo", better: "lower", draws: 1000 });

describe("the rank-score explainer", () => {
  const explainer = rankExplainer(result);

  it("names the three reasons scores are not proof: chance, size of the difference, certainty", () => {
    const t = createI18n("en").t;
    const cautions = explainer.cautionKeys.map((key) => t(key));
    expect(cautions).toHaveLength(3);
    expect(cautions[0]).toMatch(/^Chance:/);
    expect(cautions[1]).toMatch(/^Size of the difference:/);
    expect(cautions[2]).toMatch(/^Certainty of the evidence:/);
  });

  it("lists treatments alphabetically, whatever their scores", () => {
    expect(explainer.rows.map((r) => r.treatment)).toEqual([...result.treatments].sort());
    const byScore = [...explainer.rows].sort((a, b) => b.pScore - a.pScore).map((r) => r.treatment);
    expect(byScore).not.toEqual(explainer.rows.map((r) => r.treatment));
  });

  it("carries the scores and the simulation settings", () => {
    expect(explainer.rows.find((r) => r.treatment === "rosiglitazone")!.pScore).toBeCloseTo(0.897780441101909, 5); // metafor 3.8-1, tests/fixtures/reference
    expect(explainer).toMatchObject({ draws: 1000, seed: 1 });
  });
});
