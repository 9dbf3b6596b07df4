// Versions of briefs: a version is a frozen snapshot of a brief — data, results, certainty, groups —
// written once and never changed (the database refuses it too). Reading them for their readers.
import { and, desc, eq, gt, gte, inArray, isNull, lte, sql } from "drizzle-orm";
import { mayReadEmbargoed, type Role } from "#core/access/roles";
import { defaultLocale, type Locale } from "#core/languages/locales";
import type { Database, Executor } from "./client";
import { briefs, briefVersions, releaseAnnouncements, versionTranslations } from "./schema";
import { slugify } from "#core/publication/slug";
import type { VersionEntry } from "#core/publication/brief-page";
import type { ReleasedBrief } from "#core/publication/search";
import type { VersionChanges } from "#core/snapshot/changes";
import type { VersionSnapshot } from "#core/snapshot/schema";
import { readSnapshot } from "#core/snapshot/upgrade";

/** The number of the brief's newest version, 0 when it has none. */
export async function lastVersionNumber(db: Executor, briefId: string): Promise<number> {
  const [last] = await db.select({ number: briefVersions.number }).from(briefVersions).where(eq(briefVersions.briefId, briefId)).orderBy(desc(briefVersions.number)).limit(1);
  return last?.number ?? 0;
}

export async function hasVersion(db: Executor, briefId: string): Promise<boolean> {
  return (await lastVersionNumber(db, briefId)) > 0;
}

/** A version's release time, for a step that may move it; null when there is no such version. */
export async function releaseTimeOf(db: Executor, briefId: string, number: number): Promise<Date | null> {
  const [row] = await db.select({ releaseAt: briefVersions.releaseAt }).from(briefVersions).where(and(eq(briefVersions.briefId, briefId), eq(briefVersions.number, number)));
  return row?.releaseAt ?? null;
}

/** Moves an embargoed version's release time, in the row and in its snapshot: the one change the database allows (migration 0012). */
export async function moveReleaseTime(db: Executor, briefId: string, number: number, releaseAt: Date): Promise<void> {
  await db
    .update(briefVersions)
    .set({ releaseAt, snapshot: sql`jsonb_set(${briefVersions.snapshot}, '{releaseAt}', to_jsonb(${releaseAt.toISOString()}::text))` })
    .where(and(eq(briefVersions.briefId, briefId), eq(briefVersions.number, number)));
}

/** Freezes a version: the database refuses any later change to the row (a trigger). Answers its id. */
export async function insertVersion(db: Executor, values: { briefId: string; number: number; releaseAt: Date; note: string | null; snapshot: VersionSnapshot; changes: VersionChanges | null; createdBy: string }): Promise<string> {
  const [row] = await db.insert(briefVersions).values(values).returning({ id: briefVersions.id });
  return row!.id;
}

/** A version's frozen snapshot by its brief and number; null when there is none. */
export async function snapshotOf(db: Executor, briefId: string, number: number): Promise<VersionSnapshot | null> {
  const [row] = await db.select({ snapshot: briefVersions.snapshot }).from(briefVersions).where(and(eq(briefVersions.briefId, briefId), eq(briefVersions.number, number)));
  return row ? readSnapshot(row.snapshot) : null;
}

/** What changed in a version since the one before it, as frozen with it; null for a first version. */
export async function changesOf(db: Executor, versionId: string): Promise<VersionChanges | null> {
  const [row] = await db.select({ changes: briefVersions.changes }).from(briefVersions).where(eq(briefVersions.id, versionId));
  return row?.changes ?? null;
}

/**
 * Versions frozen before their changes were computed get them once (the database allows this one
 * write): run at start-up, a handful of rows at most, nothing when all are filled in.
 */
