// The role matrix: every address requested as every reader (nobody signed in, then each role alone)
// against the production build, and compared with the policy written out a second time below, by
// hand from the product's roles — not read from the tables the server enforces (server/web/api/routes.ts,
// server/core/access/access.ts).
// A refused reader gets 401 (or, for a page, the way to sign in) when not signed in and 403 otherwise;
// an admitted one gets the answer written beside it, and what an admitted read shows is checked. The
// server's table must say the same as this policy (it renders docs/roles.md), and the router and the
// pages folder are enumerated so that no address is missing from it.
import { readdirSync, readFileSync, statSync } from "node:fs";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { admits, fileAccess, pageAccess, readers, rolesDocument, type AccessRule } from "#core/access/access";
import { apiRoutes } from "#web/api/routes";
import { slugify } from "#core/publication/slug";
import { createApp, projectRoot } from "#web/app";
import { connectDatabase } from "#db/client";
import { demoBriefs } from "#workflows/demo-briefs";
import { publishedBrief } from "../support/briefs";
import { ApiClient, demoClient } from "../support/client";
import { testDatabaseUrl, testSessionSecret } from "../support/app";
import { startProductionServer, type RunningServer } from "../support/production-server";

const nobody = "00000000-0000-4000-8000-000000000000";
const demo = { slug: slugify(demoBriefs()[0]!.title), topic: slugify(demoBriefs()[0]!.topic) };

/**
 * One request per address, built so that it changes nothing: ids that match no brief (404 once the
 * role check passes) and empty bodies (400). Sign-out comes last, as it ends the reader's session.
 */
const apiRequests: Record<keyof typeof apiRoutes, { path: string; json?: unknown }> = {
  "GET /api/health": { path: "/api/health" },
  "GET /api/openapi.json": { path: "/api/openapi.json" },
  "GET /api/releases": { path: "/api/releases" },
  "GET /api/csrf": { path: "/api/csrf" },
  "GET /api/session": { path: "/api/session" },
  "POST /api/session": { path: "/api/session", json: {} },
  "GET /api/people": { path: "/api/people" },
  "POST /api/people": { path: "/api/people", json: {} },
  "PATCH /api/people/:id": { path: `/api/people/${nobody}`, json: {} },
  "POST /api/people/:id/invitation": { path: `/api/people/${nobody}/invitation` },
  "GET /api/messages": { path: "/api/messages" },
  "GET /api/dev/mail": { path: "/api/dev/mail" },
  "GET /api/audit": { path: "/api/audit?limit=5" },
  "PATCH /api/account": { path: "/api/account", json: {} },
  "POST /api/password-reset": { path: "/api/password-reset", json: {} },
  "POST /api/account/password": { path: "/api/account/password", json: {} },
  "POST /api/subscriptions": { path: "/api/subscriptions", json: {} },
  "POST /api/subscriptions/confirm": { path: "/api/subscriptions/confirm", json: {} },
  "POST /api/subscriptions/unsubscribe": { path: "/api/subscriptions/unsubscribe", json: {} },
  "GET /api/briefs": { path: "/api/briefs" },
  "POST /api/briefs": { path: "/api/briefs", json: {} },
  "GET /api/briefs/:id": { path: `/api/briefs/${nobody}` },
  "PATCH /api/briefs/:id": { path: `/api/briefs/${nobody}`, json: {} },
  "PUT /api/briefs/:id/treatments": { path: `/api/briefs/${nobody}/treatments`, json: {} },
  "POST /api/preview": { path: "/api/preview", json: {} },
  "POST /api/briefs/:id/outcomes": { path: `/api/briefs/${nobody}/outcomes`, json: {} },
  "POST /api/briefs/:id/reviews": { path: `/api/briefs/${nobody}/reviews`, json: {} },
  "GET /api/briefs/:id/readiness": { path: `/api/briefs/${nobody}/readiness` },
  "GET /api/briefs/:id/changes": { path: `/api/briefs/${nobody}/changes` },
  "GET /api/briefs/:id/reviews": { path: `/api/briefs/${nobody}/reviews` },
  "POST /api/briefs/:id/versions": { path: `/api/briefs/${nobody}/versions`, json: { releaseAt: "not a time" } },
  "PUT /api/briefs/:id/versions/:number/release": { path: `/api/briefs/${nobody}/versions/1/release`, json: {} },
  "POST /api/briefs/:id/withdrawal": { path: `/api/briefs/${nobody}/withdrawal`, json: {} },
  "GET /api/press-room": { path: "/api/press-room" },
  "POST /api/press-enquiries": { path: "/api/press-enquiries", json: {} },
  "GET /api/topics": { path: "/api/topics" },
  "GET /api/briefs/:slug/versions/:number": { path: `/api/briefs/${demo.slug}/versions/1` },
  "PATCH /api/outcomes/:id": { path: `/api/outcomes/${nobody}`, json: {} },
  "DELETE /api/outcomes/:id": { path: `/api/outcomes/${nobody}` },
  "PUT /api/outcomes/:id/dataset": { path: `/api/outcomes/${nobody}/dataset`, json: {} },
  "POST /api/outcomes/:id/analysis": { path: `/api/outcomes/${nobody}/analysis` },
  "GET /api/outcomes/:id/result": { path: `/api/outcomes/${nobody}/result` },
  "GET /api/outcomes/:id/certainty": { path: `/api/outcomes/${nobody}/certainty` },
  "PUT /api/outcomes/:id/certainty/:treatment/:comparator": { path: `/api/outcomes/${nobody}/certainty/a/b`, json: {} },
  "PUT /api/outcomes/:id/certainty": { path: `/api/outcomes/${nobody}/certainty`, json: {} },
  "GET /api/translations": { path: "/api/translations" },
  "GET /api/translations/:versionId/:locale": { path: `/api/translations/${nobody}/es` },
  "PUT /api/translations/:versionId/:locale": { path: `/api/translations/${nobody}/es`, json: {} },
  "POST /api/translations/:versionId/:locale/ready": { path: `/api/translations/${nobody}/es/ready` },
  "POST /api/translations/:versionId/:locale/publish": { path: `/api/translations/${nobody}/es/publish` },
  "DELETE /api/session": { path: "/api/session" },
};

