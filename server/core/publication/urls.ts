// Every public address, built and parsed in one place (docs/decisions/0014-one-url-map.md): pages,
// the page cache, citations, the feed, the sitemap and the desk's links all come from here. Path
// segments that come from data (slugs, treatment labels) are percent-encoded, so a label holding "/"
// or "?" still names one comparison; parsing decodes them and says whether the address was canonical.

import { localePath, locales, type Locale } from "../languages/locales";

export type CitationFormat = "ris" | "bib" | "json";
export const citationFormats: readonly CitationFormat[] = ["ris", "bib", "json"];

export interface VersionAddress {
  slug: string;
  version: number;
}

export interface ComparisonAddress extends VersionAddress {
  treatment: string;
  comparator: string;
}

const segment = encodeURIComponent;

export const homeUrl = () => "/";
export const feedUrl = () => "/feed.xml";
export const sitemapUrl = () => "/sitemap.xml";
export const dataUrl = () => "/data";
/** The words a brief uses, explained; with a term, that term's entry (server/core/publication/glossary.ts). */
export const glossaryUrl = (term?: string) => `/glossary${term ? `#${term}` : ""}`;
export const topicUrl = (topicSlug: string) => `/topics/${segment(topicSlug)}`;
export const briefUrl = (slug: string) => `/briefs/${segment(slug)}`;
export const versionUrl = (at: VersionAddress) => `${briefUrl(at.slug)}/v/${at.version}`;
/** A released version's frozen snapshot as JSON, in the API for reuse (docs/data.md). */
export const snapshotUrl = (at: VersionAddress) => `/api${briefUrl(at.slug)}/versions/${at.version}`;
export const comparisonUrl = (at: ComparisonAddress) => `${versionUrl(at)}/compare/${segment(at.treatment)}/${segment(at.comparator)}`;
/** The reader's side-by-side of 2 to 4 options of a version, in the order chosen; without options, the address its form sends to. */
export const sideBySideUrl = (at: VersionAddress, options?: string[]) => `${versionUrl(at)}/side-by-side${options ? `?options=${options.map(segment).join(",")}` : ""}`;

/** The version a side-by-side address belongs to; null for any other address. */
export function parseSideBySidePath(path: string): VersionAddress | null {
  const match = /^(\/briefs\/[^/]+\/v\/[^/]+)\/side-by-side$/.exec(path);
  const version = match ? parseVersionPath(match[1]!) : null;
  return version?.kind === "version" ? version.at : null;
}
/** One-time account links (server/core/access/tokens.ts), and the form that asks for a reset link. */
export const invitationUrl = (token: string) => `/invitation/${segment(token)}`;
export const passwordResetUrl = (token?: string) => (token ? `/password-reset/${segment(token)}` : "/password-reset");

/** A reader's topic alerts: the confirmation and unsubscribe pages, and the one-click address of RFC 8058. */
export const confirmSubscriptionUrl = (token: string) => `/subscriptions/confirm/${segment(token)}`;
export const unsubscribeUrl = (token: string) => `/subscriptions/unsubscribe/${segment(token)}`;
export const oneClickUnsubscribeUrl = (token: string) => `/api/subscriptions/unsubscribe?token=${encodeURIComponent(token)}`;

/** The desk, a client-rendered app: /desk and every screen below it. */
export const isDeskPath = (path: string) => path === "/desk" || path.startsWith("/desk/");
export const previewUrl = (briefId: string) => `/preview/${segment(briefId)}`;

/** The search page, with its query when there is one. */
export function searchUrl(query: { q?: string; topic?: string; page?: number } = {}): string {
  // Page 1 is the address without a page.
  const params = new URLSearchParams(
    Object.entries({ ...query, page: query.page && query.page > 1 ? String(query.page) : undefined }).filter((entry): entry is [string, string] => Boolean(entry[1])),
  );
  const search = params.toString();
  return search ? `/briefs?${search}` : "/briefs";
}

/** The citation file of a version, or of one comparison in it. */
export const citationUrl = (at: VersionAddress | ComparisonAddress, format: CitationFormat) => `${pageUrl(at)}/cite.${format}`;

export const downloadUrl = (at: VersionAddress, file: string) => `${versionUrl(at)}/downloads/${segment(file)}`;

/** What changed in a version since the one before, as data (docs/data.md). */
export const changesUrl = (at: VersionAddress) => `${versionUrl(at)}/changes.json`;

/** The page of a version, or of one comparison in it. */
export const pageUrl = (at: VersionAddress | ComparisonAddress) => ("treatment" in at ? comparisonUrl(at) : versionUrl(at));

/** The card other sites frame (the only address that may be framed), and the share image of a page. */
export const embedUrl = (at: VersionAddress | ComparisonAddress) => `/embed${pageUrl(at)}`;
/** The message type the card posts to the page framing it, with its height (for auto-sizing). */
export const embedHeightMessage = "fairweigh:embed-height";
export const shareImageUrl = (at: VersionAddress | ComparisonAddress) => `${pageUrl(at)}/share.png`;

/** The oEmbed answer for an absolute page address (oEmbed 1.0, §2.2). */
export const oembedUrl = (pageAddress: string) => `/oembed?url=${encodeURIComponent(pageAddress)}&format=json`;

