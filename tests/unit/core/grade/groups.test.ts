// Grouping by the minimally contextualised framework (Brignardello-Petersen et al., BMJ 2020;371:m3900; METHODS.md §9).
import { describe, expect, it } from "vitest";
import type { Rating } from "#core/grade/certainty";
import { groupByMagnitude, groupTreatments, type PairEvidence } from "#core/grade/groups";

/** Evidence from a table of "t vs u" entries; the reverse order is the negation; unlisted pairs are null effects. */
function table(entries: Record<string, [number, number, Rating | null]>) {
  return (t: string, u: string): PairEvidence => {
    const direct = entries[`${t} vs ${u}`];
    if (direct) return { estimate: (direct[0] + direct[1]) / 2, lower: direct[0], upper: direct[1], certainty: direct[2] };
    const reverse = entries[`${u} vs ${t}`];
    if (reverse) return { estimate: -(reverse[0] + reverse[1]) / 2, lower: -reverse[1], upper: -reverse[0], certainty: reverse[2] };
    return { estimate: 0, lower: -1, upper: 1, certainty: "high" };
  };
}

describe("a worked example (higher is better, reference R)", () => {
  // Step 1, against R: A (0.2 to 0.8, high), B (0.5 to 1.5, moderate) and C (0.1 to 1.0, low) are
  //   convincingly better; D (−0.2 to 0.4) is not; E (−1.0 to −0.2, moderate) is convincingly worse;
  //   F (0.3 to 0.9) excludes the null but its certainty is very low, so it is not convincing.
  // Step 2, among the better ones: B vs A (0.1 to 0.9, moderate) is convincing, so B is 1 + level(A) = 2;
  //   C vs A (−0.3 to 0.5) is not, and A and C are better than no other better treatment: level 1.
  // Step 3, firmness from each treatment's certainty against R: A firm, B firm, C "may" (low);
  //   F is listed apart as very uncertain. R and D stay at level 0, E is level −1.
  const evidence = table({
    "A vs R": [0.2, 0.8, "high"],
    "B vs R": [0.5, 1.5, "moderate"],
    "C vs R": [0.1, 1.0, "low"],
    "D vs R": [-0.2, 0.4, "high"],
    "E vs R": [-1.0, -0.2, "moderate"],
    "F vs R": [0.3, 0.9, "very_low"],
    "B vs A": [0.1, 0.9, "moderate"],
    "C vs A": [-0.3, 0.5, "low"],
  });

  it("gives the levels, split by firmness, best first and the very uncertain apart", () => {
    expect(groupTreatments(["A", "B", "C", "D", "E", "F", "R"], "R", "higher", evidence)).toEqual([
      { level: 2, firmness: "firm", treatments: ["B"] },
      { level: 1, firmness: "firm", treatments: ["A"] },
      { level: 1, firmness: "may", treatments: ["C"] },
      { level: 0, firmness: "firm", treatments: ["D", "R"] },
      { level: -1, firmness: "firm", treatments: ["E"] },
      { level: 0, firmness: "very-uncertain", treatments: ["F"] },
    ]);
  });

  it("mirrors everything when lower is better", () => {
    const mirrored = (t: string, u: string) => {
      const e = evidence(t, u);
      return { ...e, estimate: -e.estimate, lower: -e.upper, upper: -e.lower };
    };
    const groups = groupTreatments(["A", "B", "C", "D", "E", "F", "R"], "R", "lower", mirrored);
    expect(groups[0]).toEqual({ level: 2, firmness: "firm", treatments: ["B"] });
    expect(groups.find((g) => g.level === -1)?.treatments).toEqual(["E"]);
  });
});

