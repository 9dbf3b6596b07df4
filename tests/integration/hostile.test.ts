// What a hostile outsider found, each kept as a test against the production build: every malformed
// request gets its 4xx with a message that names what is wrong, never a 500, and nothing partial is
// stored. (The embargo and cache findings are in public-site.test.ts.)
import { readFileSync } from "node:fs";
import http from "node:http";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { demoBriefs } from "#workflows/demo-briefs";
import { demoPassword } from "#workflows/seed";
import { slugify } from "#core/publication/slug";
import { analysedBrief, approve, publishedBrief, rateEveryComparison } from "../support/briefs";
import { demoClient } from "../support/client";
import { withProductionServer } from "../support/production-server";

const { server, clients } = withProductionServer(["analyst", "editor", "press"]);

const get = (path: string, headers: Record<string, string> = {}) => fetch(`${server.url}${path}`, { headers, redirect: "manual" });
const small = slugify(demoBriefs()[0]!.title);
const raw = (method: string, path: string, body: string, headers: Record<string, string> = {}) =>
  fetch(`${server.url}${path}`, { method, headers: { "content-type": "application/json", ...headers }, body, redirect: "manual" });

describe("request bodies", () => {
  it("malformed JSON, or JSON that is not an object, is a 400 naming the body, even before any session", async () => {
    for (const body of ["{bad", "null", "123", '"text"', "[1,"]) {
      const response = await raw("POST", "/api/session", body);
      expect(response.status, body).toBe(400);
      expect(((await response.json()) as { error: { key: string } }).error.key, body).toBe("errors.invalidJson");
    }
  });

  it("a body over the limit is a 413", async () => {
    const response = await raw("POST", "/api/session", JSON.stringify({ email: "a".repeat(1_100_000), password: "x" }));
    expect(response.status).toBe(413);
  });

  it("a NUL byte in a text field is a 400 naming the field, and nothing is stored", async () => {
    const response = await clients.analyst!.request("POST", "/api/briefs", { json: { title: "Nul\u0000title", topic: "t", condition: "c", population: "p" } });
    expect(response.status).toBe(400);
    expect(response.body.error).toMatchObject({ key: "errors.invalidText", details: [{ field: "title" }] });
    const list = await clients.analyst!.request("GET", "/api/briefs");
    expect(JSON.stringify(list.body)).not.toContain("Nul");
  });

  it("a NUL byte in a CSV cell is a 422 naming its line, and the earlier data stays", async () => {
    const { outcomeId } = await analysedBrief(clients.analyst!, "Hostile upload");
    const csv = "study,treatment,events,total\nS1,a,1,10\nS1,b\u0000,2,10\n";
    const upload = await clients.analyst!.upload(`/api/outcomes/${outcomeId}/dataset`, { name: "nul.csv", bytes: csv }, { format: "arm-binary" });
    expect(upload.status).toBe(422);
    expect(upload.body.issues).toEqual([expect.objectContaining({ rule: "nul-byte", row: 3 })]);
    const result = await clients.analyst!.request("GET", `/api/outcomes/${outcomeId}/result`);
    expect((result.body as { treatments: string[] }).treatments).toContain("no_contact");
  });

  it("a row version beyond PostgreSQL's integer is a 400, not a database error", async () => {
    const { briefId } = await analysedBrief(clients.analyst!, "Hostile row version");
    const response = await clients.analyst!.request("PATCH", `/api/briefs/${briefId}`, { json: { rowVersion: 2147483648, title: "x" } });
    expect(response.status).toBe(400);
    expect(response.body.error?.message).toContain("rowVersion");
  });

  it("six briefs created at once with the same title all succeed, each with its own address", async () => {
    const answers = await Promise.all(Array.from({ length: 6 }, () => clients.analyst!.request("POST", "/api/briefs", { json: { title: "Same title at once", topic: "t", condition: "c", population: "p" } })));
    expect(answers.map((answer) => answer.status)).toEqual([201, 201, 201, 201, 201, 201]);
    const slugs = answers.map((answer) => String(answer.body.slug));
    expect(new Set(slugs).size).toBe(6);
    for (const slug of slugs) expect(slug).toMatch(/^same-title-at-once(-\d+)?$/);
  });

  it("names for labels that are not in the brief's data are refused, naming them", async () => {
    const { briefId } = await analysedBrief(clients.analyst!, "Hostile names");
    const response = await clients.analyst!.request("PUT", `/api/briefs/${briefId}/treatments`, { json: { names: { no_contact: "No contact", ghost: "Ghost" } } });
    expect(response.status).toBe(400);
    expect(response.body.error?.message).toContain("ghost");
  });
});