/** What a public address of a released version names; `canonical` is false when it was spelled another way. */
export type VersionPath =
  | { kind: "version"; at: VersionAddress; canonical: boolean }
  | { kind: "comparison"; at: ComparisonAddress; canonical: boolean };

// Nine digits at most: every such number fits PostgreSQL's integer, and no brief has more versions.
const versionNumber = /^[1-9]\d{0,8}$/;

/** The version number in an address, or null when the segment is not one (a version beyond the integer range names nothing). */
export const versionNumberOf = (raw: string): number | null => (versionNumber.test(raw) ? Number(raw) : null);

function decoded(raw: string): string | null {
  try {
    const value = decodeURIComponent(raw);
    // A NUL byte or an empty segment names nothing (PostgreSQL refuses NUL in text).
    return value === "" || value.includes("\u0000") ? null : value;
  } catch {
    return null;
  }
}

/** Whether a path decodes, without a NUL byte: anything else names nothing. */
export function addressable(path: string): boolean {
  try {
    return !decodeURIComponent(path).includes("\u0000");
  } catch {
    return false;
  }
}

/** /briefs/:slug/v/:n and /briefs/:slug/v/:n/compare/:a/:b (a trailing slash is not canonical). */
export function parseVersionPath(path: string): VersionPath | null {
  const parts = path.split("/");
  const trailing = parts.at(-1) === "";
  if (trailing) parts.pop();
  if (parts[0] !== "" || parts[1] !== "briefs" || parts[3] !== "v" || !versionNumber.test(parts[4] ?? "")) return null;
  const slug = decoded(parts[2] ?? "");
  if (slug === null) return null;
  const version = Number(parts[4]);
  if (parts.length === 5) {
    const at = { slug, version };
    return { kind: "version", at, canonical: !trailing && versionUrl(at) === path };
  }
  if (parts.length !== 8 || parts[5] !== "compare") return null;
  const treatment = decoded(parts[6]!);
  const comparator = decoded(parts[7]!);
  if (treatment === null || comparator === null) return null;
  const at = { slug, version, treatment, comparator };
  return { kind: "comparison", at, canonical: !trailing && comparisonUrl(at) === path };
}

/** The slug of a brief's latest address /briefs/:slug, spelled canonically; null for anything else. */
export function parseBriefPath(path: string): string | null {
  const match = /^\/briefs\/([^/]+)$/.exec(path);
  const slug = match ? decoded(match[1]!) : null;
  return slug !== null && briefUrl(slug) === path ? slug : null;
}

/** The slug of a topic's page /topics/:slug; null for anything else. */
export function parseTopicPath(path: string): string | null {
  const match = /^\/topics\/([^/]+)$/.exec(path);
  return match ? decoded(match[1]!) : null;
}

/** The list pages (home, search, a topic): their data is the catalogue's, and their query names a page of its own. */
export const isListPath = (path: string) => path === homeUrl() || path === searchUrl() || parseTopicPath(path) !== null;

/** One-time links' pages and the sign-in and reset forms: they post without JavaScript, so they carry a CSRF token. */
export const holdsForm = (path: string) => path === "/sign-in" || path === passwordResetUrl() || isLinkPage(path, `${passwordResetUrl()}/`) || isLinkPage(path, invitationUrl(""));
/** A one-time link's page: its prefix and one segment, the token. */
const isLinkPage = (path: string, prefix: string) => path.startsWith(prefix) && /^[^/]+$/.test(path.slice(prefix.length));

/** The pages that exist in every language: all but the desk and a draft's preview, which follow the person signed in. */
export const negotiates = (path: string) => !isDeskPath(path) && !path.startsWith(previewUrl(""));

/** The address a version path is canonically spelled as. */
export const canonicalVersionPath = (parsed: VersionPath) => (parsed.kind === "version" ? versionUrl(parsed.at) : comparisonUrl(parsed.at));

/** The same page in every language, and x-default (the unprefixed, English one): hreflang links and the sitemap. */
export function alternates(path: string): { hreflang: string; path: string }[] {
  return [...locales.map((locale) => ({ hreflang: locale, path: localePath(locale, path) })), { hreflang: "x-default", path }];
}

/** Where the language switcher sends a reader: it keeps the choice (a cookie), then shows `path` in `locale`. */
export const languageChoiceUrl = (locale: Locale, path: string) => `/language/${locale}?next=${encodeURIComponent(path)}`;

/**
 * The tags a CDN files a public answer under (Surrogate-Key, space separated), so that one purge
 * takes a brief's every page and file: `brief:<slug>` for all of them, and `brief:<slug>:v<n>` for
 * one version's. Null for answers that belong to no brief.
 */
export function surrogateKeys(at: { slug: string; version?: number } | null): string | null {
  if (!at) return null;
  return at.version === undefined ? `brief:${at.slug}` : `brief:${at.slug} brief:${at.slug}:v${at.version}`;
}

/** The brief (and version) a public page's path names, for its surrogate keys. */
export function briefOfPath(path: string): { slug: string; version?: number } | null {
  const version = parseVersionPath(path);
  if (version) return { slug: version.at.slug, version: version.at.version };
  const sideBySide = parseSideBySidePath(path);
  if (sideBySide) return sideBySide;
  const slug = parseBriefPath(path);
  return slug === null ? null : { slug };
}
