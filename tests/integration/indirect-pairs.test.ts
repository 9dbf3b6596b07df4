// A six-option network in which nine of fifteen pairs were never compared in a trial, uploaded, rated
// as the analysts would confirm the suggestions and published: every comparison goes out with a
// certainty, and its page shows the arithmetic without contradicting itself (METHODS.md §8 steps 4–5).
import { beforeAll, describe, expect, it } from "vitest";
import type { Certainty } from "#web/api/contract";
import { approve, rateEveryComparison } from "../support/briefs";
import { ApiClient } from "../support/client";
import { withProductionServer } from "../support/production-server";
import { indirectOnlyPairs, sixOptionsCsv, sixOptionsNames, withoutLoop } from "../support/six-options";

const { server, clients } = withProductionServer(["analyst", "editor"]);
let slug = "";
let outcomeId = "";
let briefId = "";

const key = (a: string, b: string) => [a, b].sort().join("|");

beforeAll(async () => {
  const analyst = clients.analyst!;
  const created = await analyst.request("POST", "/api/briefs", { json: { title: `Six options ${Date.now()}`, topic: "Sleep", condition: "Poor sleep", population: "Adults (invented)" } });
  briefId = String(created.body.id);
  slug = String(created.body.slug);
  const outcome = await analyst.request("POST", `/api/briefs/${briefId}/outcomes`, {
    json: { name: "Good sleep", kind: "binary", measure: "OR", model: "fixed", referenceTreatment: "placebo", direction: "higher", baselineRisk: 0.2 },
  });
  outcomeId = String((outcome.body.outcome as { id: string }).id);
  expect((await analyst.upload(`/api/outcomes/${outcomeId}/dataset`, { name: "six.csv", bytes: Buffer.from(sixOptionsCsv) }, { format: "arm-binary" })).status).toBe(200);
  expect((await analyst.request("PUT", `/api/briefs/${briefId}/treatments`, { json: { names: sixOptionsNames } })).status).toBe(200);
}, 60_000);

describe("a network with pairs no trial compared", () => {
  it("asks for every wholly indirect pair's indirect certainty, and for none of their incoherence", async () => {
    const certainty = (await clients.analyst!.request("GET", `/api/outcomes/${outcomeId}/certainty`)).body.comparisons as unknown as Certainty[];
    const indirectOnly = certainty.filter((c) => indirectOnlyPairs.includes(key(c.treatment, c.comparator)));
    expect(indirectOnly).toHaveLength(9);
    for (const c of indirectOnly) {
      expect(c.pending).toContain("indirect");
      expect(c.pending).not.toContain("incoherence");
    }
    expect(indirectOnly.filter((c) => c.indirectVia === null).map((c) => key(c.treatment, c.comparator)).sort()).toEqual(withoutLoop);
  });

  it("publishes every one of the fifteen comparisons with a certainty once rated with the suggestions", async () => {
    await rateEveryComparison(clients.analyst!, outcomeId);
    const certainty = (await clients.analyst!.request("GET", `/api/outcomes/${outcomeId}/certainty`)).body.comparisons as unknown as Certainty[];
    expect(certainty.filter((c) => c.network === null)).toEqual([]);
    const readiness = await clients.analyst!.request("GET", `/api/briefs/${briefId}/readiness`);
    expect((readiness.body.warnings as { key: string }[]).map((w) => w.key)).not.toContain("readiness.unratedOthers");

    const editor = clients.editor!;
    const rowVersion = ((await editor.request("GET", `/api/briefs/${briefId}`)).body.brief as { rowVersion: number }).rowVersion;
    expect((await editor.request("PATCH", `/api/briefs/${briefId}`, { json: { rowVersion, laySummary: "Invented test data.", shortTake: "Invented test data." } })).status).toBe(200);
    await approve(clients.analyst!, editor, briefId);
    expect((await editor.request("POST", `/api/briefs/${briefId}/versions`, { json: {} })).status).toBe(201);

    const snapshot = (await new ApiClient(server.url).request("GET", `/api/briefs/${slug}/versions/1`)).body as {
      outcomes: { pairs: { treatment: string; comparator: string; certainty: string | null; path: { took: string; rating: string } | null }[] }[];
    };
    const pairs = snapshot.outcomes[0]!.pairs;
    expect(pairs).toHaveLength(15);
    expect(pairs.filter((p) => p.certainty === null)).toEqual([]);
    expect(pairs.every((p) => p.path !== null && p.path.rating === p.certainty)).toBe(true);
    expect(pairs.filter((p) => indirectOnlyPairs.includes(key(p.treatment, p.comparator))).every((p) => p.path!.took === "indirect")).toBe(true);
  });

  it("shows on a wholly indirect comparison's page the loop and the network estimate as the indirect one, never “the analysts have not judged”", async () => {
    const page = await fetch(`${server.url}/briefs/${slug}/v/1/compare/alpha/delta`);
    expect(page.status).toBe(200);
    const html = (await page.text()).replace(/<!-- -->/g, "");
    expect(html).not.toContain("the analysts have not judged this comparison");
    expect(html).not.toContain("None: the network estimate rests on the trials that compared them directly");
    expect(html).toContain("No trial compared them directly: there is no direct certainty.");
    // Alpha–beta was rated high and beta–delta high (nothing rated down in the test's judgements): the lower is high.
    expect(html).toContain("Through Beta: the lower of Alpha vs Beta (high) and Beta vs Delta (high).");
    expect(html).toMatch(/Starts from the indirect certainty: (high|moderate|low|very low)\./);
    expect(html).toMatch(/Published certainty: (high|moderate|low|very low)\./);

    // A pair without a first-order loop: the analysts' rating and their reason.
    const noLoop = await (await fetch(`${server.url}/briefs/${slug}/v/1/compare/delta/epsilon`)).text();
    expect(noLoop.replace(/<!-- -->/g, "")).toContain("No loop through a single other option: the analysts set it from the longer paths. Test data: no first-order loop.");
  });
});