describe("addresses", () => {
  it("a NUL byte, malformed percent-encoding or a version beyond the integer range is a 404", async () => {
    for (const path of ["/briefs/%00", "/briefs/%E0%A4%A", `/briefs/${small}/v/2147483648`, `/briefs/${small}/v/99999999999999999999`, `/briefs/${small}/v/1/compare/%E0%A4%A/x`, `/briefs/${small}/v/2147483648/cite.ris`, "/api/briefs/x/versions/2147483648"]) {
      const response = await get(path);
      expect(response.status, path).toBe(404);
    }
  });

  it("names of Object.prototype are no download", async () => {
    for (const name of ["__proto__", "constructor", "toString", "hasOwnProperty"]) {
      expect((await get(`/briefs/${small}/v/1/downloads/${name}`)).status, name).toBe(404);
    }
  });

  it("another spelling of a version's address is sent to the canonical one, so it is rendered and cached once", async () => {
    const spelled = small.replace("-", "%2D");
    for (const path of [`/briefs/${spelled}/v/1`, `/briefs/${small}/v/1/`, `/briefs/${spelled}/v/1/compare/light/usual_care`]) {
      const response = await get(path);
      expect(response.status, path).toBe(301);
      expect(response.headers.get("location"), path).toBe(path.replace("%2D", "-").replace(/\/$/, ""));
    }
  });
});

describe("round 3 of the hostile probe (F1): the language switcher returns only to this site", () => {
  it.each([
    ["/es//evil.example/x", "/"],
    ["/es/%5Cevil.example", "/"],
    ["//evil.example", "/"],
    ["/fr/%5C%5Cevil.example", "/"],
    ["https://evil.example/", "/"],
  ])("next=%s answers Location %s, never another host", async (next, location) => {
    const answer = await get(`/language/en?next=${next}`);
    expect(answer.status).toBe(303);
    expect(answer.headers.get("location")).toBe(location);
  });

  it("still returns to the same page in the chosen language, query included", async () => {
    const answer = await get(`/language/es?next=${encodeURIComponent("/briefs?q=sleep")}`);
    expect(answer.headers.get("location")).toBe("/es/briefs?q=sleep");
    expect((await get(`/language/en?next=${encodeURIComponent("/fr/briefs/x")}`)).headers.get("location")).toBe("/briefs/x");
  });
});

describe("round 3 of the hostile probe (F5, F12): text that no reader should receive is refused where it enters", () => {
  it.each([
    ["U+0001 in a title", { title: "Sleep\u0001" }, "title"],
    ["U+FFFE in a title", { title: "Sleep\uFFFE" }, "title"],
    ["U+202E in a title", { title: "\u202Epeels" }, "title"],
    ["a title of zero-width characters", { title: "\u200b\u200b" }, "title"],
    ["U+000B in the author team", { authorTeam: "Team\u000bB" }, "authorTeam"],
  ])("%s: 400 naming the field", async (_, fields, field) => {
    const answer = await clients.analyst!.request("POST", "/api/briefs", { json: { title: "Valid", topic: "T", condition: "C", population: "P", ...fields } });
    expect(answer.status).toBe(400);
    expect(JSON.stringify(answer.body.error?.details)).toContain(field);
  });

  it("a treatment name with a control character is refused too", async () => {
    const { briefId } = await analysedBrief(clients.analyst!, "Names with controls");
    const answer = await clients.analyst!.request("PUT", `/api/briefs/${briefId}/treatments`, { json: { names: { no_contact: "No\u0001contact" } } });
    expect(answer.status).toBe(400);
    expect(JSON.stringify(answer.body.error?.details)).toContain("names.no_contact");
  });
});

