// Publishing: frozen versions, the database refusing changes, and the embargo.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { startTestApp, type TestApp } from "../support/app";
import { analysedBrief as analysedBriefBy, approve as approveBy } from "../support/briefs";
import { ApiClient, demoClient } from "../support/client";


let app: TestApp;
const clients: Record<string, ApiClient> = {};
beforeAll(async () => {
  app = await startTestApp();
  for (const role of ["analyst", "editor", "press"]) {
    clients[role] = await demoClient(app.url, role);
  }
});
afterAll(async () => {
  await app.close();
});

const analysedBrief = (title: string) => analysedBriefBy(clients.analyst!, title);
const approve = (briefId: string) => approveBy(clients.analyst!, clients.editor!, briefId);



describe("publishing a version", () => {
  it("creates version 1 with its URL, and the snapshot stays byte-identical after the draft changes", async () => {
    const { briefId, slug, outcomeId } = await analysedBrief("Frozen version");
    await approve(briefId);
    const published = await clients.editor!.request("POST", `/api/briefs/${briefId}/versions`, { json: {} });
    expect(published.status).toBe(201);
    expect(published.body).toEqual({ version: 1, url: `/briefs/${slug}/v/1` });

    const anonymous = new ApiClient(app.url);
    const first = await fetch(`${app.url}/api/briefs/${slug}/versions/1`).then((r) => r.text());
    const snapshot = JSON.parse(first);
    expect(snapshot).toMatchObject({ version: 1, brief: { title: "Frozen version" } });
    expect(snapshot.outcomes[0].result.studies).toBe(24);

    // Created, its texts written, submitted, approved, published: the brief's row is at version 5.
    expect((await clients.analyst!.request("PATCH", `/api/briefs/${briefId}`, { json: { rowVersion: 5, title: "Changed draft title" } })).status).toBe(200);
    expect((await clients.analyst!.request("PATCH", `/api/outcomes/${outcomeId}`, { json: { rowVersion: 1, model: "fixed" } })).status).toBe(200);
    const again = await fetch(`${app.url}/api/briefs/${slug}/versions/1`).then((r) => r.text());
    expect(again).toBe(first);
    expect((await anonymous.request("GET", `/api/briefs/${slug}/versions/2`)).status).toBe(404);
  });

  it("is refused by the database when anything tries to change or delete a version", async () => {
    const { briefId } = await analysedBrief("Trigger check");
    await approve(briefId);
    await clients.editor!.request("POST", `/api/briefs/${briefId}/versions`, { json: {} });
    await expect(app.connection.pool.query("update brief_versions set note = 'edited' where brief_id = $1", [briefId])).rejects.toThrow(/frozen/);
    await expect(app.connection.pool.query("delete from brief_versions where brief_id = $1", [briefId])).rejects.toThrow(/frozen/);
  });

  it("needs a public note for a correction, then creates version 2", async () => {
    const { briefId, slug } = await analysedBrief("Correction");
    await approve(briefId);
    await clients.editor!.request("POST", `/api/briefs/${briefId}/versions`, { json: {} });
    await approve(briefId);
    const refused = await clients.editor!.request("POST", `/api/briefs/${briefId}/versions`, { json: {} });
    expect(refused.status).toBe(400);
    const corrected = await clients.editor!.request("POST", `/api/briefs/${briefId}/versions`, { json: { note: "A study's events were entered twice." } });
    expect(corrected.body).toEqual({ version: 2, url: `/briefs/${slug}/v/2` });
  });

  it("is refused for a brief whose outcome has no analysis", async () => {
    const created = await clients.analyst!.request("POST", "/api/briefs", { json: { title: "Empty", topic: "t", condition: "c", population: "p" } });
    const response = await clients.editor!.request("POST", `/api/briefs/${String(created.body.id)}/versions`, { json: {} });
    expect(response.status).toBe(409);
    expect(response.body.error?.key).toBe("errors.publish.notReady");
  });

  it("is for editors only", async () => {
    const { briefId } = await analysedBrief("Editors only");
    expect((await clients.analyst!.request("POST", `/api/briefs/${briefId}/versions`, { json: {} })).status).toBe(403);
  });
});

