// Stored snapshots of every earlier shape are read through the numbered upgrades of
// server/core/snapshot/upgrade.ts (docs/decisions/0012-snapshot-contract.md). The fixtures in
// tests/fixtures/snapshots/ are frozen JSON of shape 1, written as the code before shape 2 stored a
// version of the invented network of tests/support/invented-network.ts.
import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { briefContent, comparisonContent } from "#core/publication/brief-page";
import { readSnapshot, SnapshotError, upgrades } from "#core/snapshot/upgrade";
import { snapshotSchemaVersion } from "#core/snapshot/schema";

const fixture = (name: string) => JSON.parse(readFileSync(path.resolve(__dirname, "../../../fixtures/snapshots", name), "utf8")) as Record<string, unknown>;

describe("a snapshot of shape 1 (frozen before schemaVersion)", () => {
  const stored = fixture("shape-1.json");
  const snapshot = readSnapshot(stored);

  it("is brought to the current shape and passes the declared schema", () => {
    expect(snapshotSchemaVersion).toBe(6);
    expect(snapshot.schemaVersion).toBe(6);
    expect(snapshot.outcomes[0]!.pairs).toHaveLength(3); // three treatments: three pairs
  });

  it("gets the facts publishing now stores, computed from what it froze", () => {
    const comparison = comparisonContent(snapshot, "alpha", "placebo")!.outcomes[0]!;
    // s1 and s4 compare alpha with placebo: (100 + 100) + (120 + 120) participants, worked by hand.
    expect(comparison.direct).toMatchObject({ studies: 2, participants: 440 });
    // The frozen result's direct estimate with its 95% CI, estimate ± 1.959964·SE (METHODS.md §3).
    const result = (stored.outcomes as { result: { comparisons: { treatment: string; comparator: string; direct: { estimate: number; se: number } }[] } }[])[0]!.result;
    const pair = result.comparisons.find((c) => [c.treatment, c.comparator].sort().join() === "alpha,placebo")!;
    const sign = pair.treatment === "alpha" ? 1 : -1;
    expect(comparison.direct!.estimate).toBeCloseTo(sign * pair.direct.estimate, 12);
    expect(comparison.direct!.upper - comparison.direct!.estimate).toBeCloseTo(1.959964 * pair.direct.se, 6);
    // The analyst's reason for rating down, as its footnote.
    expect(comparison.footnotes).toContainEqual({ domainKey: "certainty.domain.riskOfBias", levels: 1, reason: "Allocation was not concealed in s1.", because: null });
  });

  it("keeps the conclusions it froze, in today's words (shape 6: no thresholds, so no “little to no difference”; moderate certainty hedged)", () => {
    const outcome = (stored.outcomes as { groups: { label: { key: string } }[]; readings: { magnitude: string; statement: { key: string } }[] }[])[0]!;
    // Alpha and beta were both rated moderate against placebo: their group reads "probably among the most effective".
    expect(snapshot.outcomes[0]!.groups.map((g) => g.label.key)).toEqual(["groups.minimal.best.probably", "groups.referenceOnly"]);
    expect(snapshot.outcomes[0]!.groups.map(({ label: _, ...g }) => g)).toEqual(outcome.groups.map(({ label: _, ...g }) => g));
    // Alpha against beta: the 95% CI includes the null, frozen as "trivial", now "does not show a clear difference".
    expect(snapshot.outcomes[0]!.readings.map((r) => `${r.treatment} ${r.comparator} ${r.magnitude} ${r.statement!.key}`)).toEqual([
      "alpha beta unclear statement.moderate.unclear",
      "alpha placebo moderate statement.moderate.moderate.increase",
      "beta alpha unclear statement.moderate.unclear",
      "beta placebo moderate statement.moderate.moderate.increase",
      "placebo alpha moderate statement.moderate.moderate.reduce",
      "placebo beta moderate statement.moderate.moderate.reduce",
    ]);
    expect(outcome.readings.map((r) => r.magnitude)).toContain("trivial");
  });

  it("reads the same after a round trip: an upgraded snapshot is a current one", () => {
    expect(readSnapshot(JSON.parse(JSON.stringify(snapshot)))).toEqual(snapshot);
  });
});

