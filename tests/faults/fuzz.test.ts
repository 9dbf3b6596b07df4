// Hostile input by property-based tests (fast-check, fixed seed so a failure replays): malformed CSV
// to the upload route, random JSON to every API route that takes a body, random path segments in every
// public address, and any method with odd headers at every route. Always an answer below 500, a 4xx
// that says what is wrong, and nothing stored from a refused upload. The counts below are the number
// of requests each property makes.
import { request } from "node:http";
import fc from "fast-check";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { admits, fileAccess, pageAccess, readers, type AccessRule } from "#core/access/access";
import { apiRoutes } from "#web/api/routes";
import { formats } from "#core/nma/types";
import { slugify } from "#core/publication/slug";
import { demoBriefs } from "#workflows/demo-briefs";
import { analysedBrief } from "../support/briefs";
import { ApiClient, demoClient } from "../support/client";
import { startProductionServer, type RunningServer } from "../support/production-server";

const seed = 20261202;
const runs = { csv: 120, jsonPerRoute: 40, paths: 300, methodsAndHeaders: 600 };

let server: RunningServer;
const clients = new Map<string, ApiClient>();
let draft: { briefId: string; outcomeId: string };

beforeAll(async () => {
  server = await startProductionServer();
  for (const reader of readers) {
    clients.set(reader.name, reader.roles ? await demoClient(server.url, reader.name) : new ApiClient(server.url));
  }
  draft = await analysedBrief(clients.get("analyst")!, "Fuzzed draft");
}, 90_000);
afterAll(async () => {
  await server?.stop();
});

/** An error answer of the API names what is wrong: a key and a sentence. */
function expectClearRefusal(status: number, body: unknown, where: string) {
  expect(status, where).toBeLessThan(500);
  if (status < 400) return;
  const error = (body as { error?: { key?: unknown; message?: unknown } } | null)?.error;
  expect(typeof error?.key, `${where}: ${JSON.stringify(body)?.slice(0, 200)}`).toBe("string");
  expect(String(error?.message ?? "").length, where).toBeGreaterThan(10);
}

// ---------------------------------------------------------------------------------------------------
// CSV to the upload route

const header = "study,treatment,events,total";
const cell = fc.oneof(
  fc.string({ maxLength: 12 }),
  fc.string({ unit: "binary", maxLength: 12 }),
  fc.constantFrom("=HYPERLINK(\"http://x\")", "+1+1", "-2", "@SUM(A1)", "\u0000", "NaN", "Infinity", "1e400", "-0", "\"unclosed", "1,5", " ", ""),
  fc.integer({ min: -5, max: 2_000_000_000 }).map(String),
);
const row = fc.array(cell, { minLength: 0, maxLength: 6 }).map((cells) => cells.join(","));
const csvText = fc.array(row, { maxLength: 30 }).map((rows) => [header, ...rows].join("\n"));
const hostileCsv: fc.Arbitrary<Uint8Array | string> = fc.oneof(
  csvText,
  fc.uint8Array({ maxLength: 4096 }),
  fc.constantFrom(
    `${header}\nS1,a,1,"unclosed\nS1,b,2,10\n`,
    `${header}\nS1,${"x".repeat(300_000)},1,10\nS1,b,2,10\n`,
    Array.from({ length: 10_000 }, (_, i) => `c${i}`).join(",") + "\n" + Array.from({ length: 10_000 }, () => "1").join(","),
    "",
    "\uFEFF",
  ),
  // The same rows in encodings other than UTF-8: UTF-16 with its byte-order mark, and Latin-1 bytes.
  csvText.map((text) => new Uint8Array([0xff, 0xfe, ...Buffer.from(text, "utf16le")])),
  csvText.map((text) => new Uint8Array(Buffer.from(`${text}\nS9,caf\u00e9,1,10`, "latin1"))),
);

describe("hostile CSV to the upload route", () => {
  it(`${runs.csv} uploads: each refused with a reason, and the data stored before stays`, async () => {
    const analyst = clients.get("analyst")!;
    const resultPath = `/api/outcomes/${draft.outcomeId}/result`;
    const before = JSON.stringify((await analyst.request("GET", resultPath)).body);
    const statuses = new Map<number, number>();
    await fc.assert(
      fc.asyncProperty(hostileCsv, fc.constantFrom(...formats, "arm-binary", "nonsense"), async (bytes, format) => {
        const answer = await analyst.upload(`/api/outcomes/${draft.outcomeId}/dataset`, { name: "hostile.csv", bytes }, { format });
        statuses.set(answer.status, (statuses.get(answer.status) ?? 0) + 1);
        expectClearRefusal(answer.status, answer.body, `upload (${format})`);
        expect(answer.status, "random bytes made a valid upload").not.toBe(200);
        if (answer.status === 422) expect((answer.body.issues as unknown[]).length).toBeGreaterThan(0);
        expect(JSON.stringify((await analyst.request("GET", resultPath)).body)).toBe(before);
      }),
      { seed, numRuns: runs.csv },
    );
    // Both doors were tried: the request's fields (400) and the rows themselves (422).
    expect([...statuses.keys()].sort()).toEqual(expect.arrayContaining([400, 422]));
  });
});

