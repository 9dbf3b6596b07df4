// The public site's files beside its pages: citations, data downloads, the Atom feed, the sitemap
// and robots.txt. Everything comes from released, frozen versions; embargoed ones answer 404 to
// all but the press and editors, exactly as their pages do.
import { Router, type Request, type Response } from "express";
import { comparisonContent } from "#core/publication/brief-page";
import { dayInWords, defaultLocale, isLocale, localeCookie, localePath, locales, splitLocale, type Locale } from "#core/languages/locales";
import { alternates, briefUrl, surrogateKeys, comparisonUrl, feedUrl, glossaryUrl, homeUrl, searchUrl, sitemapUrl, versionNumberOf, versionUrl } from "#core/publication/urls";
import { listReleasedVersions, readVersion, type FoundVersion } from "#db/versions";
import { wordsOf } from "#core/languages/words";
import type { Database } from "#db/client";
import { citationFile, citationMedia, type CitationFormat, type CitationInput } from "./citations";
import { downloads } from "./downloads";
import { atomFeed, escapeXml, feedEntries } from "./feed";
import { reachRoutes } from "./reach";
import { siteUrl } from "../http/site-url";

const notFound = "There is no such published version.";

/** The files that have words, and so an address in each language: citations, downloads, the feed, embedded cards and share images. */
const localizedFile = (path: string) => /\/cite\.\w+$|\/downloads\/[^/]+$|^\/feed\.xml$|^\/embed\/|\/share\.png$/.test(path);

/**
 * Where the language switcher returns: the page without its own language prefix, in the chosen one,
 * its query string kept. Checked once the prefix is gone, so that no address of another site gets
 * through ("/es//host" would become "//host", "/es/\\host" "/\\host", which browsers read as a host).
 */
export function returnPath(next: unknown, locale: Locale): string {
  const home = localePath(locale, "/");
  if (typeof next !== "string" || !/^\/(?![/\\])/.test(next)) return home;
  const query = next.indexOf("?") < 0 ? next.length : next.indexOf("?");
  const path = localePath(locale, splitLocale(next.slice(0, query)).path) + next.slice(query);
  // eslint-disable-next-line no-control-regex -- a control character has no place in an address
  return /^\/(?![/\\])/.test(path) && !/[\\\u0000-\u001f\u007f]/.test(path) ? path : home;
}

