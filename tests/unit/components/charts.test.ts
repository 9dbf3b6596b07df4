import { describe, expect, it } from "vitest";
import { formatEffect, formatInterval, formatTick } from "#core/publication/effects";
import { axisTicks } from "#components/charts/scale";
import { dotStates, dotsOf, pictographAlt } from "#core/publication/pictograph";

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

describe("the pictograph's dots (components/charts/Pictograph.tsx)", () => {
  it("fills one dot of 100 for each 10 in 1000, rounded, and bands the confidence interval", () => {
    // 70 in 1000 with the comparator: 7 dots; 152 (80 to 271) with the option: 8 filled, 19 in the band.
    const comparator = dotStates({ estimate: 70 });
    expect(comparator.filter((s) => s === "has")).toHaveLength(7);
    expect(comparator.filter((s) => s === "band")).toHaveLength(0);
    const option = dotStates({ estimate: 152, lower: 79.6, upper: 271.2 });
    expect(option.slice(0, 8).every((s) => s === "has")).toBe(true);
    expect(option.filter((s) => s === "band")).toHaveLength(19);
    expect(option.filter((s) => s === "hasNot")).toHaveLength(73);
  });
  it("keeps within 0 and 100 dots whatever the interval", () => {
    expect(dotStates({ estimate: 990, lower: 950, upper: 1200 }).filter((s) => s !== "hasNot")).toHaveLength(100);
    expect(dotsOf(-4)).toBe(0);
  });
  it("gives its sentence the numbers per 1000, rounded, as each language writes them (the page and the card alike)", () => {
    const input = { outcome: "Headache gone", comparatorName: "Placebo", optionName: "Compound A", comparatorPer1000: 204.6, option: { estimate: 150.4, lower: 99.5, upper: 1210.2 } };
    const numbers = { comparator: "205", estimate: "150", lower: "100", upper: "1210" };
    // No grouping (decision 0024) and Western digits in Arabic, so the four languages agree.
    for (const locale of ["en", "es", "fr", "ar"] as const) {
      expect(pictographAlt(input, locale)).toEqual({ outcome: "Headache gone", comparatorName: "Placebo", optionName: "Compound A", ...numbers });
    }
  });
});
