// Briefs made through the API as the desk makes them: an analysed draft (the smoking-cessation
// reference data, tests/fixtures/reference/hasselblad1998.csv), its review, its publication.
import { readFileSync } from "node:fs";
import path from "node:path";
import { expect } from "vitest";
import type { ApiClient } from "./client";

const hasselbladCsv = readFileSync(path.resolve(__dirname, "../fixtures/reference/hasselblad1998.csv"));

export async function analysedBrief(analyst: ApiClient, title: string) {
  const created = await analyst.request("POST", "/api/briefs", { json: { title, topic: "Smoking", condition: "Tobacco dependence", population: "Adults who smoke" } });
  expect(created.status).toBe(201);
  const briefId = String(created.body.id);
  const outcome = await analyst.request("POST", `/api/briefs/${briefId}/outcomes`, {
    json: { name: "Quit smoking", kind: "binary", measure: "OR", model: "random", referenceTreatment: "no_contact", direction: "higher", baselineRisk: 0.07 },
  });
  const outcomeId = String((outcome.body.outcome as { id: string }).id);
  const upload = await analyst.upload(`/api/outcomes/${outcomeId}/dataset`, { name: "h.csv", bytes: hasselbladCsv }, { format: "arm-binary" });
  expect(upload.status).toBe(200);
  return { briefId, slug: String(created.body.slug), outcomeId };
}

/** The review every version goes through: the analyst submits, an editor approves. */
export async function approve(analyst: ApiClient, editor: ApiClient, briefId: string) {
  expect((await analyst.request("POST", `/api/briefs/${briefId}/reviews`, { json: { decision: "submitted" } })).status).toBe(201);
  expect((await editor.request("POST", `/api/briefs/${briefId}/reviews`, { json: { decision: "approved" } })).status).toBe(201);
}

/** Approved and published (or scheduled, with `releaseAt`): the version's number. */
export async function publishedBrief(analyst: ApiClient, editor: ApiClient, title: string, releaseAt?: string) {
  const brief = await analysedBrief(analyst, title);
  await approve(analyst, editor, brief.briefId);
  const published = await editor.request("POST", `/api/briefs/${brief.briefId}/versions`, { json: releaseAt ? { releaseAt } : {} });
  expect(published.status).toBe(201);
  return brief;
}