export function publicFileRoutes(db: Database, publicUrl: string | undefined, secureTransport: boolean): Router {
  const router = Router();
  const localeOf = (res: Response): Locale => (res.locals.locale as Locale | undefined) ?? defaultLocale;

  // /es/feed.xml is the feed in Spanish: routes below see /feed.xml and the locale beside it.
  router.use((req, res, next) => {
    const { locale, path } = splitLocale(req.path);
    if (locale !== defaultLocale && localizedFile(path)) {
      res.locals.locale = locale;
      req.url = path + req.url.slice(req.path.length);
    }
    next();
  });

  // The language switcher: the reader's choice is kept for a year, then the same page in that language.
  router.get("/language/:locale", (req, res) => {
    const locale = String(req.params.locale);
    if (!isLocale(locale)) return res.status(404).type("text/plain").send(`There is no language "${locale}" here: choose one of ${locales.join(", ")}.`);
    res.cookie(localeCookie, locale, { maxAge: 365 * 24 * 3600 * 1000, sameSite: "lax", httpOnly: true, secure: secureTransport, path: "/" });
    res.set("Cache-Control", "no-store").redirect(303, returnPath(req.query.next, locale));
  });

  // Files need the version only, not its history: one query.
  const versionOf = async (req: Request) => {
    const number = versionNumberOf(String(req.params.number));
    if (number === null) return null;
    return readVersion(db, String(req.params.slug), number, req.user?.roles ?? []);
  };
  const formatOf = (value: unknown): CitationFormat | null => (value === "ris" || value === "bib" || value === "json" ? value : null);
  const cacheFor = (embargoed: boolean) => (embargoed ? "private, no-store" : "public, max-age=3600");
  /** A released version's file: cached for an hour, filed under its brief's and version's surrogate keys. */
  const setCaching = (res: Response, embargoed: boolean, at: { slug: string; version: number }) => {
    res.set("Cache-Control", cacheFor(embargoed));
    if (!embargoed) res.set("Surrogate-Key", surrogateKeys(at)!);
  };

  /**
   * A data file of a withdrawn brief is no longer offered to readers: 410 with the reason, answered
   * here (true). Its editors still fetch it, signed in and uncached. Otherwise the file's caching is set.
   */
  const answeredWithdrawn = (req: Request, res: Response, page: FoundVersion): boolean => {
    const at = { slug: page.snapshot.brief.slug, version: page.snapshot.version };
    if (!page.withdrawal) {
      setCaching(res, page.embargoed, at);
      return false;
    }
    if ((req.user?.roles ?? []).includes("editor")) {
      res.set("Cache-Control", "private, no-store");
      return false;
    }
    setCaching(res, false, at);
    const locale = localeOf(res);
    res.status(410).type("text/plain").send(wordsOf(locale, "public")("download.withdrawn", { date: dayInWords(locale, page.withdrawal.at), reason: page.withdrawal.reason }));
    return true;
  };

  /** A citation file for a version or one comparison in it, named after what it cites; a withdrawn brief's says so. */
  function sendCitation(res: Response, format: CitationFormat, page: FoundVersion, fileBase: string, input: Omit<CitationInput, "accessed" | "withdrawn">, at: { slug: string; version: number }) {
    setCaching(res, page.embargoed, at);
    const t = wordsOf(localeOf(res), "public");
    const withdrawn = page.withdrawal ? { titlePrefix: t("cite.withdrawnTitle"), note: t("cite.withdrawnNote", { date: page.withdrawal.at.slice(0, 10), reason: page.withdrawal.reason }) } : null;
    res.type(citationMedia[format]).attachment(`${fileBase}.${format === "json" ? "csl.json" : format}`).send(citationFile({ ...input, accessed: new Date(), withdrawn }, format));
  }

  router.get("/briefs/:slug/v/:number/cite.:format", async (req, res) => {
    const format = formatOf(req.params.format);
    const page = format ? await versionOf(req) : null;
    if (!format || !page) return res.status(404).type("text/plain").send(notFound);
    const { snapshot } = page;
    const locale = localeOf(res);
    const url = `${siteUrl(req, publicUrl)}${localePath(locale, versionUrl({ slug: snapshot.brief.slug, version: snapshot.version }))}`;
    sendCitation(res, format, page, `${snapshot.brief.slug}-v${snapshot.version}`, { title: snapshot.brief.title, author: snapshot.brief.authorTeam, version: snapshot.version, releaseAt: snapshot.releaseAt, url, language: locale }, { slug: snapshot.brief.slug, version: snapshot.version });
  });

  router.get("/briefs/:slug/v/:number/compare/:a/:b/cite.:format", async (req, res) => {
    const format = formatOf(req.params.format);
    const page = format ? await versionOf(req) : null;
    const view = page ? comparisonContent(page.snapshot, String(req.params.a), String(req.params.b)) : null;
    if (!format || !page || !view) return res.status(404).type("text/plain").send("There is no such comparison in this version.");
    const locale = localeOf(res);
    const url = `${siteUrl(req, publicUrl)}${localePath(locale, comparisonUrl({ slug: view.slug, version: view.version, treatment: view.treatment.id, comparator: view.comparator.id }))}`;
    sendCitation(res, format, page, `${view.slug}-v${view.version}-${view.treatment.id}-vs-${view.comparator.id}`, {
      title: view.title,
      author: page.snapshot.brief.authorTeam,
      version: view.version,
      releaseAt: view.releaseAt,
      url,
      comparison: wordsOf(locale, "public")("brief.versus", { treatment: view.treatment.name, comparator: view.comparator.name }),
      language: locale,
    }, { slug: view.slug, version: view.version });
  });

  router.get("/briefs/:slug/v/:number/downloads/:file", async (req, res) => {
    // Only the files listed: a name such as __proto__ is no file of ours.
    const name = String(req.params.file);
    const file = Object.hasOwn(downloads, name) ? downloads[name as keyof typeof downloads] : null;
    const page = file ? await versionOf(req) : null;
    if (!file || !page) return res.status(404).type("text/plain").send("There is no such download.");
    const { snapshot } = page;
    if (answeredWithdrawn(req, res, page)) return;
    res.type(file.media).attachment(`${snapshot.brief.slug}-v${snapshot.version}-${String(req.params.file)}`).send(file.build(snapshot));
  });

  // What changed since the version before, as frozen with this one (docs/data.md): the same facts the
  // page's "What changed" section words, by treatment label and on the analysis scale.
  router.get("/briefs/:slug/v/:number/changes.json", async (req, res) => {
    const page = await versionOf(req);
    if (!page) return res.status(404).type("text/plain").send(notFound);
    const { snapshot, changes } = page;
    if (!changes) return res.status(404).type("text/plain").send(`Version ${snapshot.version} is the first: no version came before it.`);
    if (answeredWithdrawn(req, res, page)) return;
    res.json({ slug: snapshot.brief.slug, ...changes });
  });

  router.get("/feed.xml", async (req, res) => {
    const base = siteUrl(req, publicUrl);
    const locale = localeOf(res);
    const t = wordsOf(locale, "public");
    const entries = feedEntries(await listReleasedVersions(db), base, locale, t);
    res.set("Cache-Control", "public, max-age=300").type("application/atom+xml; charset=utf-8").send(atomFeed({ base, selfUrl: `${base}${localePath(locale, feedUrl())}`, entries, locale, t }));
  });

  router.get("/sitemap.xml", async (req, res) => {
    const base = siteUrl(req, publicUrl);
    // A withdrawn brief keeps its pages (410, saying why) but leaves the sitemap: nothing to index.
    const versions = (await listReleasedVersions(db)).filter((version) => version.withdrawnAt === null);
    const latest = new Map<string, string>();
    for (const v of versions) if (!latest.has(v.slug)) latest.set(v.slug, v.releaseAt);
    // Each page in every language, each naming all of them (hreflang alternates, x-default English).
    const links = (path: string) => alternates(path).map((a) => `<xhtml:link rel="alternate" hreflang="${a.hreflang}" href="${escapeXml(base + a.path)}"/>`).join("");
    const entry = (path: string, lastmod?: string) =>
      locales
        .map((locale) => `  <url><loc>${escapeXml(base + localePath(locale, path))}</loc>${lastmod ? `<lastmod>${lastmod.slice(0, 10)}</lastmod>` : ""}${links(path)}</url>`)
        .join("\n");
    const urls = [
      entry(homeUrl()),
      entry(searchUrl()),
      entry(glossaryUrl()),
      ...[...latest].map(([slug, at]) => entry(briefUrl(slug), at)),
      ...versions.map((v) => entry(versionUrl({ slug: v.slug, version: v.number }), v.releaseAt)),
    ];
    res
      .set("Cache-Control", "public, max-age=300")
      .type("application/xml; charset=utf-8")
      .send(`<?xml version="1.0" encoding="UTF-8"?>\n<urlset xmlns="http://www.sitemaps.org/schemas/sitemap/0.9" xmlns:xhtml="http://www.w3.org/1999/xhtml">\n${urls.join("\n")}\n</urlset>\n`);
  });

  router.use(reachRoutes(db, publicUrl));

  router.get("/robots.txt", (req, res) => {
    res.type("text/plain").send(`User-agent: *\nDisallow: /desk\nDisallow: /api/\nDisallow: /sign-in\nDisallow: /preview/\nSitemap: ${siteUrl(req, publicUrl)}${sitemapUrl()}\n`);
  });

  return router;
}
