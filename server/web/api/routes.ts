// The route table of the JSON API (docs/decisions/0037-one-route-table.md): every route once, as
// "METHOD /path", with who may call it, what it does, and the zod schemas of its address, query, body
// and answer. From it: the Express routes are registered with typed requests and their role check
// (server/web/api/handle.ts), docs/roles.md's API table is rendered, /api/openapi.json is generated
// (openapi.ts), the desk's client is typed (components/desk/api.ts), and the integration tests check
// every answer they receive against its schema (tests/support/route-answers.ts). Browser-safe, like contract.ts.
import { z } from "zod";
import { desk, embargo, type AccessRule } from "#core/access/access";
import type { RouteAnswers } from "./contract";
import { translationLocales } from "#core/languages/locales";
import { roleNames } from "#core/access/roles";
import { versionSnapshotSchema } from "#core/snapshot/schema";
import { reviewDecisions } from "#core/editorial/status";
import {
  accountBody,
  auditQuery,
  changePersonBody,
  createBriefBody,
  createOutcomeBody,
  credentialsBody,
  inviteBody,
  judgementBody,
  judgementsBody,
  newPasswordBody,
  passwordResetBody,
  patchBriefBody,
  patchOutcomeBody,
  pressEnquiryBody,
  previewBody,
  publishBody,
  rescheduleBody,
  reviewBody,
  saveTranslationBody,
  subscribeBody,
  tokenBody,
  treatmentNamesBody,
  withdrawalBody,
} from "./contract";

export interface RouteSpec extends AccessRule {
  /** The address's parameters; one that does not fit names nothing here, so the answer is 404. */
  params?: z.ZodObject;
  query?: z.ZodType;
  /** JSON (or a form's fields) unless `multipart`. */
  body?: z.ZodType;
  /** The route also serves an HTML form and answers it with redirects, so it reads its body itself. */
  form?: true;
  /** The body is multipart/form-data (an upload); the handler reads it. */
  multipart?: true;
  /** The success status and the schema of its JSON answer (204: no body). */
  status?: 200 | 201 | 202 | 204;
  answer?: z.ZodType;
  /** A change that takes no CSRF token (readers' alerts: server/web/api/subscriptions.ts says why); every other change needs one. */
  csrf?: false;
  /** A public read for outside use: CORS, ETag and the public rate limit (docs/data.md). */
  reuse?: true;
}


// Addresses -------------------------------------------------------------------------------------
const uuid = z.string().regex(/^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i, "not an id");
const byId = z.object({ id: uuid });
const versionNumber = z.string().regex(/^[1-9]\d{0,8}$/, "not a version number");
const translationAddress = z.object({ versionId: uuid, locale: z.enum(translationLocales, { error: `not a translation language: choose one of ${translationLocales.join(", ")}` }) });
const pairAddress = z.object({ id: uuid, treatment: z.string().min(1).max(200), comparator: z.string().min(1).max(200) });

// Answers: what each route sends, as JSON carries it. Objects nested in an answer are open
// (looseObject): a field may be added without breaking a reader, never removed or retyped.
const isoTime = z.string().regex(/^\d{4}-\d{2}-\d{2}T/, "an ISO 8601 time");
const person = z.looseObject({
  id: uuid,
  email: z.string(),
  displayName: z.string(),
  roles: z.array(z.enum(roleNames)),
  locale: z.string(),
  translationLocales: z.array(z.string()),
  timeZone: z.string(),
  alertTopics: z.array(z.string()),
});
const personRecord = person.extend({ active: z.boolean(), passwordSet: z.boolean(), createdAt: isoTime });
const briefSummary = z.looseObject({ id: uuid, slug: z.string(), title: z.string(), topic: z.string(), status: z.string(), rowVersion: z.number().int() });
const treatment = z.looseObject({ label: z.string(), displayName: z.string() });
const briefDetail = briefSummary.extend({ treatments: z.array(treatment), outcomes: z.array(z.looseObject({ id: uuid, name: z.string() })) });
const outcome = z.looseObject({ id: uuid, briefId: uuid, name: z.string(), kind: z.string(), rowVersion: z.number().int() });
const certainty = z.looseObject({ treatment: z.string(), comparator: z.string() });
const readinessItem = z.looseObject({ key: z.string(), values: z.record(z.string(), z.unknown()) });
const readiness = z.looseObject({ blocking: z.array(readinessItem), warnings: z.array(readinessItem) });
const translation = z.looseObject({ versionId: uuid, locale: z.enum(translationLocales), state: z.string(), fields: z.array(z.looseObject({ name: z.string(), target: z.string(), stale: z.boolean() })) });
const analysis = z.looseObject({ treatments: z.array(z.string()), studies: z.number().int(), engineVersion: z.string() });
const uploadReport = z.union([
  z.looseObject({ valid: z.literal(true), datasetId: uuid, sha256: z.string(), studies: z.number().int(), treatments: z.array(z.string()), excludedStudies: z.array(z.string()), resultId: uuid }),
  z.looseObject({ valid: z.literal(true), analysing: z.literal(true), uploadId: uuid, fileName: z.string() }),
]);
const topic = z.object({ slug: z.string(), name: z.string(), count: z.number().int() });
const released = z.object({
  slug: z.string(),
  title: z.string(),
  topic: z.string(),
  topicSlug: z.string(),
  condition: z.string(),
  population: z.string(),
  demo: z.boolean().describe("fictional demonstration data"),
  withdrawn: z.boolean(),
  version: z.number().int().positive().describe("the newest released version"),
  releaseAt: isoTime,
  page: z.string().describe("the version's page on this site"),
  snapshot: z.string().describe("the version's frozen snapshot: GET /api/briefs/{slug}/versions/{number}"),
});
const sent = z.object({ sent: z.literal(true) });