export async function fillMissingChanges(db: Database, compute: (before: VersionSnapshot, after: VersionSnapshot) => VersionChanges): Promise<number> {
  const missing = await db.select({ id: briefVersions.id, briefId: briefVersions.briefId, number: briefVersions.number }).from(briefVersions).where(and(isNull(briefVersions.changes), gt(briefVersions.number, 1)));
  for (const version of missing) {
    const [before, after] = await Promise.all([snapshotOf(db, version.briefId, version.number - 1), snapshotOf(db, version.briefId, version.number)]);
    if (before && after) await db.update(briefVersions).set({ changes: compute(before, after) }).where(eq(briefVersions.id, version.id));
  }
  return missing.length;
}

/** What a version's pages need to know of it beside its snapshot. */
export interface VersionFacts {
  /** Not yet released: only an embargo reader gets here, and nothing about it may be cached. */
  embargoed: boolean;
  withdrawal: { at: string; reason: string } | null;
  versionId: string;
  releaseAt: string;
  /** When a translation of any of the brief's versions was last published: cached pages are checked against it. */
  translatedAt: string | null;
  /** What changed since the version before, frozen with this one; null for version 1. */
  changes: VersionChanges | null;
}

export interface FoundVersion extends VersionFacts {
  /** The stored snapshot brought to the current shape (server/core/snapshot/upgrade.ts). */
  snapshot: VersionSnapshot;
}

/** The last publication of a translation of any version of the brief (a column of a query joining briefs). */
const lastTranslated = sql<string | null>`(select max(${versionTranslations.publishedAt}) from ${versionTranslations} join ${briefVersions} v on v.id = ${versionTranslations.versionId} where v.brief_id = ${briefs.id})`;

/** A version as frozen; null when it does not exist or is not yet released for this reader. */
export async function readVersion(db: Database, slug: string, number: number, roles: Role[]): Promise<FoundVersion | null> {
  const found = await findVersion(db, slug, number, roles, true);
  return found && { ...found, snapshot: readSnapshot(found.snapshot) };
}

/** What a version's pages need to know of it beside its snapshot, without reading the snapshot (a megabyte for a large brief). */
export async function readVersionFacts(db: Database, slug: string, number: number, roles: Role[]): Promise<VersionFacts | null> {
  const found = await findVersion(db, slug, number, roles, false);
  if (!found) return null;
  delete found.snapshot;
  return found;
}

async function findVersion(db: Database, slug: string, number: number, roles: Role[], withSnapshot: boolean): Promise<(VersionFacts & { snapshot?: unknown }) | null> {
  const [row] = await db
    .select({
      versionId: briefVersions.id,
      releaseAt: briefVersions.releaseAt,
      snapshot: withSnapshot ? briefVersions.snapshot : sql<unknown>`null`,
      withdrawnAt: briefs.withdrawnAt,
      withdrawalReason: briefs.withdrawalReason,
      translatedAt: lastTranslated,
      changes: briefVersions.changes,
    })
    .from(briefVersions)
    .innerJoin(briefs, eq(briefs.id, briefVersions.briefId))
    .where(and(eq(briefs.slug, slug), eq(briefVersions.number, number)));
  if (!row) return null;
  const embargoed = row.releaseAt.getTime() > Date.now();
  if (embargoed && !mayReadEmbargoed(roles)) return null;
  return {
    snapshot: row.snapshot,
    embargoed,
    withdrawal: row.withdrawnAt ? { at: row.withdrawnAt.toISOString(), reason: row.withdrawalReason ?? "" } : null,
    versionId: row.versionId,
    releaseAt: row.releaseAt.toISOString(),
    translatedAt: row.translatedAt === null ? null : new Date(row.translatedAt).toISOString(),
    changes: row.changes ?? null,
  };
}

