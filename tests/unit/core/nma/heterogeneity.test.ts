// Heterogeneity (server/core/nma/heterogeneity.ts, METHODS.md §4): the χ² upper tail against the
// published table of critical values (NIST/SEMATECH e-Handbook of Statistical Methods, §1.3.6.7.4,
// upper 5% points), I² as Higgins & Thompson define it (Stat Med 2002;21:1539), and the degrees of
// freedom of a network.
import { describe, expect, it } from "vitest";
import { chiSquareUpper, degreesOfFreedom, heterogeneity } from "#core/nma/heterogeneity";
import type { ArmEffects } from "#core/nma/types";

describe("the χ² upper tail", () => {
  it.each([
    [3.841, 1],
    [5.991, 2],
    [11.07, 5],
    [18.307, 10],
  ])("is 0.05 at the table's upper 5%% point %s with %s degrees of freedom", (q, df) => {
    expect(chiSquareUpper(q, df)).toBeCloseTo(0.05, 3);
  });

  it("is absent where there are no degrees of freedom, and 1 at zero", () => {
    expect(chiSquareUpper(4, 0)).toBeNull();
    expect(chiSquareUpper(0, 3)).toBe(1);
  });
});

describe("I²", () => {
  it("is (Q − df)/Q: Q 20 on 10 degrees of freedom is 50%", () => {
    expect(heterogeneity(20, 10)).toMatchObject({ Q: 20, df: 10, I2: 0.5 });
    expect(heterogeneity(20, 10).p).toBeCloseTo(0.029253, 6);
  });

  it("is 0, never negative, when Q is below its degrees of freedom", () => {
    expect(heterogeneity(6, 10).I2).toBe(0);
    expect(heterogeneity(0, 0).I2).toBe(0);
  });
});

describe("the degrees of freedom of a network", () => {
  it("are the contrasts minus the parameters: two 2-arm studies and one 3-arm study of 3 treatments give 2", () => {
    const study = (treatments: string[]): ArmEffects => ({ study: treatments.join(""), treatments, effects: treatments.map(() => 0), variances: treatments.map(() => 1), participants: treatments.map(() => null) });
    expect(degreesOfFreedom([study(["A", "B"]), study(["A", "C"]), study(["A", "B", "C"])], 3)).toBe(2);
  });
});