/** Every route of the JSON API under /api. */
export const apiRoutes = {
  "GET /api/health": { who: "anyone", does: "whether the server and its database answer", answer: z.object({ status: z.enum(["ok", "degraded"]), database: z.enum(["ok", "unreachable"]) }) },
  "GET /api/openapi.json": { who: "anyone", does: "this API described as OpenAPI 3.1, generated from the route table", answer: z.looseObject({ openapi: z.literal("3.1.0") }), reuse: true },
  "GET /api/csrf": { who: "anyone", does: "a CSRF token for the session (every change needs one)", answer: z.object({ token: z.string() }) },
  "GET /api/session": { who: "signed-in", does: "who is signed in", answer: z.object({ person }) },
  "POST /api/session": { who: "anyone", does: "sign in (rate limited)", body: credentialsBody, form: true, answer: z.object({ person }) },
  "DELETE /api/session": { who: "anyone", does: "sign out: the session ends on the server", status: 204 },
  "GET /api/people": { who: ["admin"], does: "the people, their roles and locales, active or not", answer: z.object({ people: z.array(personRecord) }) },
  "POST /api/people": { who: ["admin"], does: "invite a person by e-mail with roles (and, for translators, locales)", body: inviteBody, status: 201, answer: z.object({ person: personRecord }) },
  "PATCH /api/people/:id": {
    who: ["admin"],
    does: "change a person's roles, locales, or deactivate them (their sessions end at once)",
    also: "Never one's own deactivation, never the last active administrator.",
    params: byId,
    body: changePersonBody,
    answer: z.object({ person: personRecord }),
  },
  "POST /api/people/:id/invitation": { who: ["admin"], does: "send an invitation again (the earlier link stops working)", params: byId, status: 202, answer: sent },
  "GET /api/messages": { who: ["admin"], does: "the e-mails sent and their delivery state", answer: z.object({ messages: z.array(z.looseObject({ id: uuid, kind: z.string(), state: z.enum(["queued", "sent", "failed"]) })) }) },
  "GET /api/dev/mail": { who: "signed-in", does: "the messages the development mailbox kept, with their bodies", also: "Development only (`npm run dev`): 404 in production.", answer: z.object({ messages: z.array(z.looseObject({})) }) },
  "GET /api/audit": { who: ["admin"], does: "the audit log: every change with who, when, what, before and after; filtered and paged", query: auditQuery, answer: z.object({ entries: z.array(z.looseObject({ id: z.number().int(), action: z.string() })), next: z.number().int().nullable(), actions: z.array(z.string()) }) },
  "PATCH /api/account": { who: "signed-in", does: "change one's own name, time zone, password, and (press) the topics that alert one", body: accountBody, answer: z.object({ person }) },
  "POST /api/password-reset": { who: "anyone", does: "ask for a password reset link (the same answer for every address; rate limited)", body: passwordResetBody, form: true, status: 202, answer: sent },
  "POST /api/subscriptions": { who: "anyone", does: "ask for e-mail alerts on a topic (a confirmation link goes out; the same answer for every address; rate limited; no CSRF token)", body: subscribeBody, form: true, csrf: false, status: 202, answer: sent },
  "POST /api/subscriptions/confirm": { who: "anyone", does: "confirm alerts from the link (double opt-in)", body: tokenBody, form: true, csrf: false, answer: z.object({ confirmed: z.literal(true) }) },
  "POST /api/subscriptions/unsubscribe": { who: "anyone", does: "stop alerts: one click from the mail program (RFC 8058) or the unsubscribe page", query: tokenBody.partial(), body: tokenBody.partial(), form: true, csrf: false, answer: z.object({ unsubscribed: z.literal(true) }) },
  "POST /api/account/password": { who: "anyone", does: "set a password from a one-time invitation or reset link (rate limited)", body: newPasswordBody, form: true, answer: z.object({ done: z.literal(true) }) },
  "GET /api/briefs": { who: desk, does: "list the briefs in the desk, drafts included", answer: z.object({ briefs: z.array(briefSummary) }) },
  "POST /api/briefs": { who: ["analyst"], does: "create a brief", body: createBriefBody, status: 201, answer: z.object({ id: uuid, slug: z.string() }) },
  "GET /api/briefs/:id": { who: desk, does: "read a draft brief with its outcomes", params: byId, answer: z.object({ brief: briefDetail }) },
  "PATCH /api/briefs/:id": {
    who: ["analyst", "editor"],
    does: "change a brief's title, topic, condition, population, author team; its texts",
    also: "The lay summary and short take need the role editor.",
    params: byId,
    body: patchBriefBody,
    answer: z.object({ brief: briefSummary }),
  },
  "PUT /api/briefs/:id/treatments": { who: ["analyst"], does: "name the treatments of the brief's data", params: byId, body: treatmentNamesBody, answer: z.object({ treatments: z.array(treatment) }) },
  "POST /api/preview": { who: desk, does: "render Markdown as the public page would", body: previewBody, answer: z.object({ html: z.string() }) },
  "POST /api/briefs/:id/outcomes": { who: ["analyst"], does: "add an outcome", params: byId, body: createOutcomeBody, status: 201, answer: z.object({ outcome }) },
  "POST /api/briefs/:id/reviews": {
    who: ["analyst", "editor"],
    does: "submit a draft for review or recall the submission; return or approve it",
    also: "Returning and approving need the role editor, and never one's own submission.",
    params: byId,
    body: reviewBody,
    status: 201,
    answer: z.object({ decision: z.enum(reviewDecisions), status: z.string() }),
  },
  "GET /api/briefs/:id/readiness": { who: desk, does: "the draft's publish-readiness checklist", params: byId, answer: readiness },
  "GET /api/briefs/:id/changes": { who: desk, does: "what publishing the draft now would change since the last version (null before a first version, or while the draft cannot be frozen)", params: byId, answer: z.object({ changes: z.looseObject({ from: z.number().int(), to: z.number().int(), texts: z.array(z.unknown()), outcomes: z.array(z.unknown()) }).nullable() }) },
  "GET /api/briefs/:id/reviews": { who: desk, does: "the draft's review history", params: byId, answer: z.object({ steps: z.array(z.looseObject({ decision: z.enum(reviewDecisions) })), approval: z.enum(["none", "current", "stale"]) }) },
  "POST /api/briefs/:id/versions": { who: ["editor"], does: "publish, schedule (embargo) or correct an approved draft", params: byId, body: publishBody, status: 201, answer: z.object({ version: z.number().int().positive(), url: z.string() }) },
  "PUT /api/briefs/:id/versions/:number/release": { who: ["editor"], does: "move an embargoed version's release time", params: z.object({ id: uuid, number: versionNumber }), body: rescheduleBody, answer: z.object({ releaseAt: isoTime }) },
  "POST /api/briefs/:id/withdrawal": { who: ["editor"], does: "withdraw a published brief", params: byId, body: withdrawalBody, answer: z.object({ status: z.literal("withdrawn") }) },
  "GET /api/translations": { who: ["translator", "editor"], does: "the translation queue: each brief's newest version, released or under embargo, the state of each language one may translate, and how many fields a carried translation still needs", answer: z.object({ locales: z.array(z.enum(translationLocales)), versions: z.array(z.looseObject({ versionId: uuid, slug: z.string(), number: z.number().int() })) }) },
  "GET /api/translations/:versionId/:locale": { who: ["translator", "editor"], does: "a version's texts in one language beside their source, with what changed at source", also: "Translators: only the languages assigned to them (403 otherwise); a version under embargo too.", params: translationAddress, answer: z.object({ translation }) },
  "PUT /api/translations/:versionId/:locale": { who: ["translator", "editor"], does: "save a translation's texts (it becomes a draft again)", also: "Translators: only their languages. The version's snapshot is never written.", params: translationAddress, body: saveTranslationBody, answer: z.object({ translation }) },
  "POST /api/translations/:versionId/:locale/ready": { who: ["translator", "editor"], does: "mark a translation ready for an editor (refused while a field is empty or its source changed)", also: "Translators: only their languages.", params: translationAddress, answer: z.object({ translation }) },
  "POST /api/translations/:versionId/:locale/publish": { who: ["editor"], does: "publish a ready translation: readers of that language see it, with its publication time; the findings do not change", params: translationAddress, answer: z.object({ translation }) },
  "GET /api/press-room": { who: ["press", "editor"], does: "the press room: embargoed and recent versions", answer: z.object({ versions: z.array(z.looseObject({ slug: z.string(), number: z.number().int(), releaseAt: isoTime, embargoed: z.boolean() })) }) },
  "GET /api/topics": { who: "anyone", does: "the topics of the released briefs", answer: z.object({ topics: z.array(topic) }), reuse: true },
  "GET /api/releases": { who: "anyone", does: "every released brief with its newest version, newest first; a withdrawn brief is listed and marked", answer: z.object({ briefs: z.array(released) }), reuse: true },
  "POST /api/press-enquiries": { who: ["press"], does: "ask the editors a question from the press room (stored, and e-mailed to each editor)", body: pressEnquiryBody, status: 201, answer: sent },
  "GET /api/briefs/:slug/versions/:number": { who: "anyone", does: "read a released version's frozen snapshot", also: embargo, params: z.object({ slug: z.string().max(300), number: versionNumber }), answer: versionSnapshotSchema, reuse: true },
  "PATCH /api/outcomes/:id": { who: ["analyst"], does: "change an outcome's settings", params: byId, body: patchOutcomeBody, answer: z.object({ outcome }) },
  "DELETE /api/outcomes/:id": { who: ["analyst"], does: "remove an outcome", params: byId, status: 204 },
  "PUT /api/outcomes/:id/dataset": { who: ["analyst"], does: "upload an outcome's data (CSV)", params: byId, multipart: true, answer: uploadReport },
  "POST /api/outcomes/:id/analysis": { who: ["analyst"], does: "analyse an outcome's data again with the current engine", params: byId, answer: z.object({ resultId: uuid }) },
  "GET /api/outcomes/:id/result": { who: desk, does: "the outcome's analysis", params: byId, answer: analysis },
  "GET /api/outcomes/:id/certainty": { who: desk, does: "the outcome's certainty judgements and suggestions", params: byId, answer: z.object({ comparisons: z.array(certainty) }) },
  "PUT /api/outcomes/:id/certainty/:treatment/:comparator": { who: ["analyst"], does: "record certainty for one comparison", params: pairAddress, body: judgementBody, answer: z.object({ comparison: certainty }) },
  "PUT /api/outcomes/:id/certainty": { who: ["analyst"], does: "record certainty for many comparisons at once", params: byId, body: judgementsBody, answer: z.object({ comparisons: z.array(certainty) }) },
} as const satisfies Record<string, RouteSpec>;

export type ApiRoute = keyof typeof apiRoutes;

// Each route's answer type in the contract (contract.ts, what the server's own functions return)
// fits its answer schema here: the check the tests make at run time and the type the desk reads
// cannot part. A route that does not fit is named by the type checker.
// The open objects' "any other field" is left out of the comparison (an interface has no such entry).
type Closed<T> = T extends readonly (infer U)[] ? Closed<U>[] : T extends object ? { [K in keyof T as string extends K ? never : K]: Closed<T[K]> } : T;
type AnswerOf<K extends ApiRoute> = (typeof apiRoutes)[K] extends { answer: infer Schema extends z.ZodType } ? Closed<z.output<Schema>> : undefined;
type Misfit = { [K in ApiRoute]: RouteAnswers[K] extends AnswerOf<K> ? never : K }[ApiRoute];
export const everyAnswerFitsItsSchema: [Misfit] extends [never] ? true : Misfit = true;
