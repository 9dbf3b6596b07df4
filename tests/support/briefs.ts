// Briefs made through the API as the desk makes them: an analysed draft (the smoking-cessation
// reference data, tests/fixtures/reference/hasselblad1998.csv), made ready the way a team would
// (names for readers, every comparison rated, the editor's two texts), its review, its publication.
import { readFileSync } from "node:fs";
import path from "node:path";
import { expect } from "vitest";
import type { Certainty } from "#web/api/contract";
import { type ApiClient, demoClient } from "./client";

const hasselbladCsv = readFileSync(path.resolve(__dirname, "../fixtures/reference/hasselblad1998.csv"));

/** Created, with its outcome and data analysed, and nothing else: not ready to approve. */
export async function draftBrief(analyst: ApiClient, title: string, csv: Buffer = hasselbladCsv) {
  const created = await analyst.request("POST", "/api/briefs", { json: { title, topic: "Smoking", condition: "Tobacco dependence", population: "Adults who smoke" } });
  expect(created.status).toBe(201);
  const briefId = String(created.body.id);
  const outcome = await analyst.request("POST", `/api/briefs/${briefId}/outcomes`, {
    json: { name: "Quit smoking", kind: "binary", measure: "OR", model: "random", referenceTreatment: "no_contact", direction: "higher", baselineRisk: 0.07 },
  });
  const outcomeId = String((outcome.body.outcome as { id: string }).id);
  const upload = await analyst.upload(`/api/outcomes/${outcomeId}/dataset`, { name: "h.csv", bytes: csv }, { format: "arm-binary" });
  expect(upload.status).toBe(200);
  return { briefId, slug: String(created.body.slug), outcomeId };
}

const editors = new Map<string, ApiClient>();

/** An editor of the demo accounts, signed in once per server. */
async function editorAt(baseUrl: string): Promise<ApiClient> {
  let editor = editors.get(baseUrl);
  if (!editor) {
    editor = await demoClient(baseUrl, "editor");
    editors.set(baseUrl, editor);
  }
  return editor;
}

/** Every comparison rated as the analyst would confirm the suggestions (risk of bias where the data carry it), nothing else rated down (invented judgements). */
export async function rateEveryComparison(analyst: ApiClient, outcomeId: string, which: (c: Certainty) => boolean = () => true) {
  const { body } = await analyst.request("GET", `/api/outcomes/${outcomeId}/certainty`);
  const none = { levels: 0, reason: "" };
  for (const c of (body as unknown as { comparisons: Certainty[] }).comparisons.filter(which)) {
    // A judgement is saved whole: what was recorded before is kept, the pending parts are added.
    const judgement = {
      ...c.judgement,
      ...(c.pending.includes("direct") ? { direct: { riskOfBias: { levels: c.suggestions.riskOfBias?.levels ?? 0, reason: "" }, inconsistency: none, indirectness: none, publicationBias: none } } : {}),
      ...(c.pending.includes("indirect") && !c.indirectVia ? { indirectRating: { rating: "moderate", reason: "Test data: no first-order loop." } } : {}),
      incoherence: { levels: c.suggestions.incoherence.levels, reason: "" },
      imprecision: { levels: c.suggestions.imprecision.levels, reason: "" },
    };
    const saved = await analyst.request("PUT", `/api/outcomes/${outcomeId}/certainty/${encodeURIComponent(c.treatment)}/${encodeURIComponent(c.comparator)}`, { json: judgement });
    expect(saved.status).toBe(200);
  }
}

/** A draft ready to approve: names for readers, every comparison rated (or those `which` picks), the editor's two texts. */
export async function analysedBrief(analyst: ApiClient, title: string, which?: (c: Certainty) => boolean, csv?: Buffer) {
  const brief = await draftBrief(analyst, title, csv);
  const names = { no_contact: "No contact", self_help: "Self-help material", ind_counseling: "Individual counselling", grp_counseling: "Group counselling" };
  expect((await analyst.request("PUT", `/api/briefs/${brief.briefId}/treatments`, { json: { names } })).status).toBe(200);
  await rateEveryComparison(analyst, brief.outcomeId, which);
  const editor = await editorAt(analyst.baseUrl);
  const current = await editor.request("GET", `/api/briefs/${brief.briefId}`);
  const rowVersion = (current.body.brief as { rowVersion: number }).rowVersion;
  const texts = { laySummary: "Test summary: counselling may help people stop smoking.", shortTake: "Test short take." };
  expect((await editor.request("PATCH", `/api/briefs/${brief.briefId}`, { json: { rowVersion, ...texts } })).status).toBe(200);
  return brief;
}

/** The review every version goes through: the analyst submits, an editor approves, reading the warnings (the reference data is heterogeneous). */
export async function approve(analyst: ApiClient, editor: ApiClient, briefId: string) {
  expect((await analyst.request("POST", `/api/briefs/${briefId}/reviews`, { json: { decision: "submitted" } })).status).toBe(201);
  const approved = await editor.request("POST", `/api/briefs/${briefId}/reviews`, { json: { decision: "approved", acknowledgeWarnings: true } });
  expect(approved.status, approved.body.error?.message).toBe(201);
}

/** Approved and published (or scheduled, with `releaseAt`): the version's number. */
export async function publishedBrief(analyst: ApiClient, editor: ApiClient, title: string, releaseAt?: string) {
  const brief = await analysedBrief(analyst, title);
  await approve(analyst, editor, brief.briefId);
  const published = await editor.request("POST", `/api/briefs/${brief.briefId}/versions`, { json: releaseAt ? { releaseAt } : {} });
  expect(published.status).toBe(201);
  return brief;
}
