// The database schema. drizzle-kit turns changes here into SQL files in drizzle/;
// a migration is never edited after it has been applied anywhere.
import { sql } from "drizzle-orm";
import type { ComparisonJudgement } from "#core/grade/assess";
import type { AnalysisOptions, DatasetIssue, ParsedDataset } from "#core/nma/types";
import type { VersionSnapshot } from "#core/snapshot/schema";
import type { PublishedFields, StoredFields } from "#core/languages/translation";
import type { VersionChanges } from "#core/snapshot/changes";
import {
  bigserial,
  check,
  boolean,
  customType,
  doublePrecision,
  integer,
  index,
  json,
  jsonb,
  pgEnum,
  pgTable,
  primaryKey,
  uniqueIndex,
  text,
  timestamp,
  uuid,
  varchar,
} from "drizzle-orm/pg-core";
import { roleNames } from "#core/access/roles";
import { briefStatuses, reviewDecisions } from "#core/editorial/status";

export const role = pgEnum("role", roleNames);

export const people = pgTable("people", {
  id: uuid("id").primaryKey().defaultRandom(),
  /** Stored lower-cased, so that sign-in and uniqueness ignore case. */
  email: text("email").notNull().unique(),
  displayName: text("display_name").notNull(),
  /** An argon2id hash in PHC string form; null until an invited person sets a password. */
  passwordHash: text("password_hash"),
  /** The language of the person's e-mails. */
  locale: text("locale").notNull().default("en"),
  /** The IANA time zone times are shown in, in their e-mails (an embargo's end). */
  timeZone: text("time_zone").notNull().default("UTC"),
  /** For the press: the topics whose embargoes and releases alert them; empty for every topic. */
  alertTopics: text("alert_topics").array().notNull().default(sql`'{}'::text[]`),
  /** For translators: the locales they may translate into. */
  translationLocales: text("translation_locales").array().notNull().default(sql`'{}'::text[]`),
  /** A deactivated person cannot sign in, and their sessions end at once. */
  deactivatedAt: timestamp("deactivated_at", { withTimezone: true }),
  createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
});

export const accountTokenPurpose = pgEnum("account_token_purpose", ["invitation", "password-reset"]);

/**
 * One-time links: an invitation to set a first password, or a password reset. Only the SHA-256 of
 * the token is stored, so a copy of the database opens no account (docs/decisions/0021-account-tokens.md).
 */
export const accountTokens = pgTable(
  "account_tokens",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    personId: uuid("person_id")
      .notNull()
      .references(() => people.id, { onDelete: "cascade" }),
    purpose: accountTokenPurpose("purpose").notNull(),
    tokenHash: text("token_hash").notNull().unique(),
    expiresAt: timestamp("expires_at", { withTimezone: true }).notNull(),
    usedAt: timestamp("used_at", { withTimezone: true }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (table) => [index("account_tokens_person_idx").on(table.personId)],
);

export const messageState = pgEnum("message_state", ["queued", "sent", "failed"]);

/**
 * Every e-mail the product sends, with its delivery state. The job queue (pg-boss) delivers it and
 * retries with back-off; administrators read the states (docs/decisions/0020-mail-through-a-queue.md).
 */
export const messages = pgTable(
  "messages",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    kind: text("kind").notNull(),
    recipient: text("recipient").notNull(),
    locale: text("locale").notNull(),
    subject: text("subject").notNull(),
    text: text("text").notNull(),
    html: text("html").notNull(),
    headers: jsonb("headers").$type<Record<string, string>>().notNull().default({}),
    state: messageState("state").notNull().default("queued"),
    attempts: integer("attempts").notNull().default(0),
    lastError: text("last_error"),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    sentAt: timestamp("sent_at", { withTimezone: true }),
  },
  (table) => [index("messages_state_idx").on(table.state, table.createdAt)],
);

export const personRoles = pgTable(
  "person_roles",
  {
    personId: uuid("person_id")
      .notNull()
      .references(() => people.id, { onDelete: "cascade" }),
    role: role("role").notNull(),
  },
  (table) => [primaryKey({ columns: [table.personId, table.role] })],
);

