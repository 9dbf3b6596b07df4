// Who may use each address: one table for the API routes, the public files and the pages. The
// routes take their role check from it (`guard` in server/web/auth/require-role.ts), docs/roles.md is
// rendered from it (`npm run docs:roles`), and tests/integration/role-matrix.test.ts requests every
// entry as every role and enumerates the router and the pages folder, so that none is missing.
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

const desk = ["analyst", "editor", "translator", "admin"] as const satisfies readonly Role[];
const embargo = "A version before its release (under embargo) answers 404 to all but press and editor.";

/** Every route of the JSON API under /api. */
export const apiAccess = {
  "GET /api/health": { who: "anyone", does: "whether the server and its database answer" },
  "GET /api/csrf": { who: "anyone", does: "a CSRF token for the session (every change needs one)" },
  "GET /api/session": { who: "signed-in", does: "who is signed in" },
  "POST /api/session": { who: "anyone", does: "sign in (rate limited)" },
  "DELETE /api/session": { who: "anyone", does: "sign out: the session ends on the server" },
  "GET /api/people": { who: ["admin"], does: "the people, their roles and locales, active or not" },
  "POST /api/people": { who: ["admin"], does: "invite a person by e-mail with roles (and, for translators, locales)" },
  "PATCH /api/people/:id": {
    who: ["admin"],
    does: "change a person's roles, locales, or deactivate them (their sessions end at once)",
    also: "Never one's own deactivation, never the last active administrator.",
  },
  "POST /api/people/:id/invitation": { who: ["admin"], does: "send an invitation again (the earlier link stops working)" },
  "GET /api/messages": { who: ["admin"], does: "the e-mails sent and their delivery state" },
  "GET /api/dev/mail": { who: "signed-in", does: "the messages the development mailbox kept, with their bodies", also: "Development only (`npm run dev`): 404 in production." },
  "GET /api/audit": { who: ["admin"], does: "the audit log: every change with who, when, what, before and after; filtered and paged" },
  "PATCH /api/account": { who: "signed-in", does: "change one's own name, time zone, password, and (press) the topics that alert one" },
  "POST /api/password-reset": { who: "anyone", does: "ask for a password reset link (the same answer for every address; rate limited)" },
  "POST /api/subscriptions": { who: "anyone", does: "ask for e-mail alerts on a topic (a confirmation link goes out; the same answer for every address; rate limited; no CSRF token)" },
  "POST /api/subscriptions/confirm": { who: "anyone", does: "confirm alerts from the link (double opt-in)" },
  "POST /api/subscriptions/unsubscribe": { who: "anyone", does: "stop alerts: one click from the mail program (RFC 8058) or the unsubscribe page" },
  "POST /api/account/password": { who: "anyone", does: "set a password from a one-time invitation or reset link (rate limited)" },
  "GET /api/briefs": { who: desk, does: "list the briefs in the desk, drafts included" },
  "POST /api/briefs": { who: ["analyst"], does: "create a brief" },
  "GET /api/briefs/:id": { who: desk, does: "read a draft brief with its outcomes" },
  "PATCH /api/briefs/:id": {
    who: ["analyst", "editor"],
    does: "change a brief's title, topic, condition, population, author team; its texts",
    also: "The lay summary and short take need the role editor.",
  },
  "PUT /api/briefs/:id/treatments": { who: ["analyst"], does: "name the treatments of the brief's data" },
  "POST /api/preview": { who: desk, does: "render Markdown as the public page would" },
  "POST /api/briefs/:id/outcomes": { who: ["analyst"], does: "add an outcome" },
  "POST /api/briefs/:id/reviews": {
    who: ["analyst", "editor"],
    does: "submit a draft for review or recall the submission; return or approve it",
    also: "Returning and approving need the role editor, and never one's own submission.",
  },
  "GET /api/briefs/:id/readiness": { who: desk, does: "the draft's publish-readiness checklist" },
  "GET /api/briefs/:id/reviews": { who: desk, does: "the draft's review history" },
  "POST /api/briefs/:id/versions": { who: ["editor"], does: "publish, schedule (embargo) or correct an approved draft" },
  "PUT /api/briefs/:id/versions/:number/release": { who: ["editor"], does: "move an embargoed version's release time" },
  "POST /api/briefs/:id/withdrawal": { who: ["editor"], does: "withdraw a published brief" },
  "GET /api/translations": { who: ["translator", "editor"], does: "the translation queue: each brief's newest version and the state of each language one may translate" },
  "GET /api/translations/:versionId/:locale": { who: ["translator", "editor"], does: "a version's texts in one language beside their source, with what changed at source", also: "Translators: only the languages assigned to them (403 otherwise)." },
  "PUT /api/translations/:versionId/:locale": { who: ["translator", "editor"], does: "save a translation's texts (it becomes a draft again)", also: "Translators: only their languages. The version's snapshot is never written." },
  "POST /api/translations/:versionId/:locale/ready": { who: ["translator", "editor"], does: "mark a translation ready for an editor (refused while a field is empty or its source changed)", also: "Translators: only their languages." },
  "POST /api/translations/:versionId/:locale/publish": { who: ["editor"], does: "publish a ready translation: readers of that language see it, with its publication time; the findings do not change" },
  "GET /api/press-room": { who: ["press", "editor"], does: "the press room: embargoed and recent versions" },
  "GET /api/topics": { who: "anyone", does: "the topics of the released briefs" },
  "POST /api/press-enquiries": { who: ["press"], does: "ask the editors a question from the press room (stored, and e-mailed to each editor)" },
  "GET /api/briefs/:slug/versions/:number": { who: "anyone", does: "read a released version's frozen snapshot", also: embargo },
  "PATCH /api/outcomes/:id": { who: ["analyst"], does: "change an outcome's settings" },
  "DELETE /api/outcomes/:id": { who: ["analyst"], does: "remove an outcome" },
  "PUT /api/outcomes/:id/dataset": { who: ["analyst"], does: "upload an outcome's data (CSV)" },
  "POST /api/outcomes/:id/analysis": { who: ["analyst"], does: "analyse an outcome's data again with the current engine" },
  "GET /api/outcomes/:id/result": { who: desk, does: "the outcome's analysis" },
  "GET /api/outcomes/:id/certainty": { who: desk, does: "the outcome's certainty judgements and suggestions" },
  "PUT /api/outcomes/:id/certainty/:treatment/:comparator": { who: ["analyst"], does: "record certainty for one comparison" },
  "PUT /api/outcomes/:id/certainty": { who: ["analyst"], does: "record certainty for many comparisons at once" },
} as const satisfies Record<string, AccessRule>;

