// Publish only what is right: the readiness checklist refuses approval and publishing of a draft with
// unrated comparisons against the reference, unnamed treatments or empty texts (409, each item
// listed), and asks the editor to acknowledge warnings; a changed suggestion sends a judgement back
// to pending; the public page states the thresholds on their scale and never shows an unrated
// comparison as rated.
import { describe, expect, it } from "vitest";
import type { Certainty } from "#web/api/contract";
import { analysedBrief, approve, draftBrief, rateEveryComparison } from "../support/briefs";
import { withProductionServer } from "../support/production-server";

const { server, clients } = withProductionServer(["analyst", "editor"]);

const submit = (briefId: string) => clients.analyst!.request("POST", `/api/briefs/${briefId}/reviews`, { json: { decision: "submitted" } });
const approveAs = (briefId: string, acknowledgeWarnings?: boolean) => clients.editor!.request("POST", `/api/briefs/${briefId}/reviews`, { json: { decision: "approved", acknowledgeWarnings } });

describe("the readiness checklist", () => {
  it("refuses to approve a draft with unrated comparisons, unnamed treatments and empty texts, listing each", async () => {
    const { briefId } = await draftBrief(clients.analyst!, "Not ready");
    expect((await submit(briefId)).status).toBe(201);
    const refused = await approveAs(briefId, true);
    expect(refused.status).toBe(409);
    expect(refused.body.error?.key).toBe("errors.publish.notReady");
    const items = refused.body.error?.details as { key: string; values: Record<string, unknown> }[];
    expect(items.map((i) => i.key).sort()).toEqual(["readiness.noShortTake", "readiness.noSummary", "readiness.unnamed", "readiness.unrated"]);
    // Three options against no_contact in the reference data, four labels without a reader name.
    expect(items.find((i) => i.key === "readiness.unrated")!.values).toEqual({ outcome: "Quit smoking", count: 3 });
    expect(items.find((i) => i.key === "readiness.unnamed")!.values.count).toBe(4);
    const readiness = await clients.analyst!.request("GET", `/api/briefs/${briefId}/readiness`);
    expect(readiness.body.blocking).toEqual(items);
  });

  it("asks the approving editor to acknowledge the warnings: the reference data's I² is 89% (metafor 3.8-1)", async () => {
    const { briefId } = await analysedBrief(clients.analyst!, "Ready with warnings");
    expect((await submit(briefId)).status).toBe(201);
    const unacknowledged = await approveAs(briefId);
    expect(unacknowledged.status).toBe(409);
    expect(unacknowledged.body.error?.key).toBe("errors.review.warnings");
    expect(unacknowledged.body.error?.details).toContainEqual({ key: "readiness.heterogeneity", values: { outcome: "Quit smoking", I2: 89 } });
    expect((await approveAs(briefId, true)).status).toBe(201);
  });
});

describe("the editor's texts against the findings", () => {
  it("warns of a short take that overclaims, and approves it only with the editor's reason", async () => {
    const { briefId } = await analysedBrief(clients.analyst!, "Overclaiming short take");
    const editor = clients.editor!;
    const rowVersion = ((await editor.request("GET", `/api/briefs/${briefId}`)).body.brief as { rowVersion: number }).rowVersion;
    const shortTake = "Individual counselling is the best option: it ranked first, with the highest SUCRA.";
    expect((await editor.request("PATCH", `/api/briefs/${briefId}`, { json: { rowVersion, shortTake } })).status).toBe(200);
    const readiness = await editor.request("GET", `/api/briefs/${briefId}/readiness`);
    expect(readiness.body.warnings).toContainEqual({ key: "readiness.claim.rank", values: { field: "shortTake", sentence: shortTake, treatment: "Individual counselling", word: "best" } });

    expect((await submit(briefId)).status).toBe(201);
    const withoutReason = await approveAs(briefId, true);
    expect(withoutReason.status).toBe(409);
    expect(withoutReason.body.error?.key).toBe("errors.review.warnings");
    expect((withoutReason.body.error?.details as { key: string }[]).map((d) => d.key)).toEqual(["readiness.claim.rank"]);
    const withReason = await editor.request("POST", `/api/briefs/${briefId}/reviews`, {
      json: { decision: "approved", acknowledgeWarnings: true, comment: "Kept for the test: the sentence is quoted as an example of what not to write." },
    });
    expect(withReason.status).toBe(201);
  });
});

