// Review before publishing, and withdrawal (PRODUCT.md: draft → in review → published → withdrawn).
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { demoPassword } from "#workflows/seed";
import { ensurePerson } from "#db/people";
import { startTestApp, type TestApp } from "../support/app";
import { analysedBrief as analysedBriefBy } from "../support/briefs";
import { ApiClient } from "../support/client";


let app: TestApp;
const clients: Record<string, ApiClient> = {};
beforeAll(async () => {
  app = await startTestApp();
  await ensurePerson(app.connection.db, { email: "second-editor@fairweigh.example", displayName: "Second editor", password: demoPassword, roles: ["editor"] }, null);
  for (const [name, email] of [
    ["analyst", "analyst@fairweigh.example"],
    ["editor", "editor@fairweigh.example"],
    ["secondEditor", "second-editor@fairweigh.example"],
  ] as const) {
    clients[name] = new ApiClient(app.url);
    await clients[name].signIn(email, demoPassword);
  }
});
afterAll(async () => {
  await app.close();
});

const analysedBrief = (title: string) => analysedBriefBy(clients.analyst!, title);


const review = (who: string, briefId: string, json: Record<string, unknown>) => clients[who]!.request("POST", `/api/briefs/${briefId}/reviews`, { json });
const publish = (briefId: string, json: Record<string, unknown> = {}) => clients.editor!.request("POST", `/api/briefs/${briefId}/versions`, { json });
const statusOf = async (briefId: string) => ((await clients.editor!.request("GET", `/api/briefs/${briefId}`)).body.brief as { status: string }).status;

describe("review", () => {
  it("is needed before publishing: an unreviewed draft is refused", async () => {
    const { briefId } = await analysedBrief("Unreviewed");
    const refused = await publish(briefId);
    expect(refused.status).toBe(409);
    expect(refused.body.error?.key).toBe("errors.publish.notApproved");
  });

  it("goes submit → return with comments → submit → approve → publish, and records each step", async () => {
    const { briefId } = await analysedBrief("Reviewed");
    expect((await review("analyst", briefId, { decision: "submitted" })).status).toBe(201);
    expect(await statusOf(briefId)).toBe("in_review");

    const noComment = await review("editor", briefId, { decision: "returned" });
    expect(noComment.status).toBe(400);
    expect(noComment.body.error?.key).toBe("errors.review.commentRequired");
    expect((await review("editor", briefId, { decision: "returned", comment: "Name the treatments for readers." })).status).toBe(201);
    expect(await statusOf(briefId)).toBe("draft");

    expect((await review("analyst", briefId, { decision: "submitted" })).status).toBe(201);
    expect((await review("editor", briefId, { decision: "approved", acknowledgeWarnings: true })).status).toBe(201);
    expect((await publish(briefId)).status).toBe(201);
    expect(await statusOf(briefId)).toBe("published");

    const history = await clients.analyst!.request("GET", `/api/briefs/${briefId}/reviews`);
    const steps = history.body.steps as { decision: string; comment: string | null; actorName: string }[];
    expect(steps.map((s) => s.decision)).toEqual(["approved", "submitted", "returned", "submitted"]);
    expect(steps[2]).toMatchObject({ comment: "Name the treatments for readers.", actorName: "Demo editor" });
  });

  it("lets whoever submitted recall the submission while it awaits a decision, so one person is never locked out", async () => {
    const { briefId } = await analysedBrief("Recalled");
    expect((await review("editor", briefId, { decision: "submitted" })).status).toBe(201);
    expect((await review("analyst", briefId, { decision: "recalled" })).status).toBe(409);
    const recalled = await review("editor", briefId, { decision: "recalled" });
    expect(recalled.status).toBe(201);
    expect(recalled.body).toEqual({ decision: "recalled", status: "draft" });
    expect((await review("editor", briefId, { decision: "recalled" })).status).toBe(409);
    expect((await review("analyst", briefId, { decision: "submitted" })).status).toBe(201);
  });

  it("lets nobody approve what they submitted themselves, and only editors approve", async () => {
    const { briefId } = await analysedBrief("Four eyes");
    expect((await review("editor", briefId, { decision: "submitted" })).status).toBe(201);
    const own = await review("editor", briefId, { decision: "approved", acknowledgeWarnings: true });
    expect(own.status).toBe(403);
    expect(own.body.error?.key).toBe("errors.review.ownSubmission");
    expect((await review("analyst", briefId, { decision: "approved", acknowledgeWarnings: true })).status).toBe(403);
    expect((await review("secondEditor", briefId, { decision: "approved", acknowledgeWarnings: true })).status).toBe(201);
  });

  it("publishes only what was approved: a change after the approval needs a new review", async () => {
    const { briefId } = await analysedBrief("Changed after approval");
    await review("analyst", briefId, { decision: "submitted" });
    await review("editor", briefId, { decision: "approved", acknowledgeWarnings: true });
    expect((await clients.editor!.request("GET", `/api/briefs/${briefId}/reviews`)).body.approval).toBe("current");

    const brief = (await clients.editor!.request("GET", `/api/briefs/${briefId}`)).body.brief as { rowVersion: number };
    await clients.secondEditor!.request("PATCH", `/api/briefs/${briefId}`, { json: { rowVersion: brief.rowVersion, laySummary: "Written after the approval." } });
    expect((await clients.editor!.request("GET", `/api/briefs/${briefId}/reviews`)).body.approval).toBe("stale");
    const refused = await publish(briefId);
    expect(refused.status).toBe(409);
    expect(refused.body.error?.message).toMatch(/changed since it was approved/);

    expect((await review("secondEditor", briefId, { decision: "submitted" })).status).toBe(201);
    expect((await review("editor", briefId, { decision: "approved", acknowledgeWarnings: true })).status).toBe(201);
    expect((await publish(briefId)).status).toBe(201);
  });
});

describe("withdrawal", () => {
  it("keeps the versions, records the public reason and refuses new versions", async () => {
    const { briefId, slug } = await analysedBrief("To withdraw");
    expect((await clients.editor!.request("POST", `/api/briefs/${briefId}/withdrawal`, { json: { reason: "x" } })).status).toBe(409);
    await review("analyst", briefId, { decision: "submitted" });
    await review("editor", briefId, { decision: "approved", acknowledgeWarnings: true });
    await publish(briefId);

    const noReason = await clients.editor!.request("POST", `/api/briefs/${briefId}/withdrawal`, { json: { reason: " " } });
    expect(noReason.status).toBe(400);
    expect((await clients.analyst!.request("POST", `/api/briefs/${briefId}/withdrawal`, { json: { reason: "x" } })).status).toBe(403);
    const withdrawn = await clients.editor!.request("POST", `/api/briefs/${briefId}/withdrawal`, { json: { reason: "The data set was found to include a retracted trial." } });
    expect(withdrawn.status).toBe(200);
    expect(await statusOf(briefId)).toBe("withdrawn");
    expect((await new ApiClient(app.url).request("GET", `/api/briefs/${slug}/versions/1`)).status).toBe(200);
    expect((await review("analyst", briefId, { decision: "submitted" })).status).toBe(409);
    expect((await publish(briefId, { note: "again" })).status).toBe(409);
  });
});
