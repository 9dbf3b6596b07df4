// The contract of the JSON API (docs/api.md; docs/decisions/0013-one-api-contract.md): the zod schema
// of every request body and the type of every answer, imported by the Express routes and by the
// desk's data hooks alike. Answer types are derived from what the stores and workflows return, as
// JSON carries it (dates become strings), so the desk cannot drift from the server. Browser-safe:
// it imports zod and the pure core at run time, and only types from the layers below.
import { lineText, markdownText } from "#core/editorial/text";
import { z } from "zod";
import type { ComparisonCertainty } from "#core/grade/assess";
import { judgementInput } from "#core/grade/judgement";
import type { AnalysisResult } from "#core/nma/analyse";
import type { DatasetIssue } from "#core/nma/types";
import { outcomeInput, outcomePatch } from "#core/editorial/outcome";
import type { Readiness } from "#core/editorial/readiness";
import type { ChangesView } from "#core/snapshot/changes";
import type { ReleasedBrief, Topic } from "#core/publication/search";
import type { VersionSnapshot } from "#core/snapshot/schema";
import { reviewDecisions } from "#core/editorial/status";
import { locales, translationLocales, type TranslationLocale } from "#core/languages/locales";
import { roleNames } from "#core/access/roles";
import type { briefWithOutcomes, listBriefs } from "#db/briefs";
import type { OutcomeRow } from "#db/outcomes";
import type { Person, PersonRecord } from "#db/people";
import type { listMessages } from "#db/messages";
import type { listAudit } from "#db/audit";
import type { PressRoomEntry } from "#db/versions";
import type { QueueEntry } from "#db/translations";
import type { TranslationView } from "#workflows/translations";
import type { reviewHistory } from "#workflows/review";

/** A value as JSON carries it: dates become ISO strings. */
export type Json<T> = T extends Date ? string : T extends (infer U)[] ? Json<U>[] : T extends object ? { [K in keyof T]: Json<T[K]> } : T;

// Requests -------------------------------------------------------------------------------------

export const credentialsBody = z.object({
  email: z.string().trim().min(1, "Enter your e-mail address.").max(320),
  password: z.string().min(1, "Enter your password.").max(1024),
});

/**
 * A new password: at least 12 characters, any characters, no composition rules (common practice,
 * after NIST SP 800-63B's advice to favour length over composition); 200 at most, as argon2 reads it all.
 */
const newPassword = z.string().min(12, "Choose a password of at least 12 characters.").max(200);

export const inviteBody = z.object({
  email: z.string().trim().toLowerCase().email("Enter an e-mail address.").max(320),
  displayName: z.string().trim().min(1).max(120),
  roles: z.array(z.enum(roleNames)).min(1, "Choose at least one role.").max(roleNames.length),
  translationLocales: z.array(z.enum(translationLocales)).max(translationLocales.length).default([]),
  locale: z.enum(locales).default("en"),
});

export const changePersonBody = z
  .object({
    roles: z.array(z.enum(roleNames)).max(roleNames.length),
    translationLocales: z.array(z.enum(translationLocales)).max(translationLocales.length),
    locale: z.enum(locales),
    active: z.boolean(),
  })
  .partial()
  .refine((changes) => Object.keys(changes).length > 0, "Send at least one of roles, translationLocales, locale, active.");

/** An IANA time zone name this runtime knows (Intl), or UTC. */
const timeZone = z.string().max(60).refine((zone) => zone === "UTC" || Intl.supportedValuesOf("timeZone").includes(zone), "Choose a time zone such as Europe/Madrid or UTC.");

export const accountBody = z
  .object({ displayName: z.string().trim().min(1).max(120), timeZone, locale: z.enum(locales), alertTopics: z.array(z.string().trim().min(1).max(200)).max(100), currentPassword: z.string().max(1024), newPassword })
  .partial()
  .refine((changes) => changes.newPassword === undefined || changes.currentPassword !== undefined, { message: "Enter your current password to choose a new one.", path: ["currentPassword"] });

/** PUT /api/translations/:versionId/:locale: the targets to save, by field name (other fields keep theirs). */
export const saveTranslationBody = z.object({
  // Every field is read as Markdown may be: a line never nests, and a summary may, up to the limit.
  fields: z
    .record(z.string().max(200), z.string().max(50_000, "A translated text is limited to 50 000 characters.").pipe(markdownText(50_000)))
    .refine((fields) => Object.keys(fields).length <= 1000, "At most 1000 fields at once."),
});

const uuidParam = z.string().regex(/^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i, "not an id");

/** GET /api/audit: filters by person, action and brief; `before` is the cursor of the next page. */
export const auditQuery = z.object({
  person: uuidParam.optional(),
  action: z.string().max(60).optional(),
  brief: uuidParam.optional(),
  before: z.coerce.number().int().positive().max(Number.MAX_SAFE_INTEGER).optional(),
  limit: z.coerce.number().int().min(1).max(200).default(50),
});

