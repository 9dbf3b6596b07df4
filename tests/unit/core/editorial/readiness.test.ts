// Whether a draft may be approved (server/core/editorial/readiness.ts): what blocks it, listed with
// the facts the desk words.
import { describe, expect, it } from "vitest";
import { readinessOf } from "#core/editorial/readiness";

describe("a draft's readiness", () => {
  it("is blocked by empty texts, unnamed treatments and an outcome without a current analysis", () => {
    const readiness = readinessOf({
      laySummary: " ",
      shortTake: "",
      treatments: [{ label: "light", named: true, displayName: "Timed light" }, { label: "usual_care", named: false }, { label: "walking", named: false }],
      outcomes: [{ name: "Good sleep", current: false, result: null, certainty: null }],
    });
    expect(readiness.blocking).toEqual([
      { key: "readiness.noShortTake", values: {} },
      { key: "readiness.noSummary", values: {} },
      { key: "readiness.unnamed", values: { count: 2, labels: "usual_care, walking" } },
      { key: "readiness.noAnalysis", values: { outcome: "Good sleep" } },
    ]);
    expect(readiness.warnings).toEqual([]);
  });

  it("blocks a brief without an outcome by saying so, not with an outcome named “—”", () => {
    expect(readinessOf({ laySummary: "Plain words.", shortTake: "In short.", treatments: [{ label: "a", named: true }], outcomes: [] })).toEqual({ blocking: [{ key: "readiness.noOutcome", values: {} }], warnings: [] });
  });
});