// ---------------------------------------------------------------------------------------------------
// JSON to every API body

/** Raw request bodies: any JSON value, deep nesting, NUL bytes, numbers beyond any column, and text that is not JSON. */
const hostileJson: fc.Arbitrary<string> = fc.oneof(
  fc.jsonValue({ maxDepth: 4 }).map((value) => JSON.stringify(value)),
  fc.dictionary(fc.constantFrom("title", "rowVersion", "decision", "names", "releaseAt", "note", "email", "password", "laySummary", "model", "kind", "judgements", "comment"), fc.oneof(fc.string(), fc.constant("a\u0000b"), fc.double(), fc.constantFrom(2 ** 31, 2 ** 63, -1, 1e308, null, true, [], {}))).map((value) => JSON.stringify(value)),
  fc.integer({ min: 1, max: 20_000 }).map((depth) => "[".repeat(depth) + "]".repeat(depth)),
  fc.integer({ min: 1, max: 5_000 }).map((depth) => '{"a":'.repeat(depth) + "1" + "}".repeat(depth)),
  fc.string({ unit: "binary", maxLength: 64 }),
  fc.constantFrom("{", "null", "123", '"text"', '{"__proto__":{"admin":true}}', '{"constructor":{"prototype":{}}}', "\u0000"),
);

const withBody = Object.entries(apiRoutes).filter(([route]) => !route.startsWith("GET ") && !route.startsWith("DELETE "));

/** A reader the route admits, so that the body is read rather than refused at the door. */
function admittedReader(rule: AccessRule): string {
  return readers.find((reader) => reader.roles && admits(rule.who, reader.roles))!.name;
}

describe("random JSON to every API body", () => {
  it(`${withBody.length} routes × ${runs.jsonPerRoute} bodies: never a 500, always a reason`, async () => {
    const ids = { id: draft.briefId, number: "1", treatment: "self_help", comparator: "no_contact" };
    const statuses = new Set<number>();
    for (const [route, rule] of withBody) {
      const [method, pattern] = route.split(" ") as [string, string];
      // The fuzzed brief and its outcome, so that a body that parses reaches the handler.
      const address = pattern.replace(/:(\w+)/g, (_, name: string) => (pattern.startsWith("/api/outcomes") && name === "id" ? draft.outcomeId : ids[name as keyof typeof ids]));
      const client = clients.get(admittedReader(rule))!;
      await fc.assert(
        fc.asyncProperty(hostileJson, async (body) => {
          const csrf = (await client.request("GET", "/api/csrf")).body.token as string;
          const answer = await fetch(`${server.url}${address}`, { method, headers: { "content-type": "application/json", "x-csrf-token": csrf, cookie: client.cookieHeader, accept: "application/json" }, body });
          const text = await answer.text();
          let parsed: unknown = null;
          try {
            parsed = JSON.parse(text);
          } catch {
            parsed = text;
          }
          statuses.add(answer.status);
          expectClearRefusal(answer.status, parsed, `${route} with ${body.slice(0, 80)}`);
        }),
        { seed, numRuns: runs.jsonPerRoute },
      );
    }
    expect([...statuses]).toEqual(expect.arrayContaining([400]));
    console.log(`random JSON: statuses seen ${[...statuses].sort().join(", ")}`);
  }, 300_000);
});

// ---------------------------------------------------------------------------------------------------
// Random path segments in every public address

const segment: fc.Arbitrary<string> = fc.oneof(
  fc.string({ maxLength: 20 }).map(encodeURIComponent),
  fc.string({ unit: "binary", maxLength: 20 }).map(encodeURIComponent),
  fc.constantFrom("%00", "%", "%zz", "%E0%A4%A", "..", "%2e%2e", "__proto__", "constructor", "toString", "9".repeat(40), "-1", "0", "2147483648", "%2F", "a%2Fb", "%C0%AE", ";", "v", "~"),
);

describe("random path segments in every public address", () => {
  it(`${runs.paths} addresses across every page and file: never a 500`, async () => {
    const patterns = [...Object.keys(pageAccess), ...Object.keys(fileAccess)].map((route) => route.split(" ")[1]!).filter((pattern) => /:\w+/.test(pattern));
    const slug = slugify(demoBriefs()[0]!.title);
    const statuses = new Set<number>();
    await fc.assert(
      fc.asyncProperty(fc.constantFrom(...patterns), fc.array(segment, { minLength: 5, maxLength: 5 }), fc.boolean(), async (pattern, segments, keepSlug) => {
        let i = 0;
        // Half keep a real brief, so that the later segments are read too.
        const address = pattern.replace(/:(\w+)/g, (_, name: string) => (name === "slug" && keepSlug ? slug : segments[i++ % segments.length]!)).replace("*", segments[4]!);
        const answer = await fetch(`${server.url}${address}`, { redirect: "manual" });
        statuses.add(answer.status);
        expect(answer.status, address).toBeLessThan(500);
      }),
      { seed, numRuns: runs.paths },
    );
    console.log(`random paths: statuses seen ${[...statuses].sort().join(", ")}`);
  }, 120_000);
});

