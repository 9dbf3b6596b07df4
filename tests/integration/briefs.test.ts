// Briefs, outcomes and data uploads through the API, against the real database.
import { readFileSync } from "node:fs";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { startTestApp, type TestApp } from "../support/app";
import { type ApiClient, demoClient } from "../support/client";

const referenceFolder = path.resolve(__dirname, "../fixtures/reference");
const hasselbladCsv = readFileSync(path.join(referenceFolder, "hasselblad1998.csv"));
// metafor 3.8-1 on the same file (tests/fixtures/reference/hasselblad1998.expected.json)
const expected = JSON.parse(readFileSync(path.join(referenceFolder, "hasselblad1998.expected.json"), "utf8"));

let app: TestApp;
let analyst: ApiClient;
beforeAll(async () => {
  app = await startTestApp();
  analyst = await demoClient(app.url, "analyst");
});
afterAll(async () => {
  await app.close();
});

const smokingOutcome = {
  name: "Quit smoking at 6 to 12 months",
  kind: "binary",
  measure: "OR",
  model: "random",
  referenceTreatment: "no_contact",
  direction: "higher",
  baselineRisk: 0.07,
  thresholdSmall: 0.1,
  thresholdModerate: 0.3,
  thresholdLarge: 0.6,
};

async function newBriefWithOutcome(title: string) {
  const created = await analyst.request("POST", "/api/briefs", {
    json: { title, topic: "Smoking", condition: "Tobacco dependence", population: "Adults who smoke" },
  });
  expect(created.status).toBe(201);
  const briefId = String(created.body.id);
  const outcome = await analyst.request("POST", `/api/briefs/${briefId}/outcomes`, { json: smokingOutcome });
  expect(outcome.status).toBe(201);
  return { briefId, slug: String(created.body.slug), outcomeId: String((outcome.body.outcome as { id: string }).id) };
}

describe("briefs", () => {
  it("creates a brief with a slug from its title, unique when the title repeats", async () => {
    const first = await newBriefWithOutcome("Counselling to stop smoking (test)");
    const second = await newBriefWithOutcome("Counselling to stop smoking (test)");
    expect(first.slug).toBe("counselling-to-stop-smoking-test");
    expect(second.slug).toBe("counselling-to-stop-smoking-test-2");
  });

  it("refuses an outcome whose measure does not fit its kind, naming the field", async () => {
    const { briefId } = await newBriefWithOutcome("Measure check");
    const response = await analyst.request("POST", `/api/briefs/${briefId}/outcomes`, { json: { ...smokingOutcome, measure: "MD" } });
    expect(response.status).toBe(400);
    expect(response.body.error?.details).toEqual([expect.objectContaining({ field: "measure" })]);
  });

  it("answers one of two concurrent PATCHes with 409 and the current version", async () => {
    const { briefId } = await newBriefWithOutcome("Concurrent edits");
    const other = await demoClient(app.url, "editor");
    const [a, b] = await Promise.all([
      analyst.request("PATCH", `/api/briefs/${briefId}`, { json: { rowVersion: 1, title: "Title from the analyst" } }),
      other.request("PATCH", `/api/briefs/${briefId}`, { json: { rowVersion: 1, title: "Title from the editor" } }),
    ]);
    const statuses = [a.status, b.status].sort();
    expect(statuses).toEqual([200, 409]);
    const conflict = a.status === 409 ? a : b;
    const winner = a.status === 200 ? a : b;
    const current = (conflict.body.error?.details as { current: { title: string; rowVersion: number } }).current;
    expect(current.rowVersion).toBe(2);
    expect(current.title).toBe((winner.body.brief as { title: string }).title);
  });
});