/** The address the server names itself by (PUBLIC_URL), which oEmbed requires of the pages it embeds. */
const siteAddress = "http://fairweigh.example";
const version = `/briefs/${demo.slug}/v/1`;
const comparison = `${version}/compare/combined/usual_care`;
const siteRequests: Record<keyof typeof fileAccess | keyof typeof pageAccess, string> = {
  "GET /briefs/:slug/v/:number/cite.:format": `${version}/cite.ris`,
  "GET /briefs/:slug/v/:number/compare/:a/:b/cite.:format": `${comparison}/cite.bib`,
  "GET /briefs/:slug/v/:number/downloads/:file": `${version}/downloads/inputs.csv`,
  "GET /briefs/:slug/v/:number/changes.json": `${version}/changes.json`,
  "GET /feed.xml": "/feed.xml",
  "GET /sitemap.xml": "/sitemap.xml",
  "GET /robots.txt": "/robots.txt",
  "GET /language/:locale": `/language/en?next=${encodeURIComponent(version)}`,
  "GET /embed/fonts/:file": "/embed/fonts/inter-400.woff2",
  "GET /embed/briefs/:slug/v/:number": `/embed${version}`,
  "GET /embed/briefs/:slug/v/:number/compare/:a/:b": `/embed${comparison}`,
  "GET /briefs/:slug/v/:number/share.png": `${version}/share.png`,
  "GET /briefs/:slug/v/:number/compare/:a/:b/share.png": `${comparison}/share.png`,
  "GET /oembed": `/oembed?url=${encodeURIComponent(`${siteAddress}${version}`)}&format=json`,
  "GET /": "/",
  "GET /briefs": "/briefs?q=sleep",
  "GET /briefs/:slug": `/briefs/${demo.slug}`,
  "GET /briefs/:slug/v/:number": version,
  "GET /briefs/:slug/v/:number/compare/:a/:b": comparison,
  "GET /briefs/:slug/v/:number/side-by-side": `${version}/side-by-side?options=combined,usual_care`,
  "GET /topics/:slug": `/topics/${demo.topic}`,
  "GET /data": "/data",
  "GET /glossary": "/glossary",
  "GET /sign-in": "/sign-in",
  "GET /password-reset": "/password-reset",
  "GET /password-reset/:token": `/password-reset/${"x".repeat(43)}`,
  "GET /invitation/:token": `/invitation/${"x".repeat(43)}`,
  "GET /subscriptions/confirm/:token": `/subscriptions/confirm/${"x".repeat(43)}`,
  "GET /subscriptions/unsubscribe/:token": `/subscriptions/unsubscribe/${"x".repeat(43)}`,
  "GET /subscriptions/done": "/subscriptions/done?what=sent",
  "GET /desk/*": "/desk/briefs",
  "GET /preview/:id": `/preview/${nobody}`,
};

