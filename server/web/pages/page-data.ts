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
import { cacheState, readPublicVersion, readPublicVersionFacts, versionHistory, type PublicVersion, type VersionFacts } from "#db/versions";
import type { Database } from "#db/client";
import type { Role } from "#core/access/roles";
import { cited, storedBriefPage, type Cited, type Reference, type RenderOutcomes } from "./stored-brief";
import { draftChanges, draftSnapshot } from "#workflows/snapshot";
import { grammaticalSnapshot } from "#core/languages/grammar";
import { versionGrammar } from "#core/languages/translation";
import { wordsOf } from "#core/languages/words";
import { comparisonUrl, sideBySideUrl, versionNumberOf, versionUrl } from "#core/publication/urls";

export type SideBySideView = SideBySideContent & PageState;
import { formattedReference } from "../public/citations";

function pageState(pageContext: PageContextServer, page: PublicVersion<VersionFacts>): PageState {
  // An embargoed page is personal (never shared by a cache), so it may speak the reader's time zone.
  const timeZone = page.found.embargoed ? (pageContext.person?.timeZone ?? "UTC") : "UTC";
  return { embargoed: page.found.embargoed, withdrawal: page.found.withdrawal, latestVersion: page.latestVersion, history: page.history, timeZone };
}

/** The version this reader may see, with its snapshot or (`readPublicVersionFacts`) without; 404 when there is none. */
async function load<Found extends VersionFacts>(
  pageContext: PageContextServer,
  number: number | "latest",
  read: (db: Database, slug: string, number: number | "latest", roles: Role[]) => Promise<PublicVersion<Found> | null>,
): Promise<PublicVersion<Found>> {
  const { slug } = pageContext.routeParams;
  if (number !== "latest" && (!Number.isInteger(number) || number < 1)) throw render(404);
  const page = await read(pageContext.db!, String(slug), number, pageContext.person?.roles ?? []);
  if (!page) throw render(404);
  return page;
}

/**
 * 410 for a withdrawn brief (its page stays). A page read by someone who may see embargoed versions
 * depends on who reads it, so it is private, like an embargoed version itself; a released version's
 * public page is frozen but for `cacheState`, which the page cache checks; the latest URL revalidates.
 */
function answer(pageContext: PageContextServer, page: PublicVersion<VersionFacts>, latestUrl: boolean) {
  const personal = page.found.embargoed || mayReadEmbargoed(pageContext.person?.roles ?? []);
  return {
    httpStatus: page.found.withdrawal ? 410 : undefined,
    cacheState: cacheState({ withdrawnAt: page.found.withdrawal?.at ?? null, latestVersion: page.latestVersion, translatedAt: page.found.translatedAt }),
    caching: (personal ? "private" : latestUrl ? "revalidate" : "version") as "private" | "revalidate" | "version",
  };
}

/** The version in the reader's language (server/db/translations.ts, inLanguage). */
const inReadersLanguage = (pageContext: PageContextServer, page: PublicVersion) => inLanguage(pageContext.db!, page.found.versionId, page.found.snapshot, pageContext.locale);

/** A page's permalink: its address in the language it is read in, at the address readers use. */
const permalinkOf = (pageContext: PageContextServer, path: string) => `${pageContext.siteUrl ?? ""}${localePath(pageContext.locale, path)}`;

/** The reference with its permalink, in the language it was read in, for a version or one comparison in it. */
function reference(pageContext: PageContextServer, version: Cited, path: string, comparison?: string): Reference {
  const permalink = permalinkOf(pageContext, path);
  return { reference: formattedReference({ ...version, url: permalink, comparison, language: pageContext.locale }), permalink };
}

/**
 * A reference with today's access date. The day, not the moment: a citation's access date is a day,
 * and the page is kept for the day (its cache key names it), so every process renders the same page and the same ETag.
 */
function citation(known: Reference) {
  return { ...known, accessed: new Date(new Date().toISOString().slice(0, 10)).toISOString() };
}

/**
 * A version's brief page: the parts stored for its language (stored-brief.ts) and, read on every
 * render, what may change around them. The outcome sections' HTML goes to the page through
 * pageContext on the server, which does not send it to the browser a second time, and with the data
 * on a client-side navigation, where the browser has no page to take it from.
 */
