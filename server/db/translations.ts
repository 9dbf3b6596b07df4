// Translations of released versions, one row per version and language (schema: versionTranslations).
import { and, desc, eq, inArray, isNotNull, isNull, lt, sql } from "drizzle-orm";
import { isTranslationLocale, type Locale, type TranslationLocale } from "#core/languages/locales";
import { grammaticalSnapshot } from "#core/languages/grammar";
import { fieldViews, openFields, sourceFields, translatedSnapshot, translatedTopic, unfinished, versionGrammar, type PublishedFields, type StoredFields } from "#core/languages/translation";
import type { VersionSnapshot } from "#core/snapshot/schema";
import { readSnapshot } from "#core/snapshot/upgrade";
import type { Database, Executor } from "./client";
import { briefs, briefVersions, versionTranslations } from "./schema";

export type TranslationState = "draft" | "ready" | "published";

export interface StoredTranslation {
  state: TranslationState;
  fields: StoredFields;
  publishedFields: PublishedFields | null;
  publishedAt: string | null;
  updatedAt: string;
}

export interface TranslatableVersion {
  versionId: string;
  briefId: string;
  slug: string;
  number: number;
  releaseAt: string;
  snapshot: VersionSnapshot;
}

/** A version to translate, with its frozen snapshot; null when there is none with that id. */
export async function translatableVersion(db: Database, versionId: string): Promise<TranslatableVersion | null> {
  const [row] = await db
    .select({ versionId: briefVersions.id, briefId: briefVersions.briefId, slug: briefs.slug, number: briefVersions.number, releaseAt: briefVersions.releaseAt, snapshot: briefVersions.snapshot })
    .from(briefVersions)
    .innerJoin(briefs, eq(briefs.id, briefVersions.briefId))
    .where(eq(briefVersions.id, versionId));
  return row ? { ...row, releaseAt: row.releaseAt.toISOString(), snapshot: readSnapshot(row.snapshot) } : null;
}

const shape = (row: typeof versionTranslations.$inferSelect): StoredTranslation => ({
  state: row.state,
  fields: row.fields,
  publishedFields: row.publishedFields ?? null,
  publishedAt: row.publishedAt?.toISOString() ?? null,
  updatedAt: row.updatedAt.toISOString(),
});

export async function readTranslation(db: Executor, versionId: string, locale: TranslationLocale): Promise<StoredTranslation | null> {
  const [row] = await db.select().from(versionTranslations).where(and(eq(versionTranslations.versionId, versionId), eq(versionTranslations.locale, locale)));
  return row ? shape(row) : null;
}

/**
 * The translation of the brief's newest earlier version in this language: a new version starts from
 * it, so that only what changed needs translating again (its fields then show as changed at source).
 */
export async function earlierTranslation(db: Database, version: TranslatableVersion, locale: TranslationLocale): Promise<StoredTranslation | null> {
  const [row] = await db
    .select({ translation: versionTranslations })
    .from(versionTranslations)
    .innerJoin(briefVersions, eq(briefVersions.id, versionTranslations.versionId))
    .where(and(eq(briefVersions.briefId, version.briefId), lt(briefVersions.number, version.number), eq(versionTranslations.locale, locale)))
    .orderBy(desc(briefVersions.number))
    .limit(1);
  return row ? shape(row.translation) : null;
}

/**
 * Per language, the newest published translation of the brief's versions before `number`, with the
 * snapshot it translates: what a new version's translation is carried from.
 */
export async function publishedTranslationsBefore(db: Executor, briefId: string, number: number): Promise<{ locale: TranslationLocale; snapshot: VersionSnapshot; published: PublishedFields }[]> {
  const rows = await db
    .selectDistinctOn([versionTranslations.locale], { locale: versionTranslations.locale, snapshot: briefVersions.snapshot, published: versionTranslations.publishedFields })
    .from(versionTranslations)
    .innerJoin(briefVersions, eq(briefVersions.id, versionTranslations.versionId))
    .where(and(eq(briefVersions.briefId, briefId), lt(briefVersions.number, number), isNotNull(versionTranslations.publishedAt)))
    .orderBy(versionTranslations.locale, desc(briefVersions.number));
  return rows.flatMap((row) => (isTranslationLocale(row.locale) && row.published ? [{ locale: row.locale, snapshot: readSnapshot(row.snapshot), published: row.published }] : []));
}