/** The table connect-pg-simple reads and writes; its shape is that package's. */
export const sessions = pgTable(
  "session",
  {
    sid: varchar("sid").primaryKey(),
    sess: json("sess").notNull(),
    expire: timestamp("expire", { precision: 6 }).notNull(),
  },
  (table) => [index("session_expire_idx").on(table.expire)],
);

/** Every state change: who did it, what changed, and the record before and after. */
export const auditLog = pgTable(
  "audit_log",
  {
    id: bigserial("id", { mode: "number" }).primaryKey(),
    at: timestamp("at", { withTimezone: true }).notNull().default(sql`now()`),
    actorId: uuid("actor_id").references(() => people.id),
    action: text("action").notNull(),
    entity: text("entity").notNull(),
    entityId: text("entity_id").notNull(),
    /** The entity as it was and became: any entity's shape, shown as stored. */
    before: jsonb("before").$type<unknown>(),
    after: jsonb("after").$type<unknown>(),
  },
  (table) => [index("audit_log_entity_idx").on(table.entity, table.entityId)],
);

/** Raw file bytes, kept exactly as uploaded. */
const bytea = customType<{ data: Buffer; driverData: Buffer }>({ dataType: () => "bytea" });

export const briefStatus = pgEnum("brief_status", briefStatuses);
export const outcomeKind = pgEnum("outcome_kind", ["binary", "continuous"]);
export const effectMeasure = pgEnum("effect_measure", ["OR", "RR", "RD", "MD"]);
export const modelKind = pgEnum("model_kind", ["fixed", "random"]);
export const direction = pgEnum("direction", ["higher", "lower"]);
export const datasetFormat = pgEnum("dataset_format", ["arm-binary", "arm-continuous", "contrast"]);

/** A brief: one network analysis with one or more outcomes. */
export const briefs = pgTable("briefs", {
  id: uuid("id").primaryKey().defaultRandom(),
  slug: text("slug").notNull().unique(),
  title: text("title").notNull(),
  topic: text("topic").notNull(),
  condition: text("condition").notNull(),
  population: text("population").notNull(),
  /** The group that did the review, named as the author of its citations; the product's name when empty. */
  authorTeam: text("author_team"),
  /** The editor's plain-language summary and short take, in Markdown (rendered and sanitised on the server). */
  laySummary: text("lay_summary").notNull().default(""),
  shortTake: text("short_take").notNull().default(""),
  status: briefStatus("status").notNull().default("draft"),
  /** Invented demonstration content: every page of it says so. */
  demo: boolean("demo").notNull().default(false),
  /** A withdrawn brief keeps its public page, which gives this reason; its versions stay as they were. */
  withdrawnAt: timestamp("withdrawn_at", { withTimezone: true }),
  withdrawalReason: text("withdrawal_reason"),
  /** Incremented by every change; a PATCH must name the version it read (409 otherwise). */
  rowVersion: integer("row_version").notNull().default(1),
  createdBy: uuid("created_by").references(() => people.id),
  createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
});

/** How a treatment's label in the data is shown to readers, per brief. */
export const treatmentNames = pgTable(
  "treatment_names",
  {
    briefId: uuid("brief_id")
      .notNull()
      .references(() => briefs.id),
    label: text("label").notNull(),
    displayName: text("display_name").notNull(),
    /** How an English sentence names it ("usual care"); null: the display name, in lower case where it starts as a word (server/core/languages/grammar.ts). */
    phrase: text("phrase"),
    /** Grammatical number, for the verb of a statement ("sessions … increase"). */
    number: text("number", { enum: ["singular", "plural"] }).notNull().default("singular"),
  },
  (table) => [primaryKey({ columns: [table.briefId, table.label] }), check("treatment_names_number", sql`${table.number} in ('singular', 'plural')`)],
);