export async function briefPageData(pageContext: PageContextServer, number: number | "latest", renderOutcomes: RenderOutcomes) {
  const page = await load(pageContext, number, readPublicVersionFacts);
  const at = { slug: String(pageContext.routeParams.slug), version: number === "latest" ? page.latestVersion : number };
  const path = versionUrl(at);
  const cite = (version: Cited) => reference(pageContext, version, path);
  const stored = await storedBriefPage(pageContext.db!, at, page.found, pageContext.locale, pageContext.build ?? null, pageContext.person?.roles ?? [], cite, renderOutcomes);
  const { outline, topic, translation, changes, outcomesHtml } = stored;
  const view: BriefView = { ...outline, topic, ...pageState(pageContext, page) };
  if (!pageContext.isClientSideNavigation) pageContext.outcomesHtml = outcomesHtml;
  return {
    view,
    path,
    translation,
    changes,
    ...(pageContext.isClientSideNavigation ? { outcomesHtml } : {}),
    // The stored reference names the address it was rendered for: a site reached at another address formats its own.
    citation: citation(stored.reference.permalink === permalinkOf(pageContext, path) ? stored.reference : cite(stored.cited)),
    siteUrl: pageContext.siteUrl ?? "",
    ...answer(pageContext, page, number === "latest"),
  };
}

export type BriefPageData = Awaited<ReturnType<typeof briefPageData>>;

export async function comparisonPageData(pageContext: PageContextServer) {
  const page = await load(pageContext, versionNumberOf(String(pageContext.routeParams.number)) ?? 0, readPublicVersion);
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
    citation: citation(reference(pageContext, cited(snapshot), path, wordsOf(pageContext.locale, "public")("brief.versus", { treatment: view.treatment.name, comparator: view.comparator.name }))),
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
  const page = await load(pageContext, versionNumberOf(String(pageContext.routeParams.number)) ?? 0, readPublicVersion);
  const { snapshot, translation } = await inReadersLanguage(pageContext, page);
  const { search, searchAll, searchOriginal } = pageContext.urlParsed;
  const chosen = chosenOptions({ options: search.options, option: searchAll.option }, snapshot.treatments.map((t) => t.label));
  if (!chosen) throw render(404);
  const path = sideBySideUrl({ slug: snapshot.brief.slug, version: snapshot.version }, chosen.ids);
  if (searchOriginal !== `?${chosen.canonical}`) throw redirect(localePath(pageContext.locale, path), 301);
  const view: SideBySideView = { ...sideBySideContent(snapshot, chosen.ids), ...pageState(pageContext, page) };
  // On screen and on paper, the page cites the version its figures come from.
  const cite = citation(reference(pageContext, cited(snapshot), versionUrl({ slug: snapshot.brief.slug, version: snapshot.version })));
  return { view, path, translation, citation: cite, siteUrl: pageContext.siteUrl ?? "", ...answer(pageContext, page, false) };
}

export type SideBySidePageData = Awaited<ReturnType<typeof sideBySidePageData>>;

/**
 * /preview/:briefId — the draft as its next version would read, built by the same code that freezes
 * a version, for the desk only (never cached, not indexed). `locale` picks the words.
 */
export async function previewPageData(pageContext: PageContextServer, renderOutcomes: RenderOutcomes) {
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
  const { outcomes, ...outline } = briefContent(snapshot);
  const view: BriefView = { ...outline, outcomes, embargoed: false, withdrawal: null, latestVersion: number, history, timeZone: "UTC" };
  const path = versionUrl({ slug: view.slug, version: number });
  const page: BriefPageData = {
    view,
    path,
    translation: null,
    changes: (await draftChanges(pageContext.db!, briefId, locale)) ?? null,
    // The draft changes with every edit: its sections are rendered every time, and sent with the data.
    outcomesHtml: renderOutcomes(outcomes, { slug: view.slug, version: number }, locale, null),
    citation: citation(reference(pageContext, cited(snapshot), path)),
    siteUrl: pageContext.siteUrl ?? "",
    httpStatus: undefined,
    cacheState: "",
    caching: "private",
  };
  return { ...common, problem: null, page };
}

export type PreviewPageData = Awaited<ReturnType<typeof previewPageData>>;