describe("round 3 of the hostile probe (F2): Markdown nested beyond reason", () => {
  it("the preview answers 400 with the reason for 2000 nested quotes and 1500 nested list markers, never 500", async () => {
    for (const markdown of [`${"> ".repeat(2000)}deep`, `${"- ".repeat(1500)}deep`]) {
      const answer = await clients.editor!.request("POST", "/api/preview", { json: { markdown } });
      expect(answer.status).toBe(400);
      expect(answer.body.error?.details).toContainEqual({ field: "markdown", message: "nests quotes or lists more than 20 levels deep" });
    }
  });

  it("the editor's texts refuse it too, and keep what was saved before", async () => {
    const { briefId } = await analysedBrief(clients.analyst!, "Deeply nested texts");
    const brief = async () => (await clients.editor!.request("GET", `/api/briefs/${briefId}`)).body.brief as { rowVersion: number; laySummary: string };
    const before = await brief();
    const answer = await clients.editor!.request("PATCH", `/api/briefs/${briefId}`, { json: { rowVersion: before.rowVersion, laySummary: `${"> ".repeat(2000)}deep` } });
    expect(answer.status).toBe(400);
    expect((await brief()).laySummary).toBe(before.laySummary);
  });
});

describe("round 3 of the hostile probe (F11): odd request targets", () => {
  /** A request with a raw target, as fetch cannot send one. */
  const rawTarget = (method: string, target: string) =>
    new Promise<{ status: number; body: string }>((resolve, reject) => {
      const url = new URL(server.url);
      const request = http.request({ host: url.hostname, port: url.port, method, path: target }, (response) => {
        let body = "";
        response.setEncoding("utf8").on("data", (chunk: string) => (body += chunk)).on("end", () => resolve({ status: response.statusCode!, body }));
      });
      request.on("error", reject).end();
    });

  it.each([
    ["OPTIONS", "*"],
    ["GET", "*"],
    ["GET", "http://evil.example/briefs"],
    ["POST", "http://evil.example/api/session"],
  ])("%s %s answers 400 that says why, never 500", async (method, target) => {
    const answer = await rawTarget(method, target);
    expect(answer.status).toBe(400);
    expect(answer.body).toBe("The request target must be a path that starts with “/”.");
  });
});

describe("round 3 of the hostile probe (F13): sessions only for people who sign in", () => {
  it("opening the sign-in page stores no session, and its form still works with the visitor's token", async () => {
    const page = await get("/sign-in");
    expect(page.status).toBe(200);
    const cookies = page.headers.getSetCookie();
    expect(cookies.join("\n")).not.toMatch(/fairweigh\.session=/);
    const token = /name="_csrf" value="([^"]+)"/.exec(await page.text())?.[1];
    expect(token).toBeTruthy();
    const cookie = cookies.map((line) => line.split(";")[0]).join("; ");
    const signedIn = await fetch(`${server.url}/api/session`, {
      method: "POST",
      headers: { "content-type": "application/x-www-form-urlencoded", cookie },
      body: new URLSearchParams({ _csrf: token!, email: "analyst@fairweigh.example", password: demoPassword }),
      redirect: "manual",
    });
    expect(signedIn.status).toBe(303);
    expect(signedIn.headers.getSetCookie().join("\n")).toMatch(/fairweigh\.session=/);
  });
});