describe("data upload", () => {
  it("stores a valid file with its checksum and gives the reference values", async () => {
    const { briefId, outcomeId } = await newBriefWithOutcome("Upload of the reference data");
    const response = await analyst.upload(`/api/outcomes/${outcomeId}/dataset`, { name: "hasselblad1998.csv", bytes: hasselbladCsv }, { format: "arm-binary" });
    expect(response.status).toBe(200);
    expect(response.body).toMatchObject({ valid: true, studies: 24, treatments: expected.treatments });
    const { createHash } = await import("node:crypto");
    expect(response.body.sha256).toBe(createHash("sha256").update(hasselbladCsv).digest("hex"));

    const result = await analyst.request("GET", `/api/outcomes/${outcomeId}/result`);
    expect(result.status).toBe(200);
    expect(result.body.tau2 as number).toBeCloseTo(expected.random.tau2, 6);
    const pair = (result.body.comparisons as { treatment: string; comparator: string; network: { estimate: number; se: number } }[]).find(
      (c) => c.treatment === "grp_counseling" && c.comparator === "ind_counseling",
    )!;
    const reference = expected.random.comparisons[0];
    expect(Math.abs(pair.network.estimate - reference.network.estimate) / Math.abs(reference.network.estimate)).toBeLessThan(1e-5);
    expect(Math.abs(pair.network.se - reference.network.se) / reference.network.se).toBeLessThan(1e-5);

    const { rows } = await app.connection.pool.query("select original from datasets where outcome_id = $1", [outcomeId]);
    expect(Buffer.compare(rows[0].original, hasselbladCsv)).toBe(0);

    const brief = await analyst.request("GET", `/api/briefs/${briefId}`);
    const outcome = (brief.body.brief as { outcomes: { analysis: { state: string; engineVersion: string } }[] }).outcomes[0]!;
    expect(outcome.analysis).toMatchObject({ state: "current", engineVersion: "1.1.0" });
  });

  it("answers a broken file with 422 and row-level errors, and keeps the data stored before", async () => {
    const { outcomeId } = await newBriefWithOutcome("Broken upload");
    await analyst.upload(`/api/outcomes/${outcomeId}/dataset`, { name: "good.csv", bytes: hasselbladCsv }, { format: "arm-binary" });
    const broken = "study,treatment,events,total\nS1,a,12,10\nS1,b,3,10\nS2,a,1,10\n";
    const response = await analyst.upload(`/api/outcomes/${outcomeId}/dataset`, { name: "broken.csv", bytes: broken }, { format: "arm-binary" });
    expect(response.status).toBe(422);
    expect(response.body.issues).toEqual([
      expect.objectContaining({ row: 2, column: "events", rule: "events-exceed-total" }),
      expect.objectContaining({ row: 4, rule: "too-few-arms", value: "S2" }),
    ]);
    const { rows } = await app.connection.pool.query("select file_name from datasets where outcome_id = $1", [outcomeId]);
    expect(rows.map((r) => r.file_name)).toEqual(["good.csv"]);
    const result = await analyst.request("GET", `/api/outcomes/${outcomeId}/result`);
    expect(result.body.studies).toBe(24);
  });

  it("keeps the previous upload in the history when the data are replaced", async () => {
    const { outcomeId } = await newBriefWithOutcome("Replaced data");
    await analyst.upload(`/api/outcomes/${outcomeId}/dataset`, { name: "first.csv", bytes: hasselbladCsv }, { format: "arm-binary" });
    const second = Buffer.from(hasselbladCsv.toString().replace("S001,no_contact,75,731", "S001,no_contact,76,731"));
    await analyst.upload(`/api/outcomes/${outcomeId}/dataset`, { name: "second.csv", bytes: second }, { format: "arm-binary" });
    const { rows } = await app.connection.pool.query("select file_name from datasets where outcome_id = $1 order by uploaded_at", [outcomeId]);
    expect(rows.map((r) => r.file_name)).toEqual(["first.csv", "second.csv"]);
  });

  it("analyses the stored data again when the result is stale (an earlier engine), keeping the judgements", async () => {
    const { briefId, outcomeId } = await newBriefWithOutcome("Analysed again");
    expect((await analyst.request("POST", `/api/outcomes/${outcomeId}/analysis`)).status).toBe(409);
    await analyst.upload(`/api/outcomes/${outcomeId}/dataset`, { name: "h.csv", bytes: hasselbladCsv }, { format: "arm-binary" });
    const clean = { levels: 0, reason: "" };
    const judged = await analyst.request("PUT", `/api/outcomes/${outcomeId}/certainty/grp_counseling/ind_counseling`, {
      json: { direct: { riskOfBias: clean, inconsistency: clean, indirectness: clean, publicationBias: clean } },
    });
    expect(judged.status).toBe(200);
    // As a result computed by an earlier engine version reads: its checksum no longer matches.
    await app.connection.pool.query("update analysis_results set input_checksum = 'from an earlier engine', engine_version = '1.0.0' where outcome_id = $1", [outcomeId]);
    const state = async () => ((await analyst.request("GET", `/api/briefs/${briefId}`)).body.brief as { outcomes: { analysis: { state: string } }[] }).outcomes[0]!.analysis.state;
    expect(await state()).toBe("stale");
    const editor = await demoClient(app.url, "editor");
    expect((await editor.request("POST", `/api/outcomes/${outcomeId}/analysis`)).status).toBe(403);
    const again = await analyst.request("POST", `/api/outcomes/${outcomeId}/analysis`);
    expect(again.status).toBe(200);
    expect(await state()).toBe("current");
    const certainty = await analyst.request("GET", `/api/outcomes/${outcomeId}/certainty`);
    const pair = (certainty.body.comparisons as { treatment: string; comparator: string; direct: string | null }[]).find((c) => c.treatment === "grp_counseling" && c.comparator === "ind_counseling");
    expect(pair?.direct).toBe("high");
    const { rows } = await app.connection.pool.query("select action from audit_log where entity_id = $1 order by id desc limit 1", [outcomeId]);
    expect(rows[0].action).toBe("analyse-again");
  });

  it("refuses an editor without the analyst role with 403", async () => {
    const { outcomeId } = await newBriefWithOutcome("Role check");
    const editor = await demoClient(app.url, "editor");
    const response = await editor.upload(`/api/outcomes/${outcomeId}/dataset`, { name: "x.csv", bytes: hasselbladCsv }, { format: "arm-binary" });
    expect(response.status).toBe(403);
  });

  it("names a missing format field", async () => {
    const { outcomeId } = await newBriefWithOutcome("Format check");
    const response = await analyst.upload(`/api/outcomes/${outcomeId}/dataset`, { name: "x.csv", bytes: hasselbladCsv }, {});
    expect(response.status).toBe(400);
    expect(response.body.error?.key).toBe("errors.upload.format");
  });
});