export const outcomes = pgTable("outcomes", {
  id: uuid("id").primaryKey().defaultRandom(),
  briefId: uuid("brief_id")
    .notNull()
    .references(() => briefs.id),
  position: integer("position").notNull(),
  name: text("name").notNull(),
  kind: outcomeKind("kind").notNull(),
  measure: effectMeasure("measure").notNull(),
  model: modelKind("model").notNull(),
  /** A treatment label of the data; checked against the data when it is analysed. */
  referenceTreatment: text("reference_treatment").notNull(),
  direction: direction("direction").notNull(),
  /** Binary outcomes: the risk under the reference, 0 to 1 (METHODS.md §7). */
  baselineRisk: doublePrecision("baseline_risk"),
  /** Continuous outcomes: the unit of the mean difference. */
  unit: text("unit"),
  /** How the outcome reads inside a statement ("the chance of being free of pain"); the name when empty. */
  statementPhrase: text("statement_phrase"),
  /** The outcome is a harm (an adverse effect): groups speak of harm, not effectiveness (METHODS.md §10). */
  measuresHarm: boolean("measures_harm").notNull().default(false),
  /** Thresholds for small, moderate and large effects on the analysis scale (absolute values). */
  thresholdSmall: doublePrecision("threshold_small"),
  thresholdModerate: doublePrecision("threshold_moderate"),
  thresholdLarge: doublePrecision("threshold_large"),
  rowVersion: integer("row_version").notNull().default(1),
  createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
});

