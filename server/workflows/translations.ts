// The translation desk's work on a version in one language: read it beside its source, save the
// working copy, mark it ready, publish it. Each change is audited in its own transaction; the
// version's frozen snapshot is only ever read.
import type { TranslationLocale } from "#core/languages/locales";
import { fieldViews, sourceFields, storedAfterSave, unfinished, type FieldView, type PublishedFields, type StoredFields } from "#core/languages/translation";
import { recordAudit } from "#db/audit";
import type { Database } from "#db/client";
import type { Person } from "#db/people";
import {
  earlierTranslation,
  publishTranslation,
  readTranslation,
  saveTranslation,
  setTranslationState,
  translatableVersion,
  type TranslatableVersion,
  type TranslationState,
} from "#db/translations";

export interface TranslationView {
  versionId: string;
  slug: string;
  number: number;
  title: string;
  locale: TranslationLocale;
  state: TranslationState | "missing";
  /** Started from the translation of an earlier version: fields whose source changed are flagged. */
  carriedFrom: boolean;
  publishedAt: string | null;
  fields: FieldView[];
}

type Refusal = { ok: false; reason: "not-found" } | { ok: false; reason: "unfinished"; empty: string[]; stale: string[] } | { ok: false; reason: "not-ready" };

type Working = { stored: StoredFields; state: TranslationState | "missing"; publishedAt: string | null; carriedFrom: boolean };

async function working(db: Database, version: TranslatableVersion, locale: TranslationLocale): Promise<Working> {
  const own = await readTranslation(db, version.versionId, locale);
  if (own) return { stored: own.fields, state: own.state, publishedAt: own.publishedAt, carriedFrom: false };
  const earlier = await earlierTranslation(db, version, locale);
  return { stored: earlier?.fields ?? {}, state: earlier ? "draft" : "missing", publishedAt: null, carriedFrom: earlier !== null };
}


/** The translation as the desk shows it, from the version and its working copy: each step answers with it, read once. */
function viewOf(version: TranslatableVersion, locale: TranslationLocale, { stored, state, publishedAt, carriedFrom }: Working): TranslationView {
  return {
    versionId: version.versionId,
    slug: version.slug,
    number: version.number,
    title: version.snapshot.brief.title,
    locale,
    state,
    carriedFrom,
    publishedAt,
    fields: fieldViews(sourceFields(version.snapshot), stored),
  };
}

/**
 * The version and its translation's working copy, or null when there is no such version. Released or
 * under embargo alike: translators translate before the release, so that readers of their language get
 * it with the release (docs/roles.md: what translators may read under embargo). The routes admit only
 * translators, in their languages, and editors.
 */
async function load(db: Database, versionId: string, locale: TranslationLocale) {
  const version = await translatableVersion(db, versionId);
  return version ? { version, working: await working(db, version, locale) } : null;
}

export async function readTranslationView(db: Database, person: Person, versionId: string, locale: TranslationLocale): Promise<TranslationView | null> {
  const found = await load(db, versionId, locale);
  return found ? viewOf(found.version, locale, found.working) : null;
}

/** Saves the targets given (other fields keep theirs); the translation is a draft again. */
export async function saveTranslationDraft(db: Database, person: Person, versionId: string, locale: TranslationLocale, targets: Record<string, string>): Promise<{ ok: true; view: TranslationView } | Refusal> {
  const found = await load(db, versionId, locale);
  if (!found) return { ok: false, reason: "not-found" };
  const fields: StoredFields = storedAfterSave(sourceFields(found.version.snapshot), found.working.stored, targets);
  await db.transaction(async (tx) => {
    await saveTranslation(tx, { versionId, locale }, fields, person.id);
    await recordAudit(tx, { actorId: person.id, action: "translation.save", entity: "version", entityId: versionId, before: null, after: { locale, fields: Object.keys(targets) } });
  });
  // A carried-over copy becomes this version's own; a published one keeps its publication time.
  const publishedAt = found.working.carriedFrom ? null : found.working.publishedAt;
  return { ok: true, view: viewOf(found.version, locale, { stored: fields, state: "draft", publishedAt, carriedFrom: false }) };
}

/** A draft whose every field is translated against today's source becomes ready for an editor. */
export async function markTranslationReady(db: Database, person: Person, versionId: string, locale: TranslationLocale): Promise<{ ok: true; view: TranslationView } | Refusal> {
  const found = await load(db, versionId, locale);
  if (!found) return { ok: false, reason: "not-found" };
  const view = viewOf(found.version, locale, found.working);
  const gaps = unfinished(view.fields);
  if (view.state === "missing" || view.carriedFrom || gaps.empty.length > 0 || gaps.stale.length > 0) return { ok: false, reason: "unfinished", ...gaps };
  await db.transaction(async (tx) => {
    await setTranslationState(tx, { versionId, locale }, "ready", person.id);
    await recordAudit(tx, { actorId: person.id, action: "translation.ready", entity: "version", entityId: versionId, before: { state: view.state }, after: { locale, state: "ready" } });
  });
  return { ok: true, view: { ...view, state: "ready" } };
}

/** An editor publishes a ready translation: readers of that language see it from now on. */
export async function publishTranslationOf(db: Database, person: Person, versionId: string, locale: TranslationLocale): Promise<{ ok: true; view: TranslationView } | Refusal> {
  const found = await load(db, versionId, locale);
  if (!found) return { ok: false, reason: "not-found" };
  const view = viewOf(found.version, locale, found.working);
  if (view.state !== "ready") return { ok: false, reason: "not-ready" };
  const published: PublishedFields = Object.fromEntries(view.fields.map((field) => [field.name, field.target]));
  const publishedAt = await db.transaction(async (tx) => {
    const at = await publishTranslation(tx, { versionId, locale }, published, person.id);
    await recordAudit(tx, { actorId: person.id, action: "translation.publish", entity: "version", entityId: versionId, before: { state: "ready" }, after: { locale, state: "published", publishedAt: at } });
    return at;
  });
  return { ok: true, view: { ...view, state: "published", publishedAt } };
}