export const pressEnquiryBody = z.object({
  subject: z.string().trim().min(1, "Say what it is about.").max(200),
  body: z.string().trim().min(1, "Write your question.").max(5000),
  briefSlug: z.string().trim().max(200).nullish().transform((slug) => slug || null),
});

export const subscribeBody = z.object({ email: z.string().trim().toLowerCase().email("Enter an e-mail address.").max(320), topic: z.string().trim().min(1).max(200), locale: z.string().max(10).optional() });

/** A one-time link's token, sent back from its page. */
export const tokenBody = z.object({ token: z.string().max(200) });

export const passwordResetBody = z.object({ email: z.string().trim().min(1, "Enter your e-mail address.").max(320) });

export const newPasswordBody = z.object({ token: z.string().max(200), password: newPassword });

/** A row version as the database stores it (PostgreSQL's integer). */
export const rowVersion = z.number().int().positive().max(2_147_483_647);

// Every text a reader sees goes through one normaliser (server/core/editorial/text.ts): NFC, no control,
// noncharacter or bidirectional control character, something visible.
const briefFields = {
  title: lineText(300),
  topic: lineText(200),
  condition: lineText(200),
  population: lineText(500),
};
/** The author team named as the author of the brief's citations (an organisation). */
const authorTeam = lineText(200, 0).nullish();
export const createBriefBody = z.object({ ...briefFields, authorTeam }).strict();
export const patchBriefBody = z
  .object({
    rowVersion,
    title: briefFields.title.optional(),
    topic: briefFields.topic.optional(),
    condition: briefFields.condition.optional(),
    population: briefFields.population.optional(),
    authorTeam,
    laySummary: markdownText(20_000).optional(),
    shortTake: markdownText(20_000).optional(),
  })
  .strict();
export const treatmentNamesBody = z
  .object({
    names: z.record(z.string().min(1).max(200), lineText(200)),
    /** How an English sentence names each treatment ("usual care") and its grammatical number. */
    grammar: z.record(z.string().min(1).max(200), z.object({ phrase: lineText(200, 0).nullish(), number: z.enum(["singular", "plural"]).optional() }).strict()).optional(),
  })
  .strict();
export const previewBody = z.object({ markdown: markdownText(20_000) }).strict();
export { judgementInput as judgementBody, outcomeInput as createOutcomeBody, outcomePatch as patchOutcomeBody };
/** Judgements of many pairs at once: all saved, or none. */
export const judgementsBody = z
  .object({ judgements: z.array(z.object({ treatment: z.string().min(1).max(200), comparator: z.string().min(1).max(200), judgement: judgementInput })).min(1).max(2000) })
  .strict();
export const reviewBody = z
  .object({
    decision: z.enum(reviewDecisions),
    comment: z.string().trim().max(5000).optional(),
    /** The approving editor has read the warnings of the readiness checklist. */
    acknowledgeWarnings: z.boolean().optional(),
  })
  .strict();
export const publishBody = z.object({ releaseAt: z.iso.datetime({ offset: true }).optional(), note: z.string().trim().max(5000).optional() }).strict();
export const rescheduleBody = z.object({ releaseAt: z.iso.datetime({ offset: true }) }).strict();
export const withdrawalBody = z.object({ reason: z.string().trim().min(1, "give the public reason for the withdrawal").max(5000) }).strict();

export type CreateBriefBody = z.infer<typeof createBriefBody>;
export type PatchBriefBody = z.infer<typeof patchBriefBody>;
export type CreateOutcomeBody = z.input<typeof outcomeInput>;
export type PatchOutcomeBody = z.infer<typeof outcomePatch>;
export type JudgementBody = z.infer<typeof judgementInput>;
export type JudgementsBody = z.infer<typeof judgementsBody>;
export type ReviewBody = z.infer<typeof reviewBody>;
export type PublishBody = z.infer<typeof publishBody>;
export type WithdrawalBody = z.infer<typeof withdrawalBody>;
export type RescheduleBody = z.infer<typeof rescheduleBody>;
export type InviteBody = z.input<typeof inviteBody>;
export type AuditQuery = z.input<typeof auditQuery>;
export type AccountBody = z.infer<typeof accountBody>;
export type PressEnquiryBody = z.input<typeof pressEnquiryBody>;
export type ChangePersonBody = z.infer<typeof changePersonBody>;
export type SaveTranslationBody = z.infer<typeof saveTranslationBody>;

// Answers --------------------------------------------------------------------------------------

export type SignedInPerson = Person;
export type BriefSummary = Json<Awaited<ReturnType<typeof listBriefs>>[number]>;
export type BriefDetail = Json<NonNullable<Awaited<ReturnType<typeof briefWithOutcomes>>>>;
export type OutcomeSummary = BriefDetail["outcomes"][number];
export type Outcome = Json<OutcomeRow>;
export type ReviewHistory = Json<Awaited<ReturnType<typeof reviewHistory>>>;
export type Certainty = ComparisonCertainty;
export type Result = AnalysisResult;
export type PressRoomVersion = PressRoomEntry;
export type TranslationQueueEntry = QueueEntry;
export type Translation = TranslationView;