describe("edge cases", () => {
  it("puts everything in one group when nothing differs from the reference", () => {
    expect(groupTreatments(["A", "B", "R"], "R", "higher", table({}))).toEqual([{ level: 0, firmness: "firm", treatments: ["A", "B", "R"] }]);
  });

  it("keeps tied treatments together: better than the reference, not than each other", () => {
    const evidence = table({ "A vs R": [0.2, 0.8, "high"], "B vs R": [0.3, 0.9, "high"], "B vs A": [-0.2, 0.4, "high"] });
    expect(groupTreatments(["A", "B", "R"], "R", "higher", evidence)[0]).toEqual({ level: 1, firmness: "firm", treatments: ["A", "B"] });
  });

  it("does not count a comparison that is not yet rated as convincing, and lists it as not assessed, never as very low (METHODS.md §9)", () => {
    const evidence = table({ "A vs R": [0.2, 0.8, null] });
    expect(groupTreatments(["A", "R"], "R", "higher", evidence)).toEqual([
      { level: 0, firmness: "firm", treatments: ["R"] },
      { level: 0, firmness: "not-assessed", treatments: ["A"] },
    ]);
  });

  it("builds a chain of levels: C better than B better than A better than R", () => {
    const evidence = table({
      "A vs R": [0.1, 0.5, "high"],
      "B vs R": [0.5, 1.0, "high"],
      "C vs R": [1.0, 1.5, "high"],
      "B vs A": [0.1, 0.6, "high"],
      "C vs B": [0.1, 0.6, "high"],
      "C vs A": [0.5, 1.0, "high"],
    });
    expect(groupTreatments(["A", "B", "C", "R"], "R", "higher", evidence).map((g) => [g.level, g.treatments])).toEqual([
      [3, ["C"]],
      [2, ["B"]],
      [1, ["A"]],
      [0, ["R"]],
    ]);
  });
});

describe("the partially contextualised variant (same paper: thresholds replace the null)", () => {
  // Thresholds small 0.2, moderate 0.5, large 1.0, higher is better. Against R, by point estimate:
  //   A 0.5 (0.2 to 0.8, high) reaches the moderate threshold: level 2, firm.
  //   B 1.0 (0.5 to 1.5, moderate) reaches large: level 3, firm.
  //   C 0.55 (0.1 to 1.0, low) is moderate too, but low certainty: level 2, "may".
  //   D 0.1 (−0.2 to 0.4) is under the small threshold: level 0 with R.
  //   E −0.6 (−1.0 to −0.2, moderate) is a moderate harm: level −2.
  //   F 0.6 (0.3 to 0.9, very low) is listed apart.
  // Comparisons between non-reference treatments play no part here, unlike the minimal framework.
  const evidence = table({
    "A vs R": [0.2, 0.8, "high"],
    "B vs R": [0.5, 1.5, "moderate"],
    "C vs R": [0.1, 1.0, "low"],
    "D vs R": [-0.2, 0.4, "high"],
    "E vs R": [-1.0, -0.2, "moderate"],
    "F vs R": [0.3, 0.9, "very_low"],
  });
  const thresholds = { small: 0.2, moderate: 0.5, large: 1.0 };

  it("places each treatment by the size of its effect against the reference", () => {
    expect(groupByMagnitude(["A", "B", "C", "D", "E", "F", "R"], "R", "higher", thresholds, evidence)).toEqual([
      { level: 3, firmness: "firm", treatments: ["B"] },
      { level: 2, firmness: "firm", treatments: ["A"] },
      { level: 2, firmness: "may", treatments: ["C"] },
      { level: 0, firmness: "firm", treatments: ["D", "R"] },
      { level: -2, firmness: "firm", treatments: ["E"] },
      { level: 0, firmness: "very-uncertain", treatments: ["F"] },
    ]);
  });

  it("skips a threshold left empty: with only 'small', levels run from −1 to 1", () => {
    const groups = groupByMagnitude(["A", "B", "E", "R"], "R", "higher", { small: 0.2, moderate: null, large: null }, evidence);
    expect(groups.map((g) => [g.level, g.treatments])).toEqual([
      [1, ["A", "B"]],
      [0, ["R"]],
      [-1, ["E"]],
    ]);
  });

  it("reads the estimate the other way when lower is better", () => {
    const groups = groupByMagnitude(["E", "R"], "R", "lower", thresholds, evidence);
    expect(groups[0]).toEqual({ level: 2, firmness: "firm", treatments: ["E"] });
  });
});