describe("round 3 of the hostile probe (F7): a query string never reaches the page kept for every reader", () => {
  it("sends a version's or a brief's address with a query to the address without it, and the kept page names no query", async () => {
    for (const path of [`/briefs/${small}/v/1`, `/es/briefs/${small}/v/1`, `/briefs/${small}`]) {
      const answer = await get(`${path}?x=1`);
      expect(answer.status, path).toBe(301);
      expect(answer.headers.get("location"), path).toBe(path);
    }
    const kept = await (await get(`/briefs/${small}/v/1`)).text();
    expect(kept).not.toContain("x=1");
  });
});

describe("what the public files say", () => {
  it("the feed sends titles as text, and a title's markup stays words", async () => {
    await publishedBrief(clients.analyst!, clients.editor!, "Markup <b>bold</b> & more");
    const feed = await (await get("/feed.xml")).text();
    expect(feed).not.toContain('type="html"');
    expect(feed).toContain('<title type="text">Markup &#60;b&#62;bold&#60;/b&#62; &#38; more</title>');
  });

  it("a title with line breaks is refused where it enters, so no RIS file can hold a second record", async () => {
    const answer = await clients.analyst!.request("POST", "/api/briefs", { json: { title: "Two\r\nTY  - GEN\r\nlines", topic: "T", condition: "C", population: "P" } });
    expect(answer.status).toBe(400);
    expect(answer.body.error?.details).toContainEqual({ field: "title", message: "contains a control character or a line break" });
    // Files still keep every field on one line (tests/unit/web/public/citations.test.ts).
  });
});

describe("sessions, caching of API answers, and review", () => {
  it("signing out ends the session on the server and clears its cookie", async () => {
    const person = await demoClient(server.url, "analyst");
    const cookie = person.cookieHeader;
    const out = await person.request("DELETE", "/api/session");
    expect(out.status).toBe(204);
    expect(out.headers.getSetCookie().some((line) => /^fairweigh\.session=;/.test(line) && /Expires=Thu, 01 Jan 1970/.test(line))).toBe(true);
    const replayed = await fetch(`${server.url}/api/session`, { headers: { cookie } });
    expect(replayed.status).toBe(401);
  });

  it("API answers that depend on who asks are never stored by a shared cache", async () => {
    for (const [client, path] of [[clients.press!, "/api/press-room"], [clients.analyst!, "/api/briefs"]] as const) {
      const response = await client.request("GET", path);
      expect(response.headers.get("cache-control"), path).toBe("private, no-store");
    }
    // A released version is the same for everyone, so a cache may share it (an embargoed one never:
    // tests/integration/reuse.test.ts).
    const asPress = await clients.press!.request("GET", `/api/briefs/${small}/versions/1`);
    const asAnyone = await fetch(`${server.url}/api/briefs/${small}/versions/1`);
    expect(asPress.headers.get("cache-control")).toBe("public, max-age=3600");
    expect(await asAnyone.json()).toEqual(asPress.body);
  });

  it("an editor cannot approve again a draft changed after its approval: it is submitted again first", async () => {
    const { briefId } = await analysedBrief(clients.analyst!, "Hostile re-approval");
    await approve(clients.analyst!, clients.editor!, briefId);
    const brief = await clients.analyst!.request("GET", `/api/briefs/${briefId}`);
    const rowVersion = (brief.body.brief as { rowVersion: number }).rowVersion;
    expect((await clients.analyst!.request("PATCH", `/api/briefs/${briefId}`, { json: { rowVersion, population: "Adults who smoke daily" } })).status).toBe(200);
    const again = await clients.editor!.request("POST", `/api/briefs/${briefId}/reviews`, { json: { decision: "approved" } });
    expect(again.status).toBe(409);
    expect(again.body.error?.message).toContain("submitted again");
  });
});