/** PUT /api/outcomes/:id/dataset: 200 with the file's summary, or 422 with its issues (nothing stored). */
export type UploadReport =
  | {
      valid: true;
      datasetId: string;
      sha256: string;
      studies: number;
      treatments: string[];
      excludedStudies: string[];
      /** Studies in the file per risk of bias (METHODS.md §13); null when the file has no risk_of_bias column. */
      riskOfBias: { low: number; someConcerns: number; high: number; notAssessed: number } | null;
      resultId: string;
    }
  /** A large file (more than 1 000 lines): accepted for analysis on the queue; the brief's outcome shows it as analysing. */
  | { valid: true; analysing: true; uploadId: string; fileName: string }
  | { valid: false; error: { key: string; message: string }; issues: DatasetIssue[] };

type Sent = { sent: true };
type Translated = { translation: Translation };

/**
 * What each route of the route table (routes.ts) answers on success, as the server's own types say
 * (204: undefined). The desk's client is typed from it; a check of types at the end of routes.ts requires each
 * to fit its route's answer schema, so the schema checked at run time and this type cannot part.
 */
export interface RouteAnswers {
  "GET /api/health": { status: "ok" | "degraded"; database: "ok" | "unreachable" };
  "GET /api/openapi.json": { openapi: "3.1.0" } & Record<string, unknown>;
  "GET /api/csrf": { token: string };
  "GET /api/session": { person: SignedInPerson };
  "POST /api/session": { person: SignedInPerson };
  "DELETE /api/session": undefined;
  "GET /api/people": { people: PersonRecord[] };
  "POST /api/people": { person: PersonRecord };
  "PATCH /api/people/:id": { person: PersonRecord };
  "POST /api/people/:id/invitation": Sent;
  "GET /api/messages": { messages: Json<Awaited<ReturnType<typeof listMessages>>> };
  "GET /api/dev/mail": { messages: { to: string; subject: string; text: string; receivedAt: string }[] };
  "GET /api/audit": Json<Awaited<ReturnType<typeof listAudit>>> & { actions: string[] };
  "PATCH /api/account": { person: SignedInPerson };
  "POST /api/password-reset": Sent;
  "POST /api/subscriptions": Sent;
  "POST /api/subscriptions/confirm": { confirmed: true };
  "POST /api/subscriptions/unsubscribe": { unsubscribed: true };
  "POST /api/account/password": { done: true };
  "GET /api/briefs": { briefs: BriefSummary[] };
  "POST /api/briefs": { id: string; slug: string };
  "GET /api/briefs/:id": { brief: BriefDetail };
  "PATCH /api/briefs/:id": { brief: BriefSummary };
  "PUT /api/briefs/:id/treatments": { treatments: BriefDetail["treatments"] };
  "POST /api/preview": { html: string };
  "POST /api/briefs/:id/outcomes": { outcome: Outcome };
  "POST /api/briefs/:id/reviews": { decision: ReviewBody["decision"]; status: string };
  "GET /api/briefs/:id/readiness": Readiness;
  "GET /api/briefs/:id/changes": { changes: ChangesView | null };
  "GET /api/briefs/:id/reviews": ReviewHistory;
  "POST /api/briefs/:id/versions": { version: number; url: string };
  "PUT /api/briefs/:id/versions/:number/release": { releaseAt: string };
  "POST /api/briefs/:id/withdrawal": { status: "withdrawn" };
  "GET /api/translations": { locales: TranslationLocale[]; versions: TranslationQueueEntry[] };
  "GET /api/translations/:versionId/:locale": Translated;
  "PUT /api/translations/:versionId/:locale": Translated;
  "POST /api/translations/:versionId/:locale/ready": Translated;
  "POST /api/translations/:versionId/:locale/publish": Translated;
  "GET /api/press-room": { versions: PressRoomVersion[] };
  "GET /api/topics": { topics: Topic[] };
  "GET /api/releases": { briefs: (ReleasedBrief & { page: string; snapshot: string })[] };
  "POST /api/press-enquiries": Sent;
  "GET /api/briefs/:slug/versions/:number": VersionSnapshot;
  "PATCH /api/outcomes/:id": { outcome: Outcome };
  "DELETE /api/outcomes/:id": undefined;
  /** 422 with the file's issues is an error answer: its payload is the third kind of UploadReport. */
  "PUT /api/outcomes/:id/dataset": Extract<UploadReport, { valid: true }>;
  "POST /api/outcomes/:id/analysis": { resultId: string };
  "GET /api/outcomes/:id/result": Result;
  "GET /api/outcomes/:id/certainty": { comparisons: Certainty[] };
  "PUT /api/outcomes/:id/certainty/:treatment/:comparator": { comparison: Certainty };
  "PUT /api/outcomes/:id/certainty": { comparisons: Certainty[] };
}