/** The versions of a brief this reader may see, newest first: the version history of its pages. */
export async function versionHistory(db: Database, slug: string, roles: Role[]): Promise<VersionEntry[]> {
  const rows = await db
    .select({ number: briefVersions.number, releaseAt: briefVersions.releaseAt, note: briefVersions.note })
    .from(briefVersions)
    .innerJoin(briefs, eq(briefs.id, briefVersions.briefId))
    .where(eq(briefs.slug, slug))
    .orderBy(desc(briefVersions.number));
  const now = Date.now();
  return rows
    .map((row) => ({ number: row.number, releaseAt: row.releaseAt.toISOString(), note: row.note, embargoed: row.releaseAt.getTime() > now }))
    .filter((entry) => !entry.embargoed || mayReadEmbargoed(roles));
}

/**
 * What a released version's public page shows beyond its frozen snapshot: whether the brief was
 * withdrawn and which released version is the newest. A cached copy is right while these hold.
 * Null when the version does not exist or is not yet released.
 */
export async function publicVersionState(db: Database, slug: string, number: number): Promise<string | null> {
  const [row] = await db
    .select({
      withdrawnAt: briefs.withdrawnAt,
      latestReleased: sql<number | null>`max(${briefVersions.number}) filter (where ${briefVersions.releaseAt} <= now())`,
      translatedAt: sql<string | null>`max(${lastTranslated})`,
    })
    .from(briefs)
    .innerJoin(briefVersions, eq(briefVersions.briefId, briefs.id))
    .where(eq(briefs.slug, slug))
    .groupBy(briefs.id);
  if (!row || row.latestReleased === null || row.latestReleased < number) return null;
  const translatedAt = row.translatedAt === null ? null : new Date(row.translatedAt).toISOString();
  return cacheState({ withdrawnAt: row.withdrawnAt?.toISOString() ?? null, latestVersion: row.latestReleased, translatedAt });
}

/** The fingerprint a cached page is checked against: the same facts, read from the page or the database. */
export function cacheState(state: { withdrawnAt: string | null; latestVersion: number; translatedAt: string | null }): string {
  return `${state.latestVersion}|${state.withdrawnAt ?? ""}|${state.translatedAt ?? ""}`;
}

export interface PublicVersion<Found extends VersionFacts = FoundVersion> {
  found: Found;
  history: VersionEntry[];
  latestVersion: number;
}

/** A version of a brief for its pages, with its history; `"latest"` is the newest this reader may see. */
export function readPublicVersion(db: Database, slug: string, number: number | "latest", roles: Role[]): Promise<PublicVersion | null> {
  return withHistory(db, slug, number, roles, (at) => readVersion(db, slug, at, roles));
}

/** The same without the snapshot (readVersionFacts). */
export function readPublicVersionFacts(db: Database, slug: string, number: number | "latest", roles: Role[]): Promise<PublicVersion<VersionFacts> | null> {
  return withHistory(db, slug, number, roles, (at) => readVersionFacts(db, slug, at, roles));
}

async function withHistory<Found extends VersionFacts>(db: Database, slug: string, number: number | "latest", roles: Role[], read: (number: number) => Promise<Found | null>): Promise<PublicVersion<Found> | null> {
  const history = await versionHistory(db, slug, roles);
  // The newest released version is "the latest"; an embargo reader reaches a scheduled one by its number.
  const latestVersion = history.find((entry) => !entry.embargoed)?.number ?? history[0]?.number;
  if (latestVersion === undefined) return null;
  const found = await read(number === "latest" ? latestVersion : number);
  return found ? { found, history, latestVersion } : null;
}

export interface PressRoomEntry {
  slug: string;
  title: string;
  number: number;
  releaseAt: string;
  note: string | null;
  embargoed: boolean;
}

/** A version as the lists name it, from the listed columns beside its snapshot (decision record 0019). */
const listedVersion = {
  slug: briefs.slug,
  title: sql<string>`${briefVersions.listedBrief}->>'title'`,
  number: briefVersions.number,
  releaseAt: briefVersions.releaseAt,
  note: briefVersions.note,
};

