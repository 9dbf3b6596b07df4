// The page data of a version's public pages (+data.ts of pages/briefs/…): read the frozen version
// this reader may see, shape it for the page, format its citation, and say how it may be cached.
import { redirect, render } from "vike/abort";
import type { PageContextServer } from "vike/types";
import { briefContent, chosenOptions, comparisonContent, sideBySideContent, type BriefView, type ComparisonView, type PageState, type SideBySideContent } from "#core/publication/brief-page";
import { localeOf, localePath, locales } from "#core/languages/locales";
import { inLanguage } from "#db/translations";
import { mayReadEmbargoed } from "#core/access/roles";
import { admits, pageAccess } from "#core/access/access";
import type { VersionSnapshot } from "#core/snapshot/schema";
import { cacheState, readPublicVersion, readVersion, versionHistory, type PublicVersion } from "#db/versions";
import { changesView, type ChangesView } from "#core/snapshot/changes";
import { draftChanges, draftSnapshot } from "#workflows/snapshot";
import { grammaticalSnapshot } from "#core/languages/grammar";
import { versionGrammar } from "#core/languages/translation";
import { wordsOf } from "#core/languages/words";
import { comparisonUrl, sideBySideUrl, versionNumberOf, versionUrl } from "#core/publication/urls";

export type SideBySideView = SideBySideContent & PageState;
import { formattedReference } from "../public/citations";

function pageState(pageContext: PageContextServer, page: PublicVersion): PageState {
  // An embargoed page is personal (never shared by a cache), so it may speak the reader's time zone.
  const timeZone = page.found.embargoed ? (pageContext.person?.timeZone ?? "UTC") : "UTC";
  return { embargoed: page.found.embargoed, withdrawal: page.found.withdrawal, latestVersion: page.latestVersion, history: page.history, timeZone };
}

async function load(pageContext: PageContextServer, number: number | "latest"): Promise<PublicVersion> {
  const { slug } = pageContext.routeParams;
  if (number !== "latest" && (!Number.isInteger(number) || number < 1)) throw render(404);
  const page = await readPublicVersion(pageContext.db!, String(slug), number, pageContext.person?.roles ?? []);
  if (!page) throw render(404);
  return page;
}

/**
 * 410 for a withdrawn brief (its page stays). A page read by someone who may see embargoed versions
 * depends on who reads it, so it is private, like an embargoed version itself; a released version's
 * public page is frozen but for `cacheState`, which the page cache checks; the latest URL revalidates.
 */
function answer(pageContext: PageContextServer, page: PublicVersion, latestUrl: boolean) {
  const personal = page.found.embargoed || mayReadEmbargoed(pageContext.person?.roles ?? []);
  return {
    httpStatus: page.found.withdrawal ? 410 : undefined,
    cacheState: cacheState({ withdrawnAt: page.found.withdrawal?.at ?? null, latestVersion: page.latestVersion, translatedAt: page.found.translatedAt }),
    caching: (personal ? "private" : latestUrl ? "revalidate" : "version") as "private" | "revalidate" | "version",
  };
}

/** The version in the reader's language (server/db/translations.ts, inLanguage). */
const inReadersLanguage = (pageContext: PageContextServer, page: PublicVersion) => inLanguage(pageContext.db!, page.found.versionId, page.found.snapshot, pageContext.locale);

/** The reference with its permalink (in the language it was read in) and today's access date, for a version or one comparison in it. */
function citation(pageContext: PageContextServer, snapshot: VersionSnapshot, path: string, comparison?: string) {
  // The day, not the moment: a citation's access date is a day, and the page is kept for the day
  // (its cache key names it), so every process renders the same page and the same ETag.
  const accessed = new Date(new Date().toISOString().slice(0, 10));
  const permalink = `${pageContext.siteUrl ?? ""}${localePath(pageContext.locale, path)}`;
  return {
    reference: formattedReference({ title: snapshot.brief.title, author: snapshot.brief.authorTeam, version: snapshot.version, releaseAt: snapshot.releaseAt, url: permalink, accessed, comparison, language: pageContext.locale }),
    accessed: accessed.toISOString(),
    permalink,
  };
}

/**
 * What changed since the version before, as this reader reads both versions: null for version 1.
 * Decided on the frozen originals (stored with the version); worded from each version in the reader's language.
 */
async function changesSince(pageContext: PageContextServer, page: PublicVersion, after: VersionSnapshot): Promise<ChangesView | null> {
  const changes = page.found.changes;
  if (!changes) return null;
  const earlier = await readVersion(pageContext.db!, after.brief.slug, changes.from, pageContext.person?.roles ?? []);
  if (!earlier) return null;
  const { snapshot: before } = await inLanguage(pageContext.db!, earlier.versionId, earlier.snapshot, pageContext.locale);
  return changesView(changes, before, after);
}

