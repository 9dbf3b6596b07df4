// The page model of a version (server/core/publication/brief-page.ts): projected from a snapshot only, whose facts
// were computed when it was published (server/core/snapshot/facts.ts).
import { describe, expect, it } from "vitest";
import { briefContent, comparisonContent } from "#core/publication/brief-page";
import type { ComparisonCertainty } from "#core/grade/assess";
import { concludeOutcome } from "#core/grade/conclusions";
import { certaintyFootnotes } from "#core/grade/footnotes";
import { outcomeFacts } from "#core/snapshot/facts";
import { snapshotSchemaVersion, versionSnapshotSchema } from "#core/snapshot/schema";
import { inventedDataset, inventedResult, inventedSettings } from "#tests/support/invented-network";

const [parsed, settings, result] = [inventedDataset, inventedSettings, inventedResult];
const certainty = result.comparisons.map((c) => ({ treatment: c.treatment, comparator: c.comparator, network: "moderate", judgement: {} }) as ComparisonCertainty);
const thresholds = { small: null, moderate: null, large: null };
const treatments = [
  { label: "alpha", displayName: "Zeta tablets" },
  { label: "beta", displayName: "Beta drops" },
  { label: "placebo", displayName: "Placebo" },
];
// Through the declared contract, as publishing stores it.
const snapshot = versionSnapshotSchema.parse({
  schemaVersion: snapshotSchemaVersion,
  brief: { slug: "invented", title: "Invented brief", topic: "Testing", condition: "A condition", population: "Adults", demo: true },
  treatments,
  texts: { laySummaryHtml: "", shortTakeHtml: "" },
  outcomes: [
    {
      name: "Response",
      kind: "binary",
      settings,
      baselineRisk: 0.2,
      unit: null,
      thresholds,
      dataset: { fileName: "x.csv", sha256: "0".repeat(64), format: "arm-binary", parsed },
      result,
      certainty,
      ...concludeOutcome(result, certainty, { name: "Response", baselineRisk: 0.2, thresholds, names: Object.fromEntries(treatments.map((t) => [t.label, t.displayName])) }),
      ...outcomeFacts(result, certainty, parsed.studies),
    },
  ],
  version: 1,
  releaseAt: "2026-12-01T00:00:00.000Z",
  note: null,
});

describe("the brief page model", () => {
  it("lists each option against the reference alphabetically by the name readers see, never by effect", () => {
    const view = briefContent(snapshot);
    expect(view.outcomes[0]!.effects.map((e) => e.name)).toEqual(["Beta drops", "Zeta tablets"]);
    expect(view.outcomes[0]!.reference).toEqual({ id: "placebo", name: "Placebo" });
    // The rank-score list too: alphabetical by reader name, as its explainer says.
    expect(view.outcomes[0]!.rankScores.rows.map((r) => r.name)).toEqual(["Beta drops", "Placebo", "Zeta tablets"]);
  });
});

describe("the comparison page model", () => {
  it("counts the participants of the studies that compare the two directly (s1 and s4: 200 + 240)", () => {
    const view = comparisonContent(snapshot, "alpha", "placebo")!;
    expect(view.outcomes[0]!.direct).toMatchObject({ studies: 2, participants: 440 });
  });

  it("gives the direct estimate's 95% CI as estimate ± 1.959964 SE (METHODS.md §3) and reads both ways", () => {
    const forward = comparisonContent(snapshot, "alpha", "placebo")!.outcomes[0]!;
    const backward = comparisonContent(snapshot, "placebo", "alpha")!.outcomes[0]!;
    const pair = result.comparisons.find((c) => [c.treatment, c.comparator].sort().join() === "alpha,placebo")!;
    const sign = pair.treatment === "alpha" ? 1 : -1;
    expect(forward.direct!.estimate).toBeCloseTo(sign * pair.direct!.estimate, 12);
    expect(forward.direct!.upper - forward.direct!.estimate).toBeCloseTo(1.959964 * pair.direct!.se, 6);
    expect(backward.network.estimate).toBeCloseTo(-forward.network.estimate, 12);
    expect(backward.network.lower).toBeCloseTo(-forward.network.upper, 12);
  });

  it("is null for a pair no outcome holds", () => {
    expect(comparisonContent(snapshot, "alpha", "gamma")).toBeNull();
    expect(comparisonContent(snapshot, "alpha", "alpha")).toBeNull();
  });
});

describe("certainty footnotes", () => {
  it("give the analyst's reason for each domain rated down, and the computed reason where none was written", () => {
    const none = { levels: 0 as const, reason: "" };
    const notes = certaintyFootnotes({
      treatment: "a",
      comparator: "b",
      direct: "low",
      indirect: null,
      indirectVia: null,
      network: "low",
      suggestions: {
        incoherence: { levels: 0, because: { key: "certainty.incoherence.notTestable", values: {} } },
        imprecision: { levels: 1, because: { key: "certainty.imprecision.crossesNull", values: { count: 1 } } },
        riskOfBias: null,
      },
      judgement: {
        direct: { riskOfBias: { levels: 1, reason: "Allocation was not concealed." }, inconsistency: none, indirectness: none, publicationBias: none },
        incoherence: { levels: 0, reason: "" },
        imprecision: { levels: 1, reason: "" },
      },
      pending: [],
    });
    expect(notes).toEqual([
      { domainKey: "certainty.domain.riskOfBias", levels: 1, reason: "Allocation was not concealed.", because: null },
      { domainKey: "certainty.domain.imprecision", levels: 1, reason: null, because: { key: "certainty.imprecision.crossesNull", values: { count: 1 } } },
    ]);
  });
});