/**
 * Who may do what, from the roles of the product: the public reads released work; the press also
 * reads embargoed versions and writes to the editors; analysts make briefs, outcomes, data and
 * certainty; editors write the texts, review, publish, correct, withdraw, and publish translations;
 * translators translate into their languages; administrators manage people and read the audit log and
 * the e-mails. Every desk role reads the desk's briefs and drafts. Each row: anonymous, press,
 * translator, analyst, editor, admin; "no" is refused, a number is the status the request above must
 * get once admitted (its ids match nothing: 404; its bodies are empty: 400; a rate-limited form may
 * answer 429 after the earlier readers' tries).
 */
const no = "no";
type Cell = typeof no | number | readonly number[];
const limited = [400, 429] as const;
const policy: Record<keyof typeof apiRoutes | keyof typeof fileAccess | keyof typeof pageAccess, readonly [Cell, Cell, Cell, Cell, Cell, Cell]> = {
  "GET /api/health": [200, 200, 200, 200, 200, 200],
  "GET /api/openapi.json": [200, 200, 200, 200, 200, 200],
  "GET /api/releases": [200, 200, 200, 200, 200, 200],
  "GET /api/csrf": [200, 200, 200, 200, 200, 200],
  "GET /api/session": [no, 200, 200, 200, 200, 200],
  "POST /api/session": [limited, limited, limited, limited, limited, limited],
  "DELETE /api/session": [204, 204, 204, 204, 204, 204],
  "GET /api/people": [no, no, no, no, no, 200],
  "POST /api/people": [no, no, no, no, no, 400],
  "PATCH /api/people/:id": [no, no, no, no, no, 400],
  "POST /api/people/:id/invitation": [no, no, no, no, no, 404],
  "GET /api/messages": [no, no, no, no, no, 200],
  // The development mailbox does not exist in production: 404 to everyone signed in.
  "GET /api/dev/mail": [no, 404, 404, 404, 404, 404],
  "GET /api/audit": [no, no, no, no, no, 200],
  "PATCH /api/account": [no, 200, 200, 200, 200, 200],
  "POST /api/password-reset": [limited, limited, limited, limited, limited, limited],
  "POST /api/account/password": [limited, limited, limited, limited, limited, limited],
  "POST /api/subscriptions": [limited, limited, limited, limited, limited, limited],
  "POST /api/subscriptions/confirm": [limited, limited, limited, limited, limited, limited],
  // One-click unsubscription answers alike whatever it is sent, so that it reveals no subscriber.
  "POST /api/subscriptions/unsubscribe": [200, 200, 200, 200, 200, 200],
  "GET /api/briefs": [no, no, 200, 200, 200, 200],
  "POST /api/briefs": [no, no, no, 400, no, no],
  "GET /api/briefs/:id": [no, no, 404, 404, 404, 404],
  "PATCH /api/briefs/:id": [no, no, no, 400, 400, no],
  "PUT /api/briefs/:id/treatments": [no, no, no, 400, no, no],
  "POST /api/preview": [no, no, 400, 400, 400, 400],
  "POST /api/briefs/:id/outcomes": [no, no, no, 400, no, no],
  "POST /api/briefs/:id/reviews": [no, no, no, 400, 400, no],
  "GET /api/briefs/:id/readiness": [no, no, 404, 404, 404, 404],
  "GET /api/briefs/:id/changes": [no, no, 404, 404, 404, 404],
  "GET /api/briefs/:id/reviews": [no, no, 200, 200, 200, 200],
  "POST /api/briefs/:id/versions": [no, no, no, no, 400, no],
  "PUT /api/briefs/:id/versions/:number/release": [no, no, no, no, 400, no],
  "POST /api/briefs/:id/withdrawal": [no, no, no, no, 400, no],
  "GET /api/translations": [no, no, 200, no, 200, no],
  "GET /api/translations/:versionId/:locale": [no, no, 404, no, 404, no],
  "PUT /api/translations/:versionId/:locale": [no, no, 400, no, 400, no],
  "POST /api/translations/:versionId/:locale/ready": [no, no, 404, no, 404, no],
  "POST /api/translations/:versionId/:locale/publish": [no, no, no, no, 404, no],
  "GET /api/press-room": [no, 200, no, no, 200, no],
  "POST /api/press-enquiries": [no, 400, no, no, no, no],
  "GET /api/topics": [200, 200, 200, 200, 200, 200],
  "GET /api/briefs/:slug/versions/:number": [200, 200, 200, 200, 200, 200],
  "PATCH /api/outcomes/:id": [no, no, no, 400, no, no],
  "DELETE /api/outcomes/:id": [no, no, no, 404, no, no],
  "PUT /api/outcomes/:id/dataset": [no, no, no, 404, no, no],
  "POST /api/outcomes/:id/analysis": [no, no, no, 404, no, no],
  "GET /api/outcomes/:id/result": [no, no, 404, 404, 404, 404],
  "GET /api/outcomes/:id/certainty": [no, no, 404, 404, 404, 404],
  "PUT /api/outcomes/:id/certainty/:treatment/:comparator": [no, no, no, 404, no, no],
  "PUT /api/outcomes/:id/certainty": [no, no, no, 400, no, no],
  "GET /briefs/:slug/v/:number/cite.:format": [200, 200, 200, 200, 200, 200],
  "GET /briefs/:slug/v/:number/compare/:a/:b/cite.:format": [200, 200, 200, 200, 200, 200],
  "GET /briefs/:slug/v/:number/downloads/:file": [200, 200, 200, 200, 200, 200],
  // A first version has no version before it.
  "GET /briefs/:slug/v/:number/changes.json": [404, 404, 404, 404, 404, 404],
  "GET /feed.xml": [200, 200, 200, 200, 200, 200],
  "GET /sitemap.xml": [200, 200, 200, 200, 200, 200],
  "GET /robots.txt": [200, 200, 200, 200, 200, 200],
  "GET /language/:locale": [303, 303, 303, 303, 303, 303],
  "GET /embed/fonts/:file": [200, 200, 200, 200, 200, 200],
  "GET /embed/briefs/:slug/v/:number": [200, 200, 200, 200, 200, 200],
  "GET /embed/briefs/:slug/v/:number/compare/:a/:b": [200, 200, 200, 200, 200, 200],
  "GET /briefs/:slug/v/:number/share.png": [200, 200, 200, 200, 200, 200],
  "GET /briefs/:slug/v/:number/compare/:a/:b/share.png": [200, 200, 200, 200, 200, 200],
  "GET /oembed": [200, 200, 200, 200, 200, 200],
  "GET /": [200, 200, 200, 200, 200, 200],
  "GET /briefs": [200, 200, 200, 200, 200, 200],
  "GET /briefs/:slug": [200, 200, 200, 200, 200, 200],
  "GET /briefs/:slug/v/:number": [200, 200, 200, 200, 200, 200],
  "GET /briefs/:slug/v/:number/compare/:a/:b": [200, 200, 200, 200, 200, 200],
  "GET /briefs/:slug/v/:number/side-by-side": [200, 200, 200, 200, 200, 200],
  "GET /topics/:slug": [200, 200, 200, 200, 200, 200],
  "GET /data": [200, 200, 200, 200, 200, 200],
  "GET /glossary": [200, 200, 200, 200, 200, 200],
  "GET /sign-in": [200, 200, 200, 200, 200, 200],
  "GET /password-reset": [200, 200, 200, 200, 200, 200],
  "GET /password-reset/:token": [200, 200, 200, 200, 200, 200],
  "GET /invitation/:token": [200, 200, 200, 200, 200, 200],
  "GET /subscriptions/confirm/:token": [200, 200, 200, 200, 200, 200],
  "GET /subscriptions/unsubscribe/:token": [200, 200, 200, 200, 200, 200],
  "GET /subscriptions/done": [200, 200, 200, 200, 200, 200],
  "GET /desk/*": [no, 200, 200, 200, 200, 200],
  "GET /preview/:id": [no, no, 404, 404, 404, 404],
};

