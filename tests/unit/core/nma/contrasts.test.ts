// Arm effects and their variances (server/core/nma/contrasts.ts, METHODS.md §2), worked out by hand
// from the formulas: log odds log(e/(n − e)) with variance 1/e + 1/(n − e); log risk log(e/n) with
// variance 1/e − 1/n; a mean with variance sd²/n; 0.5 added to events and non-events of every arm of
// a study with a zero or full cell (Sweeting, Sutton & Lambert 2004, common practice), and a study
// with no events (or only events) in every arm dropped for ratio measures.
import { describe, expect, it } from "vitest";
import { armEffects } from "#core/nma/contrasts";
import type { ParsedStudy } from "#core/nma/types";

const binary = (study: string, arms: [string, number, number][]): ParsedStudy => ({ format: "arm-binary", study, arms: arms.map(([treatment, events, total], row) => ({ treatment, events, total, row })) });

describe("arm effects", () => {
  it("of a binary arm are its log odds: 75 of 731 is −2.168673, variance 0.014858", () => {
    const [study] = armEffects([binary("S001", [["no_contact", 75, 731], ["counselling", 363, 714]])], "OR").studies;
    expect(study!.effects[0]).toBeCloseTo(-2.168673, 6);
    expect(study!.variances[0]).toBeCloseTo(0.014858, 6);
  });

  it("for a risk ratio are its log risks: 75 of 731 is log(0.102599) with variance 1/75 − 1/731", () => {
    const [study] = armEffects([binary("S001", [["no_contact", 75, 731], ["counselling", 363, 714]])], "RR").studies;
    expect(study!.effects[0]).toBeCloseTo(Math.log(75 / 731), 12);
    expect(study!.variances[0]).toBeCloseTo(1 / 75 - 1 / 731, 12);
  });

  it("take 0.5 more events and non-events in every arm of a study with a zero cell: 0 of 10 reads 0.5 of 11", () => {
    const [study] = armEffects([binary("S002", [["a", 0, 10], ["b", 3, 10]])], "OR").studies;
    expect(study!.effects).toEqual([expect.closeTo(-3.044522, 6), expect.closeTo(-0.76214, 6)]);
    expect(study!.variances).toEqual([expect.closeTo(2.095238, 6), expect.closeTo(0.419048, 6)]);
  });

  it("leave out a study with no events in any arm for a ratio measure, and say why", () => {
    const result = armEffects([binary("S003", [["a", 0, 10], ["b", 0, 12]]), binary("S004", [["a", 5, 10], ["b", 5, 10]])], "OR");
    expect(result.excluded).toEqual([{ study: "S003", reason: "no-events" }]);
    expect(result.studies.map((study) => study.study)).toEqual(["S004"]);
  });

  it("of a continuous arm are its mean, with variance sd²/n: sd 12 over 36 people is 4", () => {
    const [study] = armEffects([{ format: "arm-continuous", study: "C1", arms: [{ treatment: "a", mean: 50, sd: 12, n: 36, row: 1 }, { treatment: "b", mean: 45, sd: 10, n: 25, row: 2 }] }], "MD").studies;
    expect(study!.effects).toEqual([50, 45]);
    expect(study!.variances).toEqual([4, 4]);
  });
});