describe("a snapshot of shape 1 from before conclusions were frozen", () => {
  const snapshot = readSnapshot(fixture("shape-1-before-conclusions.json"));

  it("renders with what it holds: unlabelled groups get the plain level label, no statements, rank scores from the frozen result", () => {
    const outcome = snapshot.outcomes[0]!;
    expect(outcome.framework).toBe("minimal");
    expect(outcome.groups.every((g) => g.label.key === "groups.level")).toBe(true);
    expect(outcome.readings).toEqual([]);
    expect(outcome.rankScores.rows.map((r) => r.treatment)).toEqual(["alpha", "beta", "placebo"]); // alphabetical, never by score
    const view = briefContent(snapshot).outcomes[0]!;
    expect(view.effects.map((e) => e.statement)).toEqual([null, null]);
  });
});

describe("a snapshot that cannot be read", () => {
  it("of an unknown shape is refused with the shape named", () => {
    expect(() => readSnapshot({ ...fixture("shape-1.json"), schemaVersion: 99 })).toThrow(new SnapshotError("a snapshot of shape 99 cannot be read (known: 1 to 6)"));
  });

  it("that breaks the schema is refused with the path of what is wrong", () => {
    const broken = readSnapshot(fixture("shape-1.json"));
    expect(() => readSnapshot({ ...broken, version: "one" })).toThrow(/version: /);
  });
});

describe("shape 2 → 3: thresholds of binary outcomes per 1000 people (METHODS.md §9)", () => {
  const outcome = (kind: string, measure: string, baselineRisk: number | null, small: number | null) => ({ kind, settings: { measure }, baselineRisk, thresholds: { small, moderate: null, large: null } });
  const upgraded = upgrades[1]!({
    schemaVersion: 2,
    outcomes: [outcome("binary", "OR", 0.3, Math.log(2)), outcome("binary", "RR", 0.2, Math.log(1.5)), outcome("binary", "RD", 0.1, 0.05), outcome("binary", "OR", null, 0.4), outcome("continuous", "MD", null, 3)],
  });
  it("converts as migration 0008 does: OR 2 at 0.3 is 161.5 more per 1000, RR 1.5 at 0.2 is 100, RD 0.05 is 50 (worked by hand)", () => {
    expect(upgraded.schemaVersion).toBe(3);
    expect((upgraded.outcomes as { thresholds: { small: number | null } }[]).map((o) => o.thresholds.small)).toEqual([161.5, 100, 50, null, 3]);
  });
});

describe("shape 3 → 4: study importances and risk of bias (METHODS.md §13)", () => {
  it("names the footnotes' domains by the public pages' own keys", () => {
    const upgraded = upgrades[2]!({ schemaVersion: 3, outcomes: [{ pairs: [{ footnotes: [{ domainKey: "desk.domain.imprecision" }, { domainKey: "certainty.footnote.intransitivity" }] }] }] });
    expect((upgraded.outcomes[0]!.pairs as { footnotes: unknown[] }[])[0]!.footnotes).toEqual([{ domainKey: "certainty.domain.imprecision" }, { domainKey: "certainty.footnote.intransitivity" }]);
  });

  it("reads them as not known in versions frozen before they were computed, and keeps what is there", () => {
    const upgraded = upgrades[2]!({ schemaVersion: 3, outcomes: [{ pairs: [{ treatment: "a", comparator: "b", footnotes: [] }] }] });
    expect(upgraded).toEqual({ schemaVersion: 4, outcomes: [{ riskOfBias: null, pairs: [{ treatment: "a", comparator: "b", importance: null, riskOfBias: null, footnotes: [] }] }] });
  });
});

describe("shape 4 → 5: the author and the short take under the product's own names", () => {
  it("moves the frozen words to the new fields, unchanged", () => {
    const upgraded = upgrades[3]!({ schemaVersion: 4, brief: { slug: "s", reviewGroup: "Northfield Evidence Unit" }, texts: { laySummaryHtml: "<p>Summary.</p>", keyMessagesHtml: "<p>Short.</p>" }, outcomes: [] });
    expect(upgraded).toEqual({ schemaVersion: 5, brief: { slug: "s", authorTeam: "Northfield Evidence Unit" }, texts: { laySummaryHtml: "<p>Summary.</p>", shortTakeHtml: "<p>Short.</p>" }, outcomes: [] });
  });

  it("leaves a version frozen before it had an author without one", () => {
    const upgraded = upgrades[3]!({ schemaVersion: 4, brief: { slug: "s" }, texts: { laySummaryHtml: "", keyMessagesHtml: "" }, outcomes: [] });
    expect(upgraded.brief).toEqual({ slug: "s" });
  });
});