export type ApiRoute = keyof typeof apiAccess;

/** The public site's files beside its pages (server/web/public/routes.ts). */
export const fileAccess = {
  "GET /briefs/:slug/v/:number/cite.:format": { who: "anyone", does: "cite a version (RIS, BibTeX, CSL JSON)", also: embargo },
  "GET /briefs/:slug/v/:number/compare/:a/:b/cite.:format": { who: "anyone", does: "cite one comparison of a version", also: embargo },
  "GET /briefs/:slug/v/:number/downloads/:file": { who: "anyone", does: "download a version's data and results (CSV, JSON)", also: embargo },
  "GET /feed.xml": { who: "anyone", does: "the Atom feed of releases, corrections and withdrawals" },
  "GET /sitemap.xml": { who: "anyone", does: "the sitemap of released pages" },
  "GET /robots.txt": { who: "anyone", does: "robots.txt" },
  "GET /language/:locale": { who: "anyone", does: "choose the site's language (kept in a cookie), then the same page in it" },
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
  "GET /topics/:slug": { who: "anyone", does: "the briefs of a topic" },
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

/** docs/roles.md, rendered from the tables above. */
export function rolesDocument(): string {
  return `# Who may do what

<!-- Rendered from server/core/access.ts by \`npm run docs:roles\`; a test fails when they differ. -->

Roles are checked on the server for every route: each route takes its rule from
\`server/core/access.ts\`, and \`tests/integration/role-matrix.test.ts\` requests every address below as
every reader and expects ✓ to pass the role check and · to be refused (401 for a reader who is not
signed in, 403 for a role that may not). The interface only hides what a person could not do anyway.
A person may hold several roles; an address admits a person who holds any one of the roles it names.

## The API

${table(apiAccess)}

## Files on the public site

${table(fileAccess)}

## Pages

${table(pageAccess)}
`;
}
