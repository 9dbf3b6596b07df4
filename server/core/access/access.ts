// Who may use each address of the public site: its files and its pages (the JSON API's routes state
// theirs in its route table, server/web/api/routes.ts). docs/roles.md is rendered from these tables
// and that one (`npm run docs:roles`), and tests/integration/role-matrix.test.ts requests every entry
// as every role and enumerates the routers and the pages folder, so that none is missing.
import { roleNames, type Role } from "./roles";

/** Anyone (no account), anyone signed in, or a person holding at least one of the roles. */
export type Audience = "anyone" | "signed-in" | readonly Role[];

export interface AccessRule {
  who: Audience;
  /** What the address does, for docs/roles.md. */
  does: string;
  /** A rule that depends on the data rather than the role, stated in docs/roles.md. */
  also?: string;
}

/** Everyone who works in the desk, except the press. */
export const desk = ["analyst", "editor", "translator", "admin"] as const satisfies readonly Role[];

/**
 * A cookie the browser's scripts may read, set at sign-in and cleared at sign-out: a public page is
 * the same for every reader (and kept by caches), so its header learns in the browser, not from the
 * server, that its reader is signed in. It holds no secret; the session cookie stays HttpOnly.
 */
export const signedInCookie = "fairweigh.signedIn";
export const embargo = "A version before its release (under embargo) answers 404 to all but press and editor.";

/** The public site's files beside its pages (server/web/public/routes.ts). */
export const fileAccess = {
  "GET /briefs/:slug/v/:number/cite.:format": { who: "anyone", does: "cite a version (RIS, BibTeX, CSL JSON)", also: embargo },
  "GET /briefs/:slug/v/:number/compare/:a/:b/cite.:format": { who: "anyone", does: "cite one comparison of a version", also: embargo },
  "GET /briefs/:slug/v/:number/downloads/:file": { who: "anyone", does: "download a version's data and results (CSV, JSON)", also: `${embargo} A withdrawn brief's answer 410 with the reason, but to editors.` },
  "GET /briefs/:slug/v/:number/changes.json": { who: "anyone", does: "what changed in a version since the one before (404 for version 1)", also: `${embargo} A withdrawn brief's answer 410 with the reason, but to editors.` },
  "GET /feed.xml": { who: "anyone", does: "the Atom feed of releases, corrections and withdrawals" },
  "GET /sitemap.xml": { who: "anyone", does: "the sitemap of released pages" },
  "GET /robots.txt": { who: "anyone", does: "robots.txt" },
  "GET /language/:locale": { who: "anyone", does: "choose the site's language (kept in a cookie), then the same page in it" },
  "GET /embed/fonts/:file": { who: "anyone", does: "the fonts of the embedded card (WOFF2)" },
  "GET /embed/briefs/:slug/v/:number": { who: "anyone", does: "the card of a released version, for other sites to frame" },
  "GET /embed/briefs/:slug/v/:number/compare/:a/:b": { who: "anyone", does: "the card of one comparison of a released version, for other sites to frame" },
  "GET /briefs/:slug/v/:number/share.png": { who: "anyone", does: "the share image of a released version (1200 × 630 PNG)" },
  "GET /briefs/:slug/v/:number/compare/:a/:b/share.png": { who: "anyone", does: "the share image of one comparison of a released version" },
  "GET /oembed": { who: "anyone", does: "oEmbed 1.0: the card's <iframe> for a released brief, version or comparison address" },
} as const satisfies Record<string, AccessRule>;

