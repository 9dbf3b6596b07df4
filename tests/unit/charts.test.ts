import { describe, expect, it } from "vitest";
import { formatEffect } from "#core/effects";
import { axisTicks } from "#components/charts/scale";

describe("formatEffect", () => {
  it("shows ratios exponentiated and differences as they are", () => {
    expect(formatEffect("OR", Math.log(2))).toBe("2.00");
    expect(formatEffect("MD", -0.256)).toBe("-0.26");
  });
  it("never shows a negative zero", () => {
    expect(formatEffect("MD", -0.001)).toBe("0.00");
  });
});

describe("axisTicks", () => {
  it("puts ratio ticks at round ratios on the log scale", () => {
    const ticks = axisTicks("OR", [Math.log(0.6), Math.log(4.5)], []).map((t) => Number(Math.exp(t).toFixed(2)));
    expect(ticks).toEqual([0.75, 1, 1.5, 2, 3, 4]);
  });
  it("keeps the line of no effect and at most seven ticks", () => {
    const ticks = axisTicks("OR", [Math.log(0.01), Math.log(100)], []);
    expect(ticks.length).toBeLessThanOrEqual(7);
    expect(ticks).toContain(0);
  });
  it("leaves differences to the linear scale's ticks", () => {
    expect(axisTicks("MD", [-5, 5], [-5, 0, 5])).toEqual([-5, 0, 5]);
  });
});
