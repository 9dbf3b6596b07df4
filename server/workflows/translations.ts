// The translation desk's work on a version in one language: read it beside its source, save the
// working copy, mark it ready, publish it. Each change is audited in its own transaction; the
// version's frozen snapshot is only ever read.
import type { TranslationLocale } from "#core/locales";
import { fieldViews, sourceFields, storedAfterSave, unfinished, type FieldView, type PublishedFields, type StoredFields } from "#core/translation";
import { mayReadEmbargoed } from "#core/roles";
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

async function working(db: Database, version: TranslatableVersion, locale: TranslationLocale) {
  const own = await readTranslation(db, version.versionId, locale);
  if (own) return { stored: own.fields, state: own.state as TranslationState | "missing", publishedAt: own.publishedAt, carriedFrom: false };
  const earlier = await earlierTranslation(db, version, locale);
  return { stored: earlier?.fields ?? {}, state: (earlier ? "draft" : "missing") as TranslationState | "missing", publishedAt: null, carriedFrom: earlier !== null };
}

/** A version this person may translate: released, or under embargo for those who may read it. */
async function visibleVersion(db: Database, versionId: string, person: Person): Promise<TranslatableVersion | null> {
  const version = await translatableVersion(db, versionId);
  if (!version) return null;
  return Date.parse(version.releaseAt) <= Date.now() || mayReadEmbargoed(person.roles) ? version : null;
}

export async function readTranslationView(db: Database, person: Person, versionId: string, locale: TranslationLocale): Promise<TranslationView | null> {
  const version = await visibleVersion(db, versionId, person);
  if (!version) return null;
  const { stored, state, publishedAt, carriedFrom } = await working(db, version, locale);
  return {
    versionId,
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

/** Saves the targets given (other fields keep theirs); the translation is a draft again. */
export async function saveTranslationDraft(db: Database, person: Person, versionId: string, locale: TranslationLocale, targets: Record<string, string>): Promise<{ ok: true; view: TranslationView } | Refusal> {
  const version = await visibleVersion(db, versionId, person);
  if (!version) return { ok: false, reason: "not-found" };
  const { stored } = await working(db, version, locale);
  const fields: StoredFields = storedAfterSave(sourceFields(version.snapshot), stored, targets);
  await db.transaction(async (tx) => {
    await saveTranslation(tx, { versionId, locale }, fields, person.id);
    await recordAudit(tx, { actorId: person.id, action: "translation.save", entity: "version", entityId: versionId, before: null, after: { locale, fields: Object.keys(targets) } });
  });
  return { ok: true, view: (await readTranslationView(db, person, versionId, locale))! };
}

/** A draft whose every field is translated against today's source becomes ready for an editor. */
export async function markTranslationReady(db: Database, person: Person, versionId: string, locale: TranslationLocale): Promise<{ ok: true; view: TranslationView } | Refusal> {
  const view = await readTranslationView(db, person, versionId, locale);
  if (!view) return { ok: false, reason: "not-found" };
  const gaps = unfinished(view.fields);
  if (view.state === "missing" || view.carriedFrom || gaps.empty.length > 0 || gaps.stale.length > 0) return { ok: false, reason: "unfinished", ...gaps };
  await db.transaction(async (tx) => {
    await setTranslationState(tx, { versionId, locale }, "ready", person.id);
    await recordAudit(tx, { actorId: person.id, action: "translation.ready", entity: "version", entityId: versionId, before: { state: view.state }, after: { locale, state: "ready" } });
  });
  return { ok: true, view: (await readTranslationView(db, person, versionId, locale))! };
}

/** An editor publishes a ready translation: readers of that language see it from now on. */
export async function publishTranslationOf(db: Database, person: Person, versionId: string, locale: TranslationLocale): Promise<{ ok: true; view: TranslationView } | Refusal> {
  const view = await readTranslationView(db, person, versionId, locale);
  if (!view) return { ok: false, reason: "not-found" };
  if (view.state !== "ready") return { ok: false, reason: "not-ready" };
  const published: PublishedFields = Object.fromEntries(view.fields.map((field) => [field.name, field.target]));
  await db.transaction(async (tx) => {
    const at = await publishTranslation(tx, { versionId, locale }, published, person.id);
    await recordAudit(tx, { actorId: person.id, action: "translation.publish", entity: "version", entityId: versionId, before: { state: "ready" }, after: { locale, state: "published", publishedAt: at } });
  });
  return { ok: true, view: (await readTranslationView(db, person, versionId, locale))! };
}