/** What an admitted read must show (its body), by route; the reader's name decides what is visible. */
const shows: Partial<Record<keyof typeof apiRoutes, (body: Record<string, unknown>, reader: string) => void>> = {
  "GET /api/health": (body) => expect(body.status).toBe("ok"),
  "GET /api/session": (body, reader) => expect((body.person as { roles: string[] }).roles).toEqual([reader]),
  "GET /api/people": (body) => expect((body.people as { roles: string[] }[]).some((person) => person.roles.includes("admin"))).toBe(true),
  "GET /api/messages": (body) => expect(Array.isArray(body.messages)).toBe(true),
  "GET /api/audit": (body) => expect((body.entries as unknown[]).length).toBeGreaterThan(0),
  "GET /api/briefs": (body) => expect((body.briefs as { slug: string }[]).map((brief) => brief.slug)).toContain(demo.slug),
  // Only the press and editors see the embargoed version in the press room.
  "GET /api/press-room": (body) => expect((body.versions as { slug: string }[]).map((version) => version.slug)).toContain(embargoed),
  // The demo translator translates into Spanish and French; an editor may work in every language.
  "GET /api/translations": (body, reader) => expect(body.locales).toEqual(reader === "translator" ? ["es", "fr"] : ["es", "fr", "ar"]),
  "GET /api/topics": (body) => expect(body.topics as { slug: string }[]).toContainEqual(expect.objectContaining({ slug: demo.topic })),
  "GET /api/briefs/:slug/versions/:number": (body) => expect((body as { version: number; brief: { slug: string } }).brief.slug).toBe(demo.slug),
};