/** Every valid upload is kept; the outcome's current one is the newest. */
export const datasets = pgTable(
  "datasets",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    outcomeId: uuid("outcome_id")
      .notNull()
      .references(() => outcomes.id),
    format: datasetFormat("format").notNull(),
    fileName: text("file_name").notNull(),
    original: bytea("original").notNull(),
    sha256: text("sha256").notNull(),
    /** The parsed studies, as the engine read them. */
    parsed: jsonb("parsed").$type<ParsedDataset>().notNull(),
    uploadedBy: uuid("uploaded_by").references(() => people.id),
    uploadedAt: timestamp("uploaded_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (table) => [index("datasets_outcome_idx").on(table.outcomeId, table.uploadedAt)],
);

/** One engine run: its input checksum (data and settings) tells whether it is current. */
export const analysisResults = pgTable(
  "analysis_results",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    outcomeId: uuid("outcome_id")
      .notNull()
      .references(() => outcomes.id),
    datasetId: uuid("dataset_id")
      .notNull()
      .references(() => datasets.id),
    engineVersion: text("engine_version").notNull(),
    inputChecksum: text("input_checksum").notNull(),
    settings: jsonb("settings").$type<AnalysisOptions>().notNull(),
    /** The engine's result, in the shape of the engine of `engineVersion`: read it through readStoredResult (server/core/nma/stored-result.ts). */
    result: jsonb("result").$type<unknown>().notNull(),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (table) => [index("analysis_results_outcome_idx").on(table.outcomeId, table.createdAt)],
);

/** The analyst's certainty judgements for one comparison of an outcome (server/core/grade/assess.ts). */
export const certaintyJudgements = pgTable(
  "certainty_judgements",
  {
    outcomeId: uuid("outcome_id")
      .notNull()
      .references(() => outcomes.id),
    /** The pair in the order the result lists it (sorted treatment labels). */
    treatment: text("treatment").notNull(),
    comparator: text("comparator").notNull(),
    judgement: jsonb("judgement").$type<ComparisonJudgement>().notNull(),
    updatedBy: uuid("updated_by").references(() => people.id),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (table) => [primaryKey({ columns: [table.outcomeId, table.treatment, table.comparator] })],
);

/**
 * A published (or scheduled) version of a brief: a frozen snapshot of everything a reader sees.
 * The database refuses any UPDATE or DELETE of a row here (trigger in drizzle/0004_frozen-versions.sql).
 */
export const briefVersions = pgTable(
  "brief_versions",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    briefId: uuid("brief_id")
      .notNull()
      .references(() => briefs.id),
    number: integer("number").notNull(),
    /** Before this moment only the press and the editors may read it (the embargo). */
    releaseAt: timestamp("release_at", { withTimezone: true }).notNull(),
    /** The public correction note of a version after the first. */
    note: text("note"),
    /** Any shape a version was ever frozen in: read it through readSnapshot (server/core/snapshot/upgrade.ts). */
    snapshot: jsonb("snapshot").$type<unknown>().notNull(),
    /**
     * What lists, search and the feed read: the frozen brief's description and its treatments, a few
     * hundred bytes beside a snapshot of up to megabytes. PostgreSQL computes them from the snapshot,
     * so they cannot drift from it (docs/decisions/0019-listing-beside-the-snapshot.md).
     */
    listedBrief: jsonb("listed_brief")
      .$type<VersionSnapshot["brief"]>()
      .notNull()
      .generatedAlwaysAs(sql`snapshot -> 'brief'`),
    listedTreatments: jsonb("listed_treatments")
      .$type<VersionSnapshot["treatments"]>()
      .notNull()
      .generatedAlwaysAs(sql`snapshot -> 'treatments'`),
    createdBy: uuid("created_by").references(() => people.id),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    /**
     * What changed since the version before (server/core/snapshot/changes.ts), computed from the two
     * frozen snapshots when this one is frozen; null for version 1. Written once: the database lets
     * a version frozen before this column existed have it filled in, and nothing after.
     */
    changes: jsonb("changes").$type<VersionChanges>(),
  },
  (table) => [uniqueIndex("brief_versions_number_idx").on(table.briefId, table.number)],
);

/**
 * The parts of a version's page that only its language, its translations and the code change: the
 * outcome sections as HTML and what the page says around them from the frozen version, rendered
 * once and read by every process from then on (server/web/pages/stored-brief.ts,
 * docs/decisions/0046-stored-brief-pages.md). One row per version and language; a row rendered by
 * another build, or before a translation was published or an embargoed release moved, is rendered
 * again and replaced. Derived data: deleting every row loses nothing.
 */
export const versionRenderings = pgTable(
  "version_renderings",
  {
    versionId: uuid("version_id")
      .notNull()
      .references(() => briefVersions.id, { onDelete: "cascade" }),
    locale: text("locale").notNull(),
    /** The build that rendered it (a hash of the built server and client). */
    build: text("build").notNull(),
    /** What it was rendered from beyond the frozen snapshot: the brief's last translation and the release time. */
    state: text("state").notNull(),
    /** What the page says around its outcomes, from the frozen version in this language (StoredBriefPage): json, not jsonb, so that it reads back in the order it was written and a page rendered from it is byte for byte the page rendered before it was stored. */
    page: json("page").$type<unknown>().notNull(),
    outcomesHtml: text("outcomes_html").notNull(),
    renderedAt: timestamp("rendered_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (table) => [primaryKey({ columns: [table.versionId, table.locale] })],
);

export const reviewDecision = pgEnum("review_decision", reviewDecisions);

/**
 * The review of a brief's draft, one row per step: submitted, returned with comments, approved. An
 * approval records the checksum of the snapshot it approved, so that only that content is published.
 */
export const briefReviews = pgTable(
  "brief_reviews",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    briefId: uuid("brief_id")
      .notNull()
      .references(() => briefs.id),
    decision: reviewDecision("decision").notNull(),
    comment: text("comment"),
    contentSha256: text("content_sha256").notNull(),
    actorId: uuid("actor_id")
      .notNull()
      .references(() => people.id),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (table) => [index("brief_reviews_brief_idx").on(table.briefId, table.createdAt)],
);

/**
 * A version's release, announced once: the press's release alert and the translators' requests go
 * out when its release time has come, whichever queued job gets there first (docs/decisions/0020).
 */
export const releaseAnnouncements = pgTable("release_announcements", {
  versionId: uuid("version_id")
    .primaryKey()
    .references(() => briefVersions.id),
  at: timestamp("at", { withTimezone: true }).notNull().defaultNow(),
});

/**
 * A reader's e-mail subscription to a topic, confirmed by a link (double opt-in) and ended by another
 * (RFC 8058 one-click). The confirmation token is stored as a hash; the unsubscribe token as it is,
 * because every notice carries it and it can do nothing but unsubscribe (docs/decisions/0022-subscriptions.md).
 */
export const subscriptions = pgTable(
  "subscriptions",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    email: text("email").notNull(),
    topicSlug: text("topic_slug").notNull(),
    locale: text("locale").notNull().default("en"),
    confirmTokenHash: text("confirm_token_hash").unique(),
    confirmBy: timestamp("confirm_by", { withTimezone: true }),
    unsubscribeToken: text("unsubscribe_token").notNull().unique(),
    confirmedAt: timestamp("confirmed_at", { withTimezone: true }),
    unsubscribedAt: timestamp("unsubscribed_at", { withTimezone: true }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (table) => [uniqueIndex("subscriptions_email_topic_idx").on(table.email, table.topicSlug)],
);

/** A reporter's question to the editors from the press room, kept with who asked and about which brief. */
export const pressEnquiries = pgTable("press_enquiries", {
  id: uuid("id").primaryKey().defaultRandom(),
  personId: uuid("person_id")
    .notNull()
    .references(() => people.id),
  briefSlug: text("brief_slug"),
  subject: text("subject").notNull(),
  body: text("body").notNull(),
  createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
});

/**
 * A version's texts in one language (docs/decisions/0025-translations-of-frozen-versions.md): the
 * translator's working copy (`fields`, each with the hash and text of the source it translates) and
 * what readers see (`publishedFields`, copied when an editor publishes). The frozen snapshot is never
 * touched: a translation is attached beside it, with its own publication time.
 */
export const versionTranslations = pgTable(
  "version_translations",
  {
    versionId: uuid("version_id")
      .notNull()
      .references(() => briefVersions.id),
    locale: text("locale").notNull(),
    state: text("state", { enum: ["draft", "ready", "published"] }).notNull(),
    fields: jsonb("fields").$type<StoredFields>().notNull(),
    publishedFields: jsonb("published_fields").$type<PublishedFields>(),
    publishedAt: timestamp("published_at", { withTimezone: true }),
    updatedBy: uuid("updated_by").references(() => people.id),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (table) => [
    primaryKey({ columns: [table.versionId, table.locale] }),
    check("version_translations_locale", sql`${table.locale} in ('es', 'fr', 'ar')`),
    check("version_translations_state", sql`${table.state} in ('draft', 'ready', 'published')`),
  ],
);

/**
 * The rate limits' counters, shared by every server process on the database (express-rate-limit's
 * store: server/db/rate-limits.ts). A row lives until its window resets.
 */
export const rateLimits = pgTable(
  "rate_limits",
  {
    key: text("key").primaryKey(),
    hits: integer("hits").notNull(),
    resetAt: timestamp("reset_at", { withTimezone: true }).notNull(),
  },
  (table) => [index("rate_limits_reset_idx").on(table.resetAt)],
);

/**
 * An upload of a large network waiting for its analysis on the job queue (server/workflows/analysis.ts):
 * kept here until the engine accepts it (then it becomes a dataset with its result, and this row goes)
 * or refuses it (then its problems stay here for the desk, and nothing else changes).
 */
export const pendingUploads = pgTable(
  "pending_uploads",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    outcomeId: uuid("outcome_id")
      .notNull()
      .references(() => outcomes.id),
    format: datasetFormat("format").notNull(),
    fileName: text("file_name").notNull(),
    original: bytea("original").notNull(),
    uploadedBy: uuid("uploaded_by").references(() => people.id),
    uploadedAt: timestamp("uploaded_at", { withTimezone: true }).notNull().defaultNow(),
    state: text("state", { enum: ["analysing", "refused"] }).notNull(),
    issues: jsonb("issues").$type<DatasetIssue[]>(),
  },
  (table) => [index("pending_uploads_outcome_idx").on(table.outcomeId, table.uploadedAt), check("pending_uploads_state", sql`${table.state} in ('analysing', 'refused')`)],
);