/** Embargoed versions, soonest first, then the releases of the last 30 days, newest first. */
export async function listPressRoom(db: Database): Promise<PressRoomEntry[]> {
  const since = new Date(Date.now() - 30 * 24 * 3600 * 1000);
  const rows = await db
    .select(listedVersion)
    .from(briefVersions)
    .innerJoin(briefs, eq(briefs.id, briefVersions.briefId))
    .where(and(gte(briefVersions.releaseAt, since), isNull(briefs.withdrawnAt)));
  const now = Date.now();
  const entries = rows.map((row) => ({ ...row, releaseAt: row.releaseAt.toISOString(), embargoed: row.releaseAt.getTime() > now }));
  const embargoed = entries.filter((e) => e.embargoed).sort((a, b) => a.releaseAt.localeCompare(b.releaseAt));
  const released = entries.filter((e) => !e.embargoed).sort((a, b) => b.releaseAt.localeCompare(a.releaseAt));
  return [...embargoed, ...released];
}

/**
 * The newest released version of each brief, newest first, in a reader's language: a published
 * translation's title, topic name, condition and population replace the originals (the topic's
 * address stays that of the original). Search finds briefs in the database (searchReleasedSlugs).
 */
export async function listReleasedBriefs(db: Database, locale: Locale = defaultLocale): Promise<ReleasedBrief[]> {
  // One row per brief: its newest released version (DISTINCT ON keeps the first of each brief).
  const rows = await db
    .selectDistinctOn([briefVersions.briefId], {
      slug: briefs.slug,
      // What a reader sees is the frozen brief; the draft may have moved on.
      // The listed columns, not the snapshot: a few hundred bytes instead of megabytes per brief.
      brief: sql<VersionSnapshot["brief"]>`${briefVersions.listedBrief}`,
      versionId: briefVersions.id,
      withdrawnAt: briefs.withdrawnAt,
      version: briefVersions.number,
      releaseAt: briefVersions.releaseAt,
    })
    .from(briefVersions)
    .innerJoin(briefs, eq(briefs.id, briefVersions.briefId))
    .where(lte(briefVersions.releaseAt, new Date()))
    .orderBy(briefVersions.briefId, desc(briefVersions.releaseAt), desc(briefVersions.number));
  // The published translations of just these versions, in a second small query (none for English).
  const translations = new Map<string, Record<string, string>>();
  if (locale !== defaultLocale && rows.length > 0) {
    const found = await db
      // Only the fields a list shows, not the translated summaries.
      .select({ versionId: versionTranslations.versionId, fields: sql<Record<string, string>>`jsonb_build_object('title', ${versionTranslations.publishedFields} -> 'title', 'topic', ${versionTranslations.publishedFields} -> 'topic', 'condition', ${versionTranslations.publishedFields} -> 'condition', 'population', ${versionTranslations.publishedFields} -> 'population')` })
      .from(versionTranslations)
      .where(and(eq(versionTranslations.locale, locale), inArray(versionTranslations.versionId, rows.map((row) => row.versionId))));
    for (const { versionId, fields } of found) if (fields) translations.set(versionId, fields);
  }
  return rows
    .sort((a, b) => b.releaseAt.getTime() - a.releaseAt.getTime())
    .map(({ brief, versionId, ...row }) => {
      const translated = translations.get(versionId);
      const said = (field: string, original: string) => translated?.[field]?.trim() || original;
      return {
        slug: row.slug,
        title: said("title", brief.title),
        topic: said("topic", brief.topic),
        topicSlug: slugify(brief.topic),
        condition: said("condition", brief.condition),
        population: said("population", brief.population),
        demo: brief.demo,
        withdrawn: row.withdrawnAt !== null,
        version: row.version,
        releaseAt: row.releaseAt.toISOString(),
      };
    });
}

/**
 * A fingerprint of everything the list pages show (the newest released version of each brief, its
 * withdrawal, published translations): it changes when any of them does, releases at their time
 * included. One small query over the versions, so a process can ask it every few seconds.
 */
