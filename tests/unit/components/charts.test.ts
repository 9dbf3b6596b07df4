import { describe, expect, it } from "vitest";
import { formatEffect, formatInterval, formatTick } from "#core/publication/effects";
import { axisTicks } from "#components/charts/scale";

describe("formatEffect", () => {
  it("shows ratios exponentiated and differences as they are", () => {
    expect(formatEffect("OR", Math.log(2))).toBe("2.00");
    expect(formatEffect("MD", -0.256)).toBe("\u22120.26");
  });
  it("writes a true minus sign (U+2212), never a hyphen, and keeps it before the digits in Arabic", () => {
    expect(formatEffect("MD", -11.14)).toBe("−11.1");
    expect(formatInterval("MD", { estimate: -11.14, lower: -14.5, upper: -7.741 }, "to")).toBe("−11.1 (−14.5 to −7.74)");
    expect(formatEffect("MD", -3.92, "es")).toBe("−3,92");
    // Arabic pages: Latin digits (decision 0024) and a left-to-right mark before the sign, so that
    // the sign reads before the digits inside right-to-left text.
    expect(formatEffect("MD", -3.92, "ar")).toBe("\u200e\u22123.92");
  });
  it("gives the axis the same decimals without trailing zeros", () => {
    expect(["MD", "MD", "MD", "OR"].map((m, i) => formatTick(m as "MD" | "OR", [-12, -8, 0.5, Math.log(2)][i]!))).toEqual(["−12", "−8", "0.5", "2"]);
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