describe("the editor's texts", () => {
  it("are frozen into the version as sanitised HTML, and only editors may write them", async () => {
    const { briefId, slug } = await analysedBrief("Lay summary");
    const denied = await clients.analyst!.request("PATCH", `/api/briefs/${briefId}`, { json: { rowVersion: 1, laySummary: "x" } });
    expect(denied.status).toBe(403);
    // The ready draft already has the editor's texts (row version 2); the editor writes them anew.
    const written = await clients.editor!.request("PATCH", `/api/briefs/${briefId}`, {
      json: { rowVersion: 2, laySummary: "Counselling **probably** helps. <script>alert(1)</script>", shortTake: "- [more](javascript:alert(1))" },
    });
    expect(written.status).toBe(200);
    await approve(briefId);
    await clients.editor!.request("POST", `/api/briefs/${briefId}/versions`, { json: {} });
    const snapshot = (await new ApiClient(app.url).request("GET", `/api/briefs/${slug}/versions/1`)).body as { texts: { laySummaryHtml: string; shortTakeHtml: string } };
    expect(snapshot.texts.laySummaryHtml).toContain("<strong>probably</strong>");
    expect(snapshot.texts.laySummaryHtml).not.toMatch(/<script/i);
    expect(snapshot.texts.shortTakeHtml).not.toMatch(/javascript:/i);
  });
});

describe("the embargo", () => {
  it("hides a scheduled version from the public and from analysts, and shows it to the press", async () => {
    const { briefId, slug } = await analysedBrief("Embargoed");
    const releaseAt = new Date(Date.now() + 24 * 3600 * 1000).toISOString();
    await approve(briefId);
    expect((await clients.editor!.request("POST", `/api/briefs/${briefId}/versions`, { json: { releaseAt } })).status).toBe(201);
    const url = `/api/briefs/${slug}/versions/1`;
    expect((await new ApiClient(app.url).request("GET", url)).status).toBe(404);
    expect((await clients.analyst!.request("GET", url)).status).toBe(404);
    const press = await clients.press!.request("GET", url);
    expect(press.status).toBe(200);
    expect(press.body.releaseAt).toBe(releaseAt);
    const brief = await clients.analyst!.request("GET", `/api/briefs/${briefId}`);
    expect((brief.body.brief as { status: string }).status).toBe("scheduled");
  });

  it("lets an editor move the release time while it is embargoed, and never once it is released", async () => {
    const { briefId, slug } = await analysedBrief("Moved embargo");
    await approve(briefId);
    const first = new Date(Date.now() + 24 * 3600 * 1000).toISOString();
    expect((await clients.editor!.request("POST", `/api/briefs/${briefId}/versions`, { json: { releaseAt: first } })).status).toBe(201);
    const moved = new Date(Date.now() + 72 * 3600 * 1000).toISOString();
    const release = (releaseAt: string, who = clients.editor!) => who.request("PUT", `/api/briefs/${briefId}/versions/1/release`, { json: { releaseAt } });
    expect((await release(moved, clients.analyst!)).status).toBe(403);
    const answer = await release(moved);
    expect(answer.status).toBe(200);
    const version = await clients.press!.request("GET", `/api/briefs/${slug}/versions/1`);
    expect(version.body.releaseAt).toBe(moved);
    expect(((await clients.editor!.request("GET", `/api/briefs/${briefId}`)).body.brief as { embargoedUntil: string }).embargoedUntil).toBe(moved);
    expect((await release(new Date(Date.now() - 1000).toISOString())).status).toBe(400);
    // Released now: the row is frozen like any other, in the database too.
    expect((await release(new Date(Date.now() + 1500).toISOString())).status).toBe(200);
    await new Promise((resolve) => setTimeout(resolve, 1700));
    const late = await release(new Date(Date.now() + 3600 * 1000).toISOString());
    expect(late.status).toBe(409);
    expect(late.body.error?.key).toBe("errors.publish.released");
    await expect(app.connection.pool.query("update brief_versions set release_at = now() + interval '1 day' where brief_id = $1", [briefId])).rejects.toThrow(/frozen/);
  });

  it("lifts itself at the release time: the version becomes public and the brief reads as published", async () => {
    const { briefId, slug } = await analysedBrief("Released on time");
    await approve(briefId);
    const releaseAt = new Date(Date.now() + 1000).toISOString();
    expect((await clients.editor!.request("POST", `/api/briefs/${briefId}/versions`, { json: { releaseAt } })).status).toBe(201);
    expect((await new ApiClient(app.url).request("GET", `/api/briefs/${slug}/versions/1`)).status).toBe(404);
    await new Promise((resolve) => setTimeout(resolve, 1200));
    expect((await new ApiClient(app.url).request("GET", `/api/briefs/${slug}/versions/1`)).status).toBe(200);
    expect(((await clients.analyst!.request("GET", `/api/briefs/${briefId}`)).body.brief as { status: string }).status).toBe("published");
  });
});
