// A version's brief page in a language, as far as the frozen version, its translations and the code
// decide it: the outcome sections rendered to HTML, and what the page says around them. Rendering
// the sections is most of a brief page's cost (a large brief's snapshot is a megabyte, its sections
// some 200 KB of HTML), so they are rendered once per version and language and kept in the database
// for every process, and for after a restart (docs/decisions/0046-stored-brief-pages.md). The live
// parts — whether the brief was withdrawn, its newer versions, the citation's access date — are read
// and rendered on every render, around them.
import { briefContent, type BriefOutline, type OutcomeView } from "#core/publication/brief-page";
import type { Locale } from "#core/languages/locales";
import type { Role } from "#core/access/roles";
import { changesView, type ChangesView } from "#core/snapshot/changes";
import type { VersionSnapshot } from "#core/snapshot/schema";
import type { VersionAddress } from "#core/publication/urls";
import type { Database } from "#db/client";
import { readRendering, storeRendering } from "#db/renderings";
import { inLanguage } from "#db/translations";
import { readVersion, type VersionFacts } from "#db/versions";

type TranslationState = Awaited<ReturnType<typeof inLanguage>>["translation"];

/** Renders outcome sections to HTML: renderOutcomeSections of components/brief/OutcomeSections.tsx, which pages/ hands in. */
export type RenderOutcomes = (outcomes: OutcomeView[], version: VersionAddress, locale: Locale, translation: TranslationState) => string;

export interface StoredBriefPage {
  outline: BriefOutline;
  /** The topic's name in this language. */
  topic: string;
  translation: TranslationState;
  /** What changed since the version before, worded from both versions in this language; null for version 1. */
  changes: ChangesView | null;
  /** What a citation names of the version, and its reference formatted for the address it was first rendered at. */
  cited: Cited;
  reference: Reference;
  outcomesHtml: string;
}

/** What a citation names of the version it cites, in the language it is read in. */
export interface Cited {
  title: string;
  author: string | null;
  version: number;
  releaseAt: string;
}

export const cited = (snapshot: VersionSnapshot): Cited => ({ title: snapshot.brief.title, author: snapshot.brief.authorTeam ?? null, version: snapshot.version, releaseAt: snapshot.releaseAt });

/** A formatted reference and the permalink it names. */
export interface Reference {
  reference: string;
  permalink: string;
}

/** Formats the reference of a version (with the citation library: some milliseconds, kept with the rest). */
type Cite = (version: Cited) => Reference;

/** The version's parts in the reader's language, from a snapshot: what is stored. */
async function briefParts(db: Database, versionId: string, original: VersionSnapshot, locale: Locale, changesFrom: (snapshot: VersionSnapshot) => Promise<ChangesView | null>, cite: Cite, render: RenderOutcomes): Promise<StoredBriefPage> {
  const { snapshot, topic, translation } = await inLanguage(db, versionId, original, locale);
  const { outcomes, ...rest } = briefContent(snapshot);
  const version = { slug: snapshot.brief.slug, version: snapshot.version };
  const citing = cited(snapshot);
  return {
    outline: { ...rest, outcomes: outcomes.map(({ index, name }) => ({ index, name })) },
    topic,
    translation,
    changes: await changesFrom(snapshot),
    cited: citing,
    reference: cite(citing),
    outcomesHtml: render(outcomes, version, locale, translation),
  };
}

/**
 * The stored parts of a version's page, rendered and stored first when there are none for this build
 * and state. `build` null (development, where the code changes under the server) renders every time.
 */
export async function storedBriefPage(db: Database, at: VersionAddress, facts: VersionFacts, locale: Locale, build: string | null, roles: Role[], cite: Cite, render: RenderOutcomes): Promise<StoredBriefPage> {
  // What the stored parts were rendered from beyond the frozen snapshot: a newly published
  // translation, or an embargoed release that moved (migration 0012), renders them again.
  const state = `${facts.translatedAt ?? ""}|${facts.releaseAt}`;
  if (build) {
    const kept = await readRendering(db, facts.versionId, locale);
    if (kept && kept.build === build && kept.state === state) return { ...(kept.page as Omit<StoredBriefPage, "outcomesHtml">), outcomesHtml: kept.outcomesHtml };
  }
  const found = await readVersion(db, at.slug, at.version, roles);
  if (!found) throw new Error(`version ${at.version} of ${at.slug} disappeared while its page was rendered`);
  const { outcomesHtml, ...parts } = await briefParts(db, facts.versionId, found.snapshot, locale, (after) => changesSince(db, facts, after, locale, roles), cite, render);
  // As a later read gives it back (no undefined properties), so that this page and every later one are the same bytes and ETag.
  const page = JSON.parse(JSON.stringify(parts)) as typeof parts;
  if (build) await storeRendering(db, facts.versionId, locale, { build, state, page, outcomesHtml });
  return { ...page, outcomesHtml };
}

/**
 * What changed since the version before, as this reader reads both versions: null for version 1.
 * Decided on the frozen originals (stored with the version); worded from each version in the reader's language.
 */
async function changesSince(db: Database, facts: VersionFacts, after: VersionSnapshot, locale: Locale, roles: Role[]): Promise<ChangesView | null> {
  const changes = facts.changes;
  if (!changes) return null;
  const earlier = await readVersion(db, after.brief.slug, changes.from, roles);
  if (!earlier) return null;
  const { snapshot: before } = await inLanguage(db, earlier.versionId, earlier.snapshot, locale);
  return changesView(changes, before, after);
}