describe("judgements and changed suggestions", () => {
  it("a judgement that followed a suggestion goes back to pending when the suggestion changes", async () => {
    const { briefId, outcomeId } = await analysedBrief(clients.analyst!, "Changed suggestions");
    const before = (await clients.analyst!.request("GET", `/api/outcomes/${outcomeId}/certainty`)).body.comparisons as unknown as Certainty[];
    expect(before.every((c) => c.pending.length === 0)).toBe(true);
    // Thresholds of 5, 10 and 20 more per 1000: most intervals now cross some of them.
    const detail = await clients.analyst!.request("GET", `/api/briefs/${briefId}`);
    const { rowVersion } = (detail.body.brief as { outcomes: { id: string; rowVersion: number }[] }).outcomes.find((o) => o.id === outcomeId)!;
    const patched = await clients.analyst!.request("PATCH", `/api/outcomes/${outcomeId}`, { json: { rowVersion, thresholdSmall: 5, thresholdModerate: 10, thresholdLarge: 20 } });
    expect(patched.status).toBe(200);
    const after = (await clients.analyst!.request("GET", `/api/outcomes/${outcomeId}/certainty`)).body.comparisons as unknown as Certainty[];
    const changed = after.filter((c) => c.suggestions.imprecision.levels !== before.find((b) => b.treatment === c.treatment && b.comparator === c.comparator)!.suggestions.imprecision.levels);
    expect(changed.length).toBeGreaterThan(0);
    for (const c of changed) {
      expect(c.pending).toContain("imprecision");
      expect(c.network).toBeNull();
    }
  });
});

describe("what the public page says", () => {
  it("states the thresholds on their scale, and shows a comparison nobody rated as not assessed, with its footnote", async () => {
    const againstReference = (c: Certainty) => c.treatment === "no_contact" || c.comparator === "no_contact";
    const { briefId, slug, outcomeId } = await analysedBrief(clients.analyst!, "Thresholds and an unrated pair", againstReference);
    const detail = await clients.analyst!.request("GET", `/api/briefs/${briefId}`);
    const { rowVersion } = (detail.body.brief as { outcomes: { id: string; rowVersion: number }[] }).outcomes.find((o) => o.id === outcomeId)!;
    expect((await clients.analyst!.request("PATCH", `/api/outcomes/${outcomeId}`, { json: { rowVersion, thresholdSmall: 20, thresholdModerate: 50, thresholdLarge: 100 } })).status).toBe(200);
    // The new thresholds change the imprecision suggestions: the analyst confirms them again.
    await rateEveryComparison(clients.analyst!, outcomeId, (c) => againstReference(c) && c.pending.length > 0);
    await approve(clients.analyst!, clients.editor!, briefId);
    expect((await clients.editor!.request("POST", `/api/briefs/${briefId}/versions`, { json: {} })).status).toBe(201);

    const page = await (await fetch(`${server.url}/briefs/${slug}/v/1`)).text();
    expect(page).toContain("The thresholds, set by the analysts as differences in people per 1000 (against 70 in 1000 with No contact): small 20, moderate 50, large 100.");
    // Heterogeneity in plain words where readers look (the reference data's I² is 89%, metafor 3.8-1).
    expect(page).toContain("results vary more than chance alone would explain (I² = 89%)");
    // Every league-table cell links to its comparison.
    expect(page).toContain(`href="/briefs/${slug}/v/1/compare/self_help/ind_counseling"`);
    const comparison = await (await fetch(`${server.url}/briefs/${slug}/v/1/compare/self_help/ind_counseling`)).text();
    expect(comparison).toContain("Certainty not assessed");
    expect(comparison).toContain("the analysts have not judged this comparison");
    expect(comparison).not.toContain('data-certainty="very_low"');
  });
});

describe("rating many pairs at once", () => {
  it("saves every judgement of the set, or none when one departs from its suggestion without a reason", async () => {
    const { outcomeId } = await draftBrief(clients.analyst!, "Bulk rating");
    const { body } = await clients.analyst!.request("GET", `/api/outcomes/${outcomeId}/certainty`);
    const comparisons = body.comparisons as unknown as Certainty[];
    const accept = (c: Certainty) => ({
      treatment: c.treatment,
      comparator: c.comparator,
      judgement: { ...c.judgement, incoherence: { levels: c.suggestions.incoherence.levels, reason: "" }, imprecision: { levels: c.suggestions.imprecision.levels, reason: "" } },
    });
    const [first, ...rest] = comparisons.map(accept);
    const departing = { ...first!, judgement: { ...first!.judgement, imprecision: { levels: (first!.judgement.imprecision.levels + 1) % 3, reason: "" } } };
    const refused = await clients.analyst!.request("PUT", `/api/outcomes/${outcomeId}/certainty`, { json: { judgements: [departing, ...rest] } });
    expect(refused.status).toBe(400);
    expect(refused.body.error?.key).toBe("errors.certainty.overrideReason");
    const unchanged = (await clients.analyst!.request("GET", `/api/outcomes/${outcomeId}/certainty`)).body.comparisons as unknown as Certainty[];
    expect(unchanged.every((c) => c.pending.includes("imprecision"))).toBe(true);

    const saved = await clients.analyst!.request("PUT", `/api/outcomes/${outcomeId}/certainty`, { json: { judgements: [first, ...rest] } });
    expect(saved.status).toBe(200);
    expect((saved.body.comparisons as unknown as Certainty[]).map((c) => c.pending.includes("imprecision"))).toEqual(comparisons.map(() => false));
  });
});
