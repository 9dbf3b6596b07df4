import { describe, expect, it } from "vitest";
import { formatEffect } from "../../components/charts/scale";

describe("formatEffect", () => {
  it("shows ratios exponentiated and differences as they are", () => {
    expect(formatEffect("OR", Math.log(2))).toBe("2.00");
    expect(formatEffect("MD", -0.256)).toBe("-0.26");
  });
  it("never shows a negative zero", () => {
    expect(formatEffect("MD", -0.001)).toBe("0.00");
  });
});