describe("certainty judgements", () => {
  const clean = { levels: 0, reason: "" };
  const domains = { riskOfBias: clean, inconsistency: clean, indirectness: clean, publicationBias: clean };

  it("lists what needs a judgement, then derives ratings from what the analyst records", async () => {
    const { outcomeId } = await newBriefWithOutcome("Certainty");
    await analyst.upload(`/api/outcomes/${outcomeId}/dataset`, { name: "h.csv", bytes: hasselbladCsv }, { format: "arm-binary" });
    const before = await analyst.request("GET", `/api/outcomes/${outcomeId}/certainty`);
    expect(before.status).toBe(200);
    const comparisons = before.body.comparisons as { treatment: string; comparator: string; pending: string[]; suggestions: { imprecision: { levels: number } } }[];
    expect(comparisons).toHaveLength(6);
    expect(comparisons.every((c) => c.pending.includes("incoherence") && c.pending.includes("imprecision"))).toBe(true);

    const pair = `/api/outcomes/${outcomeId}/certainty/grp_counseling/ind_counseling`;
    const saved = await analyst.request("PUT", pair, {
      json: { direct: { ...domains, riskOfBias: { levels: 1, reason: "Most trials did not conceal allocation" } }, incoherence: { levels: 0, reason: "" }, imprecision: { levels: 2, reason: "" } },
    });
    expect(saved.status).toBe(200);
    expect(saved.body.comparison).toMatchObject({ direct: "moderate", pending: ["indirect"] });

    const { rows } = await app.connection.pool.query("select action from audit_log where entity_id = $1 order by id desc limit 1", [outcomeId]);
    expect(rows[0].action).toBe("judge-certainty");
  });

  it("requires a reason for rating down, naming the field", async () => {
    const { outcomeId } = await newBriefWithOutcome("Certainty reasons");
    await analyst.upload(`/api/outcomes/${outcomeId}/dataset`, { name: "h.csv", bytes: hasselbladCsv }, { format: "arm-binary" });
    const response = await analyst.request("PUT", `/api/outcomes/${outcomeId}/certainty/grp_counseling/ind_counseling`, {
      json: { direct: { ...domains, indirectness: { levels: 1, reason: "" } } },
    });
    expect(response.status).toBe(400);
    expect(response.body.error?.details).toEqual([expect.objectContaining({ field: "direct.indirectness.reason" })]);
  });

  it("requires a reason to depart from a computed suggestion", async () => {
    const { outcomeId } = await newBriefWithOutcome("Certainty override");
    await analyst.upload(`/api/outcomes/${outcomeId}/dataset`, { name: "h.csv", bytes: hasselbladCsv }, { format: "arm-binary" });
    const { body } = await analyst.request("GET", `/api/outcomes/${outcomeId}/certainty`);
    const pair = (body.comparisons as { treatment: string; comparator: string; suggestions: { imprecision: { levels: number } } }[])[0]!;
    const other = pair.suggestions.imprecision.levels === 0 ? 1 : 0;
    const path = `/api/outcomes/${outcomeId}/certainty/${pair.treatment}/${pair.comparator}`;
    const refused = await analyst.request("PUT", path, { json: { imprecision: { levels: other, reason: "" } } });
    expect(refused.status).toBe(400);
    expect(refused.body.error?.details).toEqual([expect.objectContaining({ field: "imprecision.reason" })]);
    const accepted = await analyst.request("PUT", path, { json: { imprecision: { levels: other, reason: "The interval is narrow enough for the decision" } } });
    expect(accepted.status).toBe(200);
  });

  it("refuses an editor with 403", async () => {
    const { outcomeId } = await newBriefWithOutcome("Certainty roles");
    const editor = await demoClient(app.url, "editor");
    const response = await editor.request("PUT", `/api/outcomes/${outcomeId}/certainty/a/b`, { json: {} });
    expect(response.status).toBe(403);
  });
});

