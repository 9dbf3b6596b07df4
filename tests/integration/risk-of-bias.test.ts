// Risk of bias through the network and the studies that matter (METHODS.md §13), from upload to the
// public page: the reference file with its invented risk-of-bias column
// (tests/fixtures/reference/hasselblad1998-rob.csv, labelled as invented in that folder's README).
import { readFileSync } from "node:fs";
import path from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import type { Certainty } from "#web/api/contract";
import { analysedBrief, approve, draftBrief } from "../support/briefs";
import { withProductionServer } from "../support/production-server";

const robCsv = readFileSync(path.resolve(__dirname, "../fixtures/reference/hasselblad1998-rob.csv"));
// metafor 3.8-1 + base R on the same file, random effects (hasselblad1998-rob.expected.json).
const expected = JSON.parse(readFileSync(path.resolve(__dirname, "../fixtures/reference/hasselblad1998-rob.expected.json"), "utf8"));

const { server, clients } = withProductionServer(["analyst", "editor"]);

const certaintyOf = async (outcomeId: string) => (await clients.analyst!.request("GET", `/api/outcomes/${outcomeId}/certainty`)).body.comparisons as unknown as Certainty[];
const clean = { levels: 0, reason: "" };
const judgement = (riskOfBias: { levels: number; reason: string }) => ({
  direct: { riskOfBias, inconsistency: clean, indirectness: clean, publicationBias: clean },
  incoherence: { levels: 0, reason: "" },
  imprecision: { levels: 0, reason: "Test: no threshold set" },
});

describe("the risk_of_bias column on upload", () => {
  it("counts the studies per level in the validation report", async () => {
    const { outcomeId } = await draftBrief(clients.analyst!, "Judged trials, upload", robCsv);
    const again = await clients.analyst!.upload(`/api/outcomes/${outcomeId}/dataset`, { name: "rob.csv", bytes: robCsv }, { format: "arm-binary" });
    expect(again.status).toBe(200);
    expect(again.body.riskOfBias).toEqual({ low: 12, someConcerns: 6, high: 3, notAssessed: 3 });
  });

  it("refuses a study whose rows disagree, naming the row, and keeps the data stored before byte for byte", async () => {
    const { outcomeId } = await draftBrief(clients.analyst!, "Judged trials, refused", robCsv);
    const before = await clients.analyst!.request("GET", `/api/outcomes/${outcomeId}/result`);
    const broken = robCsv.toString().replace("S002,ind_counseling,23,140,low", "S002,ind_counseling,23,140,high");
    const response = await clients.analyst!.upload(`/api/outcomes/${outcomeId}/dataset`, { name: "broken.csv", bytes: broken }, { format: "arm-binary" });
    expect(response.status).toBe(422);
    expect(response.body.issues).toEqual([expect.objectContaining({ rule: "risk-of-bias-differs", row: 5, column: "risk_of_bias", facts: { study: "S002", first: "low" } })]);
    const after = await clients.analyst!.request("GET", `/api/outcomes/${outcomeId}/result`);
    expect(JSON.stringify(after.body)).toBe(JSON.stringify(before.body));
  });
});