// ---------------------------------------------------------------------------------------------------
// Any method and odd headers at every route

const method = fc.constantFrom("GET", "HEAD", "POST", "PUT", "PATCH", "DELETE", "OPTIONS", "TRACE", "PROPFIND", "MKCOL", "LOCK", "PURGE", "SEARCH");
/** Headers a careless or hostile client sends: broken negotiation, junk validators and ranges, odd cookies and bodies of the wrong type. */
const oddHeaders: fc.Arbitrary<Record<string, string>> = fc.record(
  {
    "accept-language": fc.oneof(fc.string({ maxLength: 40 }), fc.constantFrom("*", "xx-YY;q=2", "ar;q=abc, es;q=", ";;;", "es".repeat(2000), "zh-Hant-TW-u-nu-hanidec")),
    accept: fc.constantFrom("*/*", "text/html", "application/json", "image/png", "nonsense", "text/*;q=0", ""),
    "if-none-match": fc.oneof(fc.string({ maxLength: 30 }).map((text) => `"${text}"`), fc.constantFrom("*", "W/", '"', "W/\"x\", \"y")),
    "if-modified-since": fc.constantFrom("yesterday", "Thu, 01 Jan 1970 00:00:00 GMT", "Sat, 31 Dec 9999 23:59:59 GMT", ""),
    range: fc.constantFrom("bytes=0-0", "bytes=-1", "bytes=999999999-", "bytes=5-1", "lines=1-2", "bytes=0-1,2-3,4-5"),
    cookie: fc.oneof(fc.string({ maxLength: 60 }).map((text) => text.replace(/[^\x20-\x7e]/g, "")), fc.constantFrom("fairweigh.sid=s%3Aforged.sig", "fairweigh.sid=", "fairweigh.visitor=%", "a=" + "b".repeat(3000), "=;=;=")),
    "content-type": fc.constantFrom("application/json", "application/json; charset=latin1", "text/plain", "multipart/form-data", "multipart/form-data; boundary=", "application/x-www-form-urlencoded", "application/xml"),
    "x-csrf-token": fc.oneof(fc.string({ maxLength: 40 }).map((text) => text.replace(/[^\x20-\x7e]/g, "")), fc.constant("")),
    "x-forwarded-for": fc.constantFrom("1.2.3.4", "::1", "not-an-address", "1.2.3.4, 5.6.7.8", ""),
    "x-forwarded-proto": fc.constantFrom("https", "http", "gopher", ""),
  },
  { requiredKeys: [] },
);
const oddBody = fc.oneof(fc.constant(""), fc.constant("{"), fc.string({ maxLength: 200 }), fc.constant("a=1&a=2&_csrf=x"), fc.constant("--x\r\nContent-Disposition: form-data; name=\"file\"\r\n\r\n1\r\n--x--"));

/** One request through node:http, which sends any method and header as given (fetch refuses some). */
function rawRequest(url: string, options: { method: string; headers: Record<string, string>; body: string }): Promise<number> {
  return new Promise((resolve, reject) => {
    const req = request(url, { method: options.method, headers: options.headers }, (res) => {
      res.resume();
      res.on("end", () => resolve(res.statusCode ?? 0));
    });
    req.on("error", reject);
    if (options.body && options.method !== "GET" && options.method !== "HEAD") req.write(options.body);
    req.end();
  });
}

describe("any method and odd headers at every route", () => {
  it(`${runs.methodsAndHeaders} requests across every API route, page and file: never a 500`, async () => {
    const slug = slugify(demoBriefs()[0]!.title);
    const values: Record<string, string> = { id: draft.briefId, number: "1", treatment: "self_help", comparator: "no_contact", slug, a: "light", b: "usual_care", format: "ris", file: "results.csv", locale: "es", token: "x".repeat(43), personId: draft.briefId };
    const addresses = [...Object.keys(apiRoutes), ...Object.keys(pageAccess), ...Object.keys(fileAccess)].map((route) => route.split(" ")[1]!.replace(/:(\w+)/g, (_, name: string) => values[name] ?? "x").replace("*", "x"));
    const statuses = new Map<number, number>();
    await fc.assert(
      fc.asyncProperty(fc.constantFrom(...addresses), method, oddHeaders, oddBody, fc.constantFrom(...clients.keys()), async (address, verb, headers, body, reader) => {
        const cookie = headers.cookie ?? clients.get(reader)!.cookieHeader;
        const status = await rawRequest(`${server.url}${address}`, { method: verb, headers: { ...headers, ...(cookie ? { cookie } : {}) }, body });
        statuses.set(status, (statuses.get(status) ?? 0) + 1);
        expect(status, `${verb} ${address} ${JSON.stringify(headers).slice(0, 300)}`).toBeLessThan(500);
      }),
      { seed, numRuns: runs.methodsAndHeaders },
    );
    console.log(`methods and headers: statuses seen ${JSON.stringify(Object.fromEntries([...statuses].sort(([a], [b]) => a - b)))}`);
  }, 300_000);
});