describe("changing an outcome's settings", () => {
  it("re-runs the analysis of the current data with the new settings", async () => {
    const { briefId, outcomeId } = await newBriefWithOutcome("Settings change");
    await analyst.upload(`/api/outcomes/${outcomeId}/dataset`, { name: "h.csv", bytes: hasselbladCsv }, { format: "arm-binary" });
    const response = await analyst.request("PATCH", `/api/outcomes/${outcomeId}`, { json: { rowVersion: 1, model: "fixed" } });
    expect(response.status).toBe(200);
    const result = await analyst.request("GET", `/api/outcomes/${outcomeId}/result`);
    expect(result.body).toMatchObject({ model: "fixed", tau2: 0 });
    const brief = await analyst.request("GET", `/api/briefs/${briefId}`);
    expect((brief.body.brief as { outcomes: { analysis: { state: string } }[] }).outcomes[0]!.analysis.state).toBe("current");
  });

  it("refuses a reference the data do not have with 422 and changes nothing", async () => {
    const { outcomeId } = await newBriefWithOutcome("Settings refused");
    await analyst.upload(`/api/outcomes/${outcomeId}/dataset`, { name: "h.csv", bytes: hasselbladCsv }, { format: "arm-binary" });
    const response = await analyst.request("PATCH", `/api/outcomes/${outcomeId}`, { json: { rowVersion: 1, referenceTreatment: "placebo" } });
    expect(response.status).toBe(422);
    expect(response.body.issues).toEqual([expect.objectContaining({ rule: "unknown-reference", value: "placebo" })]);
    const { rows } = await app.connection.pool.query("select reference_treatment, row_version from outcomes where id = $1", [outcomeId]);
    expect(rows[0]).toEqual({ reference_treatment: "no_contact", row_version: 1 });
  });

  it("answers a stale row version with 409", async () => {
    const { outcomeId } = await newBriefWithOutcome("Settings conflict");
    expect((await analyst.request("PATCH", `/api/outcomes/${outcomeId}`, { json: { rowVersion: 1, name: "First" } })).status).toBe(200);
    expect((await analyst.request("PATCH", `/api/outcomes/${outcomeId}`, { json: { rowVersion: 1, name: "Second" } })).status).toBe(409);
  });
});