/**
 * A new version's translation carried from an earlier one: readers see the carried fields from now
 * on (with the version's release); it is a draft until the changed fields are translated, or
 * published already when nothing changed.
 */
export async function insertCarriedTranslation(tx: Executor, key: { versionId: string; locale: TranslationLocale }, carried: { fields: StoredFields; published: PublishedFields; complete: boolean }): Promise<void> {
  await tx.insert(versionTranslations).values({ ...key, state: carried.complete ? "published" : "draft", fields: carried.fields, publishedFields: carried.published, publishedAt: sql`now()` });
}

/** Saves the working copy; the state goes back to draft (what readers see changes only when it is published again). */
export async function saveTranslation(tx: Executor, key: { versionId: string; locale: TranslationLocale }, fields: StoredFields, personId: string): Promise<void> {
  await tx
    .insert(versionTranslations)
    .values({ ...key, state: "draft", fields, updatedBy: personId })
    .onConflictDoUpdate({ target: [versionTranslations.versionId, versionTranslations.locale], set: { state: "draft", fields, updatedBy: personId, updatedAt: sql`now()` } });
}

export async function setTranslationState(tx: Executor, key: { versionId: string; locale: TranslationLocale }, state: "ready", personId: string): Promise<void> {
  await tx
    .update(versionTranslations)
    .set({ state, updatedBy: personId, updatedAt: sql`now()` })
    .where(and(eq(versionTranslations.versionId, key.versionId), eq(versionTranslations.locale, key.locale)));
}

/** What readers see from now on: the working copy's texts, with the moment they were published. */
export async function publishTranslation(tx: Executor, key: { versionId: string; locale: TranslationLocale }, published: PublishedFields, personId: string): Promise<string> {
  const [row] = await tx
    .update(versionTranslations)
    .set({ state: "published", publishedFields: published, publishedAt: sql`now()`, updatedBy: personId, updatedAt: sql`now()` })
    .where(and(eq(versionTranslations.versionId, key.versionId), eq(versionTranslations.locale, key.locale)))
    .returning({ publishedAt: versionTranslations.publishedAt });
  return row!.publishedAt!.toISOString();
}

/** The published translation readers of a language see for a version, if there is one. */
export async function publishedTranslation(db: Database, versionId: string, locale: TranslationLocale): Promise<{ fields: PublishedFields; publishedAt: string } | null> {
  const [row] = await db
    .select({ fields: versionTranslations.publishedFields, publishedAt: versionTranslations.publishedAt })
    .from(versionTranslations)
    .where(and(eq(versionTranslations.versionId, versionId), eq(versionTranslations.locale, locale)));
  return row?.fields && row.publishedAt ? { fields: row.fields, publishedAt: row.publishedAt.toISOString() } : null;
}

/**
 * A version as a reader of `locale` sees it: its published translation in place of the original texts,
 * or the original, with whether a translation is published (null for the original's own language).
 * The generated words (statements, groups, cautions) come from locales/, not from here.
 */
export async function inLanguage(db: Database, versionId: string, original: VersionSnapshot, locale: Locale) {
  // Statements and group labels name treatments as a sentence of the language does (server/core/languages/grammar.ts).
  const source = grammaticalSnapshot(original, locale, versionGrammar(original, locale, null));
  if (!isTranslationLocale(locale)) return { snapshot: source, topic: original.brief.topic, translation: null };
  const published = await publishedTranslation(db, versionId, locale);
  if (!published) return { snapshot: source, topic: original.brief.topic, translation: { locale, publishedAt: null, open: [] as string[] } };
  return {
    snapshot: grammaticalSnapshot(translatedSnapshot(original, published.fields), locale, versionGrammar(original, locale, published.fields)),
    topic: translatedTopic(original, published.fields),
    // A correction's carried translation: the fields still shown in the original, each marked on the page.
    translation: { locale, publishedAt: published.publishedAt as string | null, open: openFields(sourceFields(original), published.fields) },
  };
}