/** The pages (the folder under pages/ is the address). */
export const pageAccess = {
  "GET /": { who: "anyone", does: "the home page: recent releases and topics" },
  "GET /briefs": { who: "anyone", does: "search the released briefs" },
  "GET /briefs/:slug": { who: "anyone", does: "a brief's latest released version" },
  "GET /briefs/:slug/v/:number": { who: "anyone", does: "one version of a brief", also: embargo },
  "GET /briefs/:slug/v/:number/compare/:a/:b": { who: "anyone", does: "one comparison of one version", also: embargo },
  "GET /briefs/:slug/v/:number/side-by-side": { who: "anyone", does: "2 to 4 options a reader chose, side by side, in their order (?options=a,b)", also: embargo },
  "GET /topics/:slug": { who: "anyone", does: "the briefs of a topic" },
  "GET /data": { who: "anyone", does: "data for reuse: the open JSON, its stability promise, license and citation" },
  "GET /glossary": { who: "anyone", does: "the words a brief uses, explained; each page links a word here at its first use" },
  "GET /sign-in": { who: "anyone", does: "the sign-in form" },
  "GET /password-reset": { who: "anyone", does: "ask for a password reset link" },
  "GET /password-reset/:token": { who: "anyone", does: "choose a new password from a reset link" },
  "GET /invitation/:token": { who: "anyone", does: "choose a first password from an invitation" },
  "GET /subscriptions/confirm/:token": { who: "anyone", does: "confirm topic alerts" },
  "GET /subscriptions/unsubscribe/:token": { who: "anyone", does: "stop topic alerts" },
  "GET /subscriptions/done": { who: "anyone", does: "what became of a subscription request" },
  "GET /desk/*": { who: "signed-in", does: "the desk (anonymous readers are sent to sign in)" },
  "GET /preview/:id": { who: desk, does: "a draft's page as its next version would read" },
} as const satisfies Record<string, AccessRule>;

export type PageRoute = keyof typeof pageAccess;

/** Whether a reader with these roles (null: nobody signed in) may use an address with this rule. */
export function admits(who: Audience, roles: readonly Role[] | null): boolean {
  if (who === "anyone") return true;
  if (roles === null) return false;
  return who === "signed-in" || who.some((role) => roles.includes(role));
}

/** The readers of docs/roles.md's columns: nobody signed in, then each role alone. */
export const readers = [
  { name: "anonymous", roles: null },
  ...(["press", "translator", "analyst", "editor", "admin"] as const satisfies readonly Role[]).map((role) => ({ name: role, roles: [role] as Role[] })),
] as const;

// Every role has its column.
if (readers.length !== roleNames.length + 1) throw new Error("access.ts: a role is missing from the readers");

function table(rules: Record<string, AccessRule>): string {
  const header = `| address | what it does | ${readers.map((reader) => reader.name).join(" | ")} |`;
  const rule = `|---|---|${readers.map(() => ":-:").join("|")}|`;
  const rows = Object.entries(rules).map(([route, { who, does, also }]) => {
    const cells = readers.map((reader) => (admits(who, reader.roles) ? "✓" : "·"));
    return `| \`${route}\` | ${does}${also ? `. ${also}` : ""} | ${cells.join(" | ")} |`;
  });
  return [header, rule, ...rows].join("\n");
}

/** docs/roles.md, rendered from the tables above and the API's route table. */
export function rolesDocument(apiRules: Record<string, AccessRule>): string {
  return `# Who may do what

<!-- Rendered from server/web/api/routes.ts and server/core/access/access.ts by \`npm run docs:roles\`; a test fails when they differ. -->

Roles are checked on the server for every route: each API route takes its rule from its entry in
\`server/web/api/routes.ts\`, the files and pages from \`server/core/access/access.ts\`, and \`tests/integration/role-matrix.test.ts\` requests every address below as
every reader and expects ✓ to pass the role check and · to be refused (401 for a reader who is not
signed in, 403 for a role that may not). The interface only hides what a person could not do anyway.
A person may hold several roles; an address admits a person who holds any one of the roles it names.

## Under embargo

A version before its release time (scheduled, under embargo) is read by:

- **press and editors**: its pages, files and snapshot, as readers will see them; everyone else gets 404;
- **translators**: its texts only, in the translation desk, in the languages assigned to them, so that
  a translation can be ready at the release; a translation an editor publishes before the release
  goes public with it. They are asked by e-mail as soon as the version is scheduled. They do not read
  its public pages or files before the release.

Every desk role, translators included, reads the briefs in the desk and their previews: these are the
working drafts, not a released or embargoed version, and nothing in the desk is public or cached.
Nothing under embargo is kept by a shared cache (\`private, no-store\`). How a correction, an
embargo and a withdrawal reach each channel: \`docs/brief-lifecycle.md\`.

## The API

${table(apiRules)}

## Files on the public site

${table(fileAccess)}

## Pages

${table(pageAccess)}
`;
}