let server: RunningServer;
let embargoed: string;
const clients = new Map<string, ApiClient>();

/** A client for the reader, signed in with the reader's demo account unless the reader is anonymous. */
async function signInAs(reader: (typeof readers)[number]) {
  clients.set(reader.name, reader.roles ? await demoClient(server.url, reader.name) : new ApiClient(server.url));
}

beforeAll(async () => {
  server = await startProductionServer({ env: { PUBLIC_URL: siteAddress } });
  for (const reader of readers) await signInAs(reader);
  // A version under embargo, for the rule that only the press and editors read it before its release.
  const inTwoDays = new Date(Date.now() + 48 * 3600 * 1000).toISOString();
  embargoed = (await publishedBrief(clients.get("analyst")!, clients.get("editor")!, "Role matrix embargo", inTwoDays)).slug;
}, 90_000);
afterAll(async () => {
  await server?.stop();
});

/** The expectation for one reader at one address, from the hand-written policy, as a sentence a failure prints. */
function expectAccess(route: keyof typeof policy, reader: (typeof readers)[number], status: number, location: string | null) {
  const cell = policy[route][readers.indexOf(reader)]!;
  const label = `${route} as ${reader.name} → ${status}`;
  const toSignIn = status === 303 && (location ?? "").startsWith("/sign-in");
  if (cell === no) {
    if (reader.roles === null) expect(status === 401 || toSignIn, label).toBe(true);
    else expect(status, label).toBe(403);
  } else {
    expect(typeof cell === "number" ? [cell] : cell, label).toContain(status);
  }
}

describe("every address as every reader", () => {
  it("the API", async () => {
    let cases = 0;
    for (const reader of readers) {
      const client = clients.get(reader.name)!;
      for (const [route, request] of Object.entries(apiRequests)) {
        const method = route.split(" ")[0]!;
        const answer = await client.request(method, request.path, request.json === undefined ? {} : { json: request.json });
        expectAccess(route as keyof typeof apiRoutes, reader, answer.status, null);
        if (answer.status === 200) shows[route as keyof typeof apiRoutes]?.(answer.body, reader.name);
        cases += 1;
      }
      // Signing out ended the session: a new one for the tests below.
      await signInAs(reader);
    }
    expect(cases).toBe(readers.length * Object.keys(apiRoutes).length);
  });

  it("the pages and files of the public site", async () => {
    for (const reader of readers) {
      const client = clients.get(reader.name)!;
      for (const [route, address] of Object.entries(siteRequests)) {
        const answer = await client.request("GET", address, { headers: { accept: "text/html" } });
        expectAccess(route as keyof typeof siteRequests, reader, answer.status, answer.headers.get("location"));
      }
    }
  });

  it("a version under embargo: its page, files and API answer only the press and editors", async () => {
    const at = `/briefs/${embargoed}/v/1`;
    const addresses = [at, `${at}/cite.ris`, `${at}/downloads/results.csv`, `/api/briefs/${embargoed}/versions/1`];
    for (const reader of readers) {
      const mayRead = reader.roles?.some((role) => role === "press" || role === "editor") ?? false;
      for (const address of addresses) {
        const answer = await clients.get(reader.name)!.request("GET", address);
        expect(answer.status, `${address} as ${reader.name}`).toBe(mayRead ? 200 : 404);
      }
    }
  });
});