export interface QueueEntry {
  versionId: string;
  slug: string;
  title: string;
  number: number;
  releaseAt: string;
  /** Not yet released: translated now, its translations go public with it. */
  embargoed: boolean;
  /** Per language: its state, "missing" when nobody has started it. */
  states: Partial<Record<TranslationLocale, TranslationState | "missing">>;
  /**
   * Per language whose translation was carried from an earlier version and is partly published: how
   * many fields wait for the translator (empty, or their source changed).
   */
  updates: Partial<Record<TranslationLocale, number>>;
}

/**
 * The newest version of each brief, released or embargoed (translators translate before the release),
 * with the state of each language asked for, newest release first.
 */
export async function translationQueue(db: Database, locales: TranslationLocale[]): Promise<QueueEntry[]> {
  // One row per brief: its newest version (DISTINCT ON keeps the first of each brief), newest release first.
  const rows = await db
    .selectDistinctOn([briefVersions.briefId], { versionId: briefVersions.id, slug: briefs.slug, title: sql<string>`${briefVersions.listedBrief}->>'title'`, number: briefVersions.number, releaseAt: briefVersions.releaseAt })
    .from(briefVersions)
    .innerJoin(briefs, eq(briefs.id, briefVersions.briefId))
    .where(isNull(briefs.withdrawnAt))
    .orderBy(briefVersions.briefId, desc(briefVersions.number));
  const now = Date.now();
  const versions = rows.sort((a, b) => b.releaseAt.getTime() - a.releaseAt.getTime());
  const entry = (version: (typeof versions)[number]) => ({ ...version, releaseAt: version.releaseAt.toISOString(), embargoed: version.releaseAt.getTime() > now });
  if (versions.length === 0 || locales.length === 0) return versions.map((v) => ({ ...entry(v), states: {}, updates: {} }));
  const translated = await db
    .select({ versionId: versionTranslations.versionId, locale: versionTranslations.locale, state: versionTranslations.state, fields: versionTranslations.fields, partlyPublished: sql<boolean>`${versionTranslations.publishedAt} is not null and ${versionTranslations.state} <> 'published'` })
    .from(versionTranslations)
    .where(and(inArray(versionTranslations.versionId, versions.map((v) => v.versionId)), inArray(versionTranslations.locale, locales)));
  // Only a carried translation needs its snapshot read, to count what waits in it.
  const carried = translated.filter((row) => row.partlyPublished);
  const snapshots = new Map<string, VersionSnapshot>();
  if (carried.length > 0) {
    const found = await db.select({ id: briefVersions.id, snapshot: briefVersions.snapshot }).from(briefVersions).where(inArray(briefVersions.id, [...new Set(carried.map((row) => row.versionId))]));
    for (const row of found) snapshots.set(row.id, readSnapshot(row.snapshot));
  }
  const waiting = (row: (typeof carried)[number]) => {
    const gaps = unfinished(fieldViews(sourceFields(snapshots.get(row.versionId)!), row.fields));
    return gaps.empty.length + gaps.stale.length;
  };
  return versions.map((version) => {
    const rowsOf = translated.filter((r) => r.versionId === version.versionId);
    return {
      ...entry(version),
      states: Object.fromEntries(locales.map((locale) => [locale, rowsOf.find((r) => r.locale === locale)?.state ?? "missing"])),
      updates: Object.fromEntries(rowsOf.filter((r) => r.partlyPublished && isTranslationLocale(r.locale)).map((r) => [r.locale, waiting(r)])),
    };
  });
}

/** The id of a brief's newest version, released or scheduled; null before its first. */
export async function newestVersionId(db: Database, briefId: string): Promise<string | null> {
  const [row] = await db.select({ id: briefVersions.id }).from(briefVersions).where(eq(briefVersions.briefId, briefId)).orderBy(desc(briefVersions.number)).limit(1);
  return row?.id ?? null;
}