describe("treatment names", () => {
  it("keeps the names readers see apart from the labels in the data", async () => {
    const { briefId, outcomeId } = await newBriefWithOutcome("Treatment names");
    await analyst.upload(`/api/outcomes/${outcomeId}/dataset`, { name: "h.csv", bytes: hasselbladCsv }, { format: "arm-binary" });
    const response = await analyst.request("PUT", `/api/briefs/${briefId}/treatments`, { json: { names: { no_contact: "No contact", self_help: "Self-help materials" } } });
    expect(response.status).toBe(200);
    expect(response.body.treatments).toEqual([
      { label: "grp_counseling", displayName: "grp_counseling", named: false, phrase: null, number: "singular" },
      { label: "ind_counseling", displayName: "ind_counseling", named: false, phrase: null, number: "singular" },
      { label: "no_contact", displayName: "No contact", named: true, phrase: null, number: "singular" },
      { label: "self_help", displayName: "Self-help materials", named: true, phrase: null, number: "singular" },
    ]);
  });

  it("keeps how a sentence names a treatment and its number, and refuses grammar for a label not in the data", async () => {
    const { briefId, outcomeId } = await newBriefWithOutcome("Treatment grammar");
    await analyst.upload(`/api/outcomes/${outcomeId}/dataset`, { name: "h.csv", bytes: hasselbladCsv }, { format: "arm-binary" });
    const grammar = { self_help: { phrase: "self-help materials", number: "plural" } };
    const response = await analyst.request("PUT", `/api/briefs/${briefId}/treatments`, { json: { names: { self_help: "Self-help materials" }, grammar } });
    expect(response.status).toBe(200);
    expect((response.body.treatments as { label: string }[]).find((t) => t.label === "self_help")).toEqual({ label: "self_help", displayName: "Self-help materials", named: true, phrase: "self-help materials", number: "plural" });
    const unknown = await analyst.request("PUT", `/api/briefs/${briefId}/treatments`, { json: { names: {}, grammar: { nothing: { number: "plural" } } } });
    expect(unknown.status).toBe(400);
    expect(unknown.body.error?.message).toBe("These labels are not treatments in the brief's data: nothing.");
  });
});

describe("removing an outcome", () => {
  it("removes it with its data, results and judgements; a second removal is 404", async () => {
    const { briefId, outcomeId } = await newBriefWithOutcome("Outcome to remove");
    await analyst.upload(`/api/outcomes/${outcomeId}/dataset`, { name: "h.csv", bytes: hasselbladCsv }, { format: "arm-binary" });
    expect((await analyst.request("DELETE", `/api/outcomes/${outcomeId}`)).status).toBe(204);
    const brief = await analyst.request("GET", `/api/briefs/${briefId}`);
    expect((brief.body.brief as { outcomes: unknown[] }).outcomes).toEqual([]);
    expect((await analyst.request("GET", `/api/outcomes/${outcomeId}/result`)).status).toBe(404);
    expect((await analyst.request("DELETE", `/api/outcomes/${outcomeId}`)).status).toBe(404);
  });
});