export async function catalogueState(db: Database): Promise<string> {
  const result = await db.execute<{ state: string }>(sql`
    select concat_ws('|',
      (select count(*) || ':' || coalesce(max(release_at)::text, '') from brief_versions where release_at <= now()),
      (select count(*) || ':' || coalesce(max(withdrawn_at)::text, '') from briefs where withdrawn_at is not null),
      (select count(*) || ':' || coalesce(max(published_at)::text, '') from version_translations where published_at is not null)) as state`);
  return result.rows[0]!.state;
}

export interface ReleasedVersion {
  slug: string;
  title: string;
  number: number;
  releaseAt: string;
  note: string | null;
  withdrawnAt: string | null;
  withdrawalReason: string | null;
  changes: VersionChanges | null;
}

/** Every released version, newest first: the feed's entries and the sitemap's addresses. */
export async function listReleasedVersions(db: Database): Promise<ReleasedVersion[]> {
  const rows = await db
    .select({
      ...listedVersion,
      withdrawnAt: briefs.withdrawnAt,
      withdrawalReason: briefs.withdrawalReason,
      changes: briefVersions.changes,
    })
    .from(briefVersions)
    .innerJoin(briefs, eq(briefs.id, briefVersions.briefId))
    .where(lte(briefVersions.releaseAt, new Date()))
    .orderBy(desc(briefVersions.releaseAt), desc(briefVersions.number));
  return rows.map((row) => ({ ...row, releaseAt: row.releaseAt.toISOString(), withdrawnAt: row.withdrawnAt?.toISOString() ?? null }));
}

/** What an announcement of a version says: its brief, number, release time and note. */
export async function versionForAnnouncement(db: Executor, briefId: string, number: number) {
  const [row] = await db
    .select({ ...listedVersion, versionId: briefVersions.id, topic: sql<string>`${briefVersions.listedBrief}->>'topic'`, changes: briefVersions.changes })
    .from(briefVersions)
    .innerJoin(briefs, eq(briefs.id, briefVersions.briefId))
    .where(and(eq(briefVersions.briefId, briefId), eq(briefVersions.number, number)));
  return row ?? null;
}

/** Claims the announcement of a released version: true for the first caller only. */
export async function claimAnnouncement(db: Executor, versionId: string): Promise<boolean> {
  const rows = await db.insert(releaseAnnouncements).values({ versionId }).onConflictDoNothing().returning();
  return rows.length === 1;
}

/**
 * The slugs of released briefs whose frozen title, condition or treatment names (or those of their
 * published translation into `locale`) hold every word of the query, each as the start of a word,
 * accents and case aside: PostgreSQL full-text search on indexed documents (migration 0023).
 */
export async function searchReleasedSlugs(db: Database, query: string, locale: Locale): Promise<Set<string>> {
  const words = query.match(/[\p{L}\p{N}]+/gu) ?? [];
  if (words.length === 0) return new Set();
  // Each word a prefix, all of them required; words hold letters and digits only, so the query cannot break.
  const tsquery = words.slice(0, 12).map((word) => `${word}:*`).join(" & ");
  const matching = sql`to_tsquery('simple', fairweigh_fold(${tsquery}))`;
  // Two lookups joined by UNION, each on its own GIN index: one condition that ORs the version's
  // document with its translation's cannot use either index, and read every version of the
  // catalogue on every new search.
  const rows = await db.execute<{ slug: string }>(sql`
    select b.slug
    from brief_versions v
    join briefs b on b.id = v.brief_id
    where v.release_at <= now() and v.search_document @@ ${matching}
    union
    select b.slug
    from version_translations t
    join brief_versions v on v.id = t.version_id
    join briefs b on b.id = v.brief_id
    where t.locale = ${locale} and t.published_at is not null and v.release_at <= now() and t.search_document @@ ${matching}`);
  return new Set(rows.rows.map((row) => row.slug));
}