describe("cached pages and the content security policy", () => {
  it("a page served from the cache names no nonce, and its inline scripts are data that never runs", async () => {
    const path = `/briefs/${small}/v/1/compare/light/usual_care`;
    await get(path);
    const cached = await get(path);
    const policy = cached.headers.get("content-security-policy")!;
    expect(policy).toContain("script-src 'self'");
    expect(policy).not.toContain("nonce-");
    expect(policy).not.toContain("unsafe-inline' 'self'");
    const html = await cached.text();
    const inline = [...html.matchAll(/<script(?![^>]*\bsrc=)([^>]*)>/g)].map((m) => m[1]!);
    expect(inline.length).toBeGreaterThan(0);
    for (const attributes of inline) expect(attributes).toMatch(/type="application\/(ld\+)?json"/);
  });
});

describe("the engine runs off the event loop", () => {
  it("the server answers other requests while a large broken upload is being checked", async () => {
    const { outcomeId } = await analysedBrief(clients.analyst!, "Hostile large upload");
    // About 4.5 MB of rows that each break a rule: parsing all of it takes seconds.
    const csv = `study,treatment,events,total\n${"S1,a,not-a-number,10\n".repeat(220_000)}`;
    const order: string[] = [];
    const upload = clients.analyst!.upload(`/api/outcomes/${outcomeId}/dataset`, { name: "large.csv", bytes: csv }, { format: "arm-binary" }).then((answer) => {
      order.push("upload");
      return answer;
    });
    await new Promise((resolve) => setTimeout(resolve, 300));
    const health = await get("/api/health");
    order.push("health");
    expect(health.status).toBe(200);
    const answer = await upload;
    expect(answer.status).toBe(422);
    expect(order).toEqual(["health", "upload"]);
  });
});

describe("a treatment label with a slash", () => {
  it("names one comparison: its links are encoded and its page answers", async () => {
    const csv = readFileSync(path.resolve(__dirname, "../fixtures/reference/hasselblad1998.csv"), "utf8").replaceAll("self_help", "self/help");
    const created = await clients.analyst!.request("POST", "/api/briefs", { json: { title: "Slash label", topic: "Smoking", condition: "Tobacco dependence", population: "Adults" } });
    const briefId = String(created.body.id);
    const outcome = await clients.analyst!.request("POST", `/api/briefs/${briefId}/outcomes`, {
      json: { name: "Quit smoking", kind: "binary", measure: "OR", model: "fixed", referenceTreatment: "no_contact", direction: "higher", baselineRisk: 0.07 },
    });
    const outcomeId = String((outcome.body.outcome as { id: string }).id);
    expect((await clients.analyst!.upload(`/api/outcomes/${outcomeId}/dataset`, { name: "slash.csv", bytes: csv }, { format: "arm-binary" })).status).toBe(200);
    const names = { no_contact: "no_contact", "self/help": "self/help", ind_counseling: "ind_counseling", grp_counseling: "grp_counseling" };
    expect((await clients.analyst!.request("PUT", `/api/briefs/${briefId}/treatments`, { json: { names } })).status).toBe(200);
    await rateEveryComparison(clients.analyst!, outcomeId);
    const { rowVersion } = (await clients.editor!.request("GET", `/api/briefs/${briefId}`)).body.brief as { rowVersion: number };
    await clients.editor!.request("PATCH", `/api/briefs/${briefId}`, { json: { rowVersion, laySummary: "Test.", shortTake: "Test." } });
    await approve(clients.analyst!, clients.editor!, briefId);
    expect((await clients.editor!.request("POST", `/api/briefs/${briefId}/versions`, { json: {} })).status).toBe(201);
    const page = await (await get(`/briefs/${String(created.body.slug)}/v/1`)).text();
    const link = `/briefs/${String(created.body.slug)}/v/1/compare/self%2Fhelp/no_contact`;
    expect(page).toContain(`href="${link}"`);
    const comparison = await get(link);
    expect(comparison.status).toBe(200);
    expect(await comparison.text()).toContain("self/help vs no_contact");
  });
});