/** "GET /api/briefs/:id" for every route of an Express router, mounted routers included. */
function routesOf(router: { stack: unknown[] }, prefix = ""): string[] {
  type Layer = { rawPath?: string; route?: { path: string; methods: Record<string, boolean> }; handle?: { stack?: unknown[] } };
  return (router.stack as Layer[]).flatMap((layer) => {
    if (layer.route) {
      const methods = Object.keys(layer.route.methods).filter((m) => m !== "_all");
      return methods.map((method) => `${method.toUpperCase()} ${prefix}${layer.route!.path === "/" && prefix ? "" : layer.route!.path}`);
    }
    if (layer.handle?.stack) {
      const mount = typeof layer.rawPath === "string" && layer.rawPath !== "/" ? layer.rawPath : "";
      return routesOf({ stack: layer.handle.stack }, prefix + mount);
    }
    return [];
  });
}

/** "GET /briefs/:slug/v/:number" for every page folder (a folder holding +Page.tsx is an address). */
function pagesOf(folder: string, segments: string[] = []): string[] {
  const found: string[] = [];
  for (const name of readdirSync(folder)) {
    const inner = path.join(folder, name);
    if (!statSync(inner).isDirectory() || name.startsWith("_")) continue;
    // (group) folders share files without adding to the address; index is the home page.
    const segment = /^\(.*\)$/.test(name) || name === "index" ? null : name.replace(/^@/, ":");
    const next = segment ? [...segments, segment] : segments;
    if (readdirSync(inner).includes("+Page.tsx")) found.push(`GET /${next.join("/")}`);
    found.push(...pagesOf(inner, next));
  }
  return found;
}

describe("the table is complete and the documentation is the table", () => {
  it("every route of the server is in the access table, and every entry is a route", async () => {
    const connection = connectDatabase(testDatabaseUrl());
    try {
      const app = await createApp({ db: connection.db, pool: connection.pool, sessionSecret: testSessionSecret, production: false, secureTransport: false, logLevel: "silent", pages: false });
      const routes = routesOf((app as unknown as { router: { stack: unknown[] } }).router);
      expect(new Set(routes)).toEqual(new Set([...Object.keys(apiRoutes), ...Object.keys(fileAccess)]));
    } finally {
      await connection.close();
    }
  });

  it("every page folder is in the access table, and every entry is a page", () => {
    const pages = pagesOf(path.join(projectRoot, "pages")).map((page) => (page === "GET /desk" ? "GET /desk/*" : page));
    expect(new Set(pages)).toEqual(new Set(Object.keys(pageAccess)));
  });

  it("the server's access table admits exactly whom the hand-written policy admits", () => {
    const table: Record<string, AccessRule> = { ...apiRoutes, ...fileAccess, ...pageAccess };
    expect(new Set(Object.keys(policy))).toEqual(new Set(Object.keys(table)));
    for (const [route, cells] of Object.entries(policy)) {
      for (const [i, reader] of readers.entries()) expect(admits(table[route]!.who, reader.roles), `${route} as ${reader.name}`).toBe(cells[i] !== no);
    }
  });

  it("every address of the table has its request in this test", () => {
    expect(new Set(Object.keys(apiRequests))).toEqual(new Set(Object.keys(apiRoutes)));
    expect(new Set(Object.keys(siteRequests))).toEqual(new Set([...Object.keys(fileAccess), ...Object.keys(pageAccess)]));
  });

  it("docs/roles.md is rendered from the table (npm run docs:roles)", () => {
    expect(readFileSync(path.join(projectRoot, "docs/roles.md"), "utf8")).toBe(rolesDocument(apiRoutes));
  });
});