describe("the risk-of-bias suggestion in the certainty assessment", () => {
  it("suggests the level carrying the largest share, lets the clients.analyst! confirm it without a reason and asks one to depart", async () => {
    const { outcomeId } = await draftBrief(clients.analyst!, "Judged trials, certainty", robCsv);
    const pair = (await certaintyOf(outcomeId)).find((c) => c.treatment === "no_contact" && c.comparator === "self_help")!;
    // Random effects: 61.6% of the direct weight has some concerns (reference file), so one level down.
    const share = expected.random.comparisons.find((c: { treatment: string; comparator: string }) => c.treatment === "no_contact" && c.comparator === "self_help").riskOfBias.someConcerns;
    expect(pair.suggestions.riskOfBias).toEqual({ levels: 1, because: { key: "certainty.riskOfBias.someConcerns", values: { share: Math.round(100 * share) } } });

    const at = `/api/outcomes/${outcomeId}/certainty/no_contact/self_help`;
    const departed = await clients.analyst!.request("PUT", at, { json: judgement({ levels: 0, reason: "" }) });
    expect(departed.status).toBe(400);
    expect(departed.body.error?.details).toEqual([expect.objectContaining({ field: "riskOfBias.reason" })]);

    const confirmed = await clients.analyst!.request("PUT", at, { json: judgement({ levels: 1, reason: "" }) });
    expect(confirmed.status).toBe(200);
    expect(confirmed.body.comparison).toMatchObject({ direct: "moderate" });

    const overridden = await clients.analyst!.request("PUT", at, { json: judgement({ levels: 0, reason: "The trials with concerns had blinded outcome assessment" }) });
    expect(overridden.status).toBe(200);
    expect(overridden.body.comparison).toMatchObject({ direct: "high" });
  });

  it("applies in bulk: every pair takes its own suggestion, all or none", async () => {
    const { outcomeId } = await draftBrief(clients.analyst!, "Judged trials, in bulk", robCsv);
    const comparisons = await certaintyOf(outcomeId);
    const withDirect = comparisons.filter((c) => c.pending.includes("direct"));
    const judgements = withDirect.map((c) => ({ treatment: c.treatment, comparator: c.comparator, judgement: judgement({ levels: c.suggestions.riskOfBias?.levels ?? 0, reason: "" }) }));
    const saved = await clients.analyst!.request("PUT", `/api/outcomes/${outcomeId}/certainty`, { json: { judgements } });
    expect(saved.status).toBe(200);
    const after = await certaintyOf(outcomeId);
    for (const c of after.filter((x) => withDirect.some((w) => w.treatment === x.treatment && w.comparator === x.comparator))) {
      expect(c.judgement.direct?.riskOfBias.levels, `${c.treatment} vs ${c.comparator}`).toBe(c.suggestions.riskOfBias?.levels ?? 0);
      expect(c.pending).not.toContain("direct");
    }
  });
});

describe("the public pages", () => {
  let slug = "";
  beforeAll(async () => {
    const brief = await analysedBrief(clients.analyst!, "Judged trials, in public", undefined, robCsv);
    await approve(clients.analyst!, clients.editor!, brief.briefId);
    expect((await clients.editor!.request("POST", `/api/briefs/${brief.briefId}/versions`, { json: {} })).status).toBe(201);
    slug = brief.slug;
  }, 60_000);

  it("a comparison page lists its most important studies, with risk of bias in words, and says importances are not percentages", async () => {
    const html = await (await fetch(`${server.url}/briefs/${slug}/v/1/compare/no_contact/self_help`)).text();
    const section = sectionOf(html, "important-studies");
    expect(section).toContain("The studies that matter most for this comparison");
    expect(section).toContain("Importances are not percentages and do not add up to 100.");
    // The most important study of the pair under random effects, from the reference values, listed first.
    const top = expected.random.comparisons.find((c: { treatment: string; comparator: string }) => c.treatment === "no_contact" && c.comparator === "self_help").importance;
    const rows = [...section.matchAll(/<th scope="row"[^>]*>([^<]+)<\/th>/g)].map((m) => m[1]);
    expect(rows.slice(0, top.length)).toEqual(top.map((s: { study: string }) => s.study));
    expect(section).toMatch(/Some concerns|High risk of bias/);
    // The confirmed suggestion is the certainty footnote, in words.
    expect(html.replaceAll("<!-- -->", "")).toContain("Risk of bias: rated down 1 level. 62% of the weight of the direct evidence comes from trials with some concerns about bias.");
    expect(html).not.toContain("desk.domain");
  });

  it("the brief page shows how much of the evidence comes from each risk of bias, in words and as a labelled bar", async () => {
    const html = await (await fetch(`${server.url}/briefs/${slug}/v/1`)).text();
    const section = sectionOf(html, "risk-of-bias");
    expect(section).toContain("How far can the trials be trusted?");
    expect(section).toMatch(/role="img" aria-label="Share of participants by risk of bias: Low risk of bias \d+%, Some concerns \d+%, High risk of bias \d+%, Not assessed \d+%"/);
    for (const level of ["Low risk of bias", "Some concerns", "High risk of bias", "Not assessed"]) expect(section).toContain(level);
  });
});

/** One <section> of a page, from its test id to its own end (sections of these pages do not nest). */
function sectionOf(html: string, testId: string): string {
  const start = html.indexOf(`data-testid="${testId}"`);
  expect(start, `no section ${testId}`).toBeGreaterThan(-1);
  return html.slice(start, html.indexOf("</section>", start));
}
