// The public reads for outside use (docs/data.md): the released briefs, a version's snapshot and the
// OpenAPI document, readable from any site, with an ETag, cacheable only when every reader gets the
// same answer.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { slugify } from "#core/publication/slug";
import { demoBriefs } from "#workflows/demo-briefs";
import { startTestApp, type TestApp } from "../support/app";
import { publishedBrief } from "../support/briefs";
import { ApiClient, demoClient } from "../support/client";

let app: TestApp;
beforeAll(async () => {
  app = await startTestApp();
});
afterAll(async () => {
  await app.close();
});

const demoSlug = slugify(demoBriefs()[0]!.title);

describe("data for reuse", () => {
  it("lists the released briefs with the address of each snapshot, readable from any site", async () => {
    const answer = await new ApiClient(app.url).request("GET", "/api/releases", { headers: { origin: "https://news.example" } });
    expect(answer.status).toBe(200);
    expect(answer.headers.get("access-control-allow-origin")).toBe("*");
    expect(answer.headers.get("access-control-allow-credentials")).toBeNull();
    expect(answer.headers.get("cache-control")).toBe("public, max-age=60");
    expect(answer.headers.get("ratelimit-policy")).toMatch(/^"600-in-1min"; q=600; w=60;/);
    const briefs = answer.body.briefs as { slug: string; demo: boolean; withdrawn: boolean; version: number; page: string; snapshot: string }[];
    const demo = briefs.find((brief) => brief.slug === demoSlug)!;
    expect(demo).toMatchObject({ demo: true, withdrawn: false, version: 1, page: `/briefs/${demoSlug}/v/1`, snapshot: `/api/briefs/${demoSlug}/versions/1` });
  });

  it("answers a released snapshot with an ETag, and 304 when it has not changed", async () => {
    const reader = new ApiClient(app.url);
    const first = await reader.request("GET", `/api/briefs/${demoSlug}/versions/1`);
    expect(first.status).toBe(200);
    expect(first.body.schemaVersion).toBe(6);
    expect((first.body.brief as { slug: string }).slug).toBe(demoSlug);
    expect(first.headers.get("cache-control")).toBe("public, max-age=3600");
    const etag = first.headers.get("etag")!;
    expect(etag).toMatch(/^W\/"/);
    // A revalidation, as a browser sends it (fetch would otherwise add "Cache-Control: no-cache").
    const again = await reader.request("GET", `/api/briefs/${demoSlug}/versions/1`, { headers: { "if-none-match": etag, "cache-control": "max-age=0" } });
    expect(again.status).toBe(304);
  });

  it("never lets a cache keep a version under embargo, which only the press and editors read", async () => {
    const analyst = await demoClient(app.url, "analyst");
    const editor = await demoClient(app.url, "editor");
    const inTwoDays = new Date(Date.now() + 48 * 3600 * 1000).toISOString();
    const { slug } = await publishedBrief(analyst, editor, "Reuse under embargo", inTwoDays);
    const press = await demoClient(app.url, "press");
    const early = await press.request("GET", `/api/briefs/${slug}/versions/1`);
    expect(early.status).toBe(200);
    expect(early.headers.get("cache-control")).toBe("private, no-store");
    const anonymous = await new ApiClient(app.url).request("GET", `/api/briefs/${slug}/versions/1`);
    expect(anonymous.status).toBe(404);
    expect(anonymous.headers.get("cache-control")).toBe("private, no-store");
  });

  it("describes itself as OpenAPI 3.1, with this site as its server", async () => {
    const answer = await new ApiClient(app.url).request("GET", "/api/openapi.json");
    expect(answer.status).toBe(200);
    expect(answer.body.openapi).toBe("3.1.0");
    expect(answer.body.servers).toEqual([{ url: app.url }]);
    expect(Object.keys(answer.body.paths as object)).toContain("/api/releases");
  });

  it("answers an address whose parameter cannot name anything with 404, after the role check", async () => {
    const analyst = await demoClient(app.url, "analyst");
    const answer = await analyst.request("GET", "/api/briefs/not-an-id");
    expect(answer.status).toBe(404);
    expect(answer.body.error).toEqual({ key: "errors.notFound", message: "There is nothing at this address (id: not an id).", details: [{ field: "id", message: "not an id" }] });
    expect((await new ApiClient(app.url).request("GET", "/api/briefs/not-an-id")).status).toBe(401);
    const editor = await demoClient(app.url, "editor");
    const locale = await editor.request("GET", "/api/translations/0b5f9c8e-1d2a-4c3b-9e8f-7a6b5c4d3e2f/de");
    expect(locale.status).toBe(404);
    expect(locale.body.error?.message).toBe("There is nothing at this address (locale: not a translation language: choose one of es, fr, ar).");
  });
});