export async function briefPageData(pageContext: PageContextServer, number: number | "latest") {
  const page = await load(pageContext, number);
  const { snapshot, topic, translation } = await inReadersLanguage(pageContext, page);
  const view: BriefView = { ...briefContent(snapshot), topic, ...pageState(pageContext, page) };
  const path = versionUrl({ slug: view.slug, version: view.version });
  const changes = await changesSince(pageContext, page, snapshot);
  return { view, path, translation, changes, citation: citation(pageContext, snapshot, path), siteUrl: pageContext.siteUrl ?? "", ...answer(pageContext, page, number === "latest") };
}

export type BriefPageData = Awaited<ReturnType<typeof briefPageData>>;

export async function comparisonPageData(pageContext: PageContextServer) {
  const page = await load(pageContext, versionNumberOf(String(pageContext.routeParams.number)) ?? 0);
  const { a, b } = pageContext.routeParams;
  const { snapshot, translation } = await inReadersLanguage(pageContext, page);
  const content = comparisonContent(snapshot, String(a), String(b));
  if (!content) throw render(404);
  const view: ComparisonView = { ...content, ...pageState(pageContext, page) };
  const path = comparisonUrl({ slug: view.slug, version: view.version, treatment: view.treatment.id, comparator: view.comparator.id });
  return {
    view,
    path,
    translation,
    citation: citation(pageContext, snapshot, path, wordsOf(pageContext.locale, "public")("brief.versus", { treatment: view.treatment.name, comparator: view.comparator.name })),
    siteUrl: pageContext.siteUrl ?? "",
    ...answer(pageContext, page, false),
  };
}

export type ComparisonPageData = Awaited<ReturnType<typeof comparisonPageData>>;

/**
 * /briefs/:slug/v/:n/side-by-side?options=a,b[,c,d] — the options a reader chose, in their order. The
 * form's `option=a&option=b` redirects to that one address; anything but 2 to 4 distinct options of
 * the version is 404, so the answers a cache keeps stay those of real choices.
 */
export async function sideBySidePageData(pageContext: PageContextServer) {
  const page = await load(pageContext, versionNumberOf(String(pageContext.routeParams.number)) ?? 0);
  const { snapshot, translation } = await inReadersLanguage(pageContext, page);
  const { search, searchAll, searchOriginal } = pageContext.urlParsed;
  const chosen = chosenOptions({ options: search.options, option: searchAll.option }, snapshot.treatments.map((t) => t.label));
  if (!chosen) throw render(404);
  const path = sideBySideUrl({ slug: snapshot.brief.slug, version: snapshot.version }, chosen.ids);
  if (searchOriginal !== `?${chosen.canonical}`) throw redirect(localePath(pageContext.locale, path), 301);
  const view: SideBySideView = { ...sideBySideContent(snapshot, chosen.ids), ...pageState(pageContext, page) };
  // On screen and on paper, the page cites the version its figures come from.
  const cited = citation(pageContext, snapshot, versionUrl({ slug: snapshot.brief.slug, version: snapshot.version }));
  return { view, path, translation, citation: cited, siteUrl: pageContext.siteUrl ?? "", ...answer(pageContext, page, false) };
}

export type SideBySidePageData = Awaited<ReturnType<typeof sideBySidePageData>>;

/**
 * /preview/:briefId — the draft as its next version would read, built by the same code that freezes
 * a version, for the desk only (never cached, not indexed). `locale` picks the words.
 */
export async function previewPageData(pageContext: PageContextServer) {
  const roles = pageContext.person?.roles ?? [];
  if (!pageContext.person) throw render(401);
  if (!admits(pageAccess["GET /preview/:id"].who, roles)) throw render(403);
  const briefId = String(pageContext.routeParams.id);
  if (!/^[0-9a-f-]{36}$/i.test(briefId)) throw render(404);
  const draft = await draftSnapshot(pageContext.db!, briefId);
  const requested = pageContext.urlParsed.search.locale;
  const locale = localeOf(requested);
  const common = { locale, locales: [...locales], briefId, caching: "private" as const };
  if (!draft.ok) {
    if (draft.reason === "not-found") throw render(404);
    return { ...common, problem: draft.detail, page: null };
  }
  const history = await versionHistory(pageContext.db!, draft.snapshot.brief.slug, roles);
  const number = (history[0]?.number ?? 0) + 1;
  const frozen: VersionSnapshot = { ...draft.snapshot, version: number, releaseAt: new Date().toISOString(), note: null };
  const snapshot = grammaticalSnapshot(frozen, locale, versionGrammar(frozen, locale, null));
  const view: BriefView = { ...briefContent(snapshot), embargoed: false, withdrawal: null, latestVersion: number, history, timeZone: "UTC" };
  const path = versionUrl({ slug: view.slug, version: number });
  const page: BriefPageData = {
    view,
    path,
    translation: null,
    changes: (await draftChanges(pageContext.db!, briefId, locale)) ?? null,
    citation: citation(pageContext, snapshot, path),
    siteUrl: pageContext.siteUrl ?? "",
    httpStatus: undefined,
    cacheState: "",
    caching: "private",
  };
  return { ...common, problem: null, page };
}

export type PreviewPageData = Awaited<ReturnType<typeof previewPageData>>;
