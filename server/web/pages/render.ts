// Server-side rendering of the pages/ folder by Vike, the built assets, and the HTTP caching of
// public pages: released versions from memory with an ETag, other public pages revalidated.
import path from "node:path";
import type { IncomingMessage, ServerResponse } from "node:http";
import accepts from "accepts";
import express, { Router, type Request, type Response } from "express";
import fresh from "fresh";
import { createDevMiddleware, renderPage } from "vike/server";
import { defaultLocale, isLocale, localePath, negotiateLocale, splitLocale, type Locale } from "#core/locales";
import { mayReadEmbargoed } from "#core/roles";
import { publicVersionState } from "#db/versions";
import { localeCookie } from "../public/routes";
import { siteUrl } from "../http/site-url";
import type { Database } from "#db/client";
import { errorAnswer } from "../http/errors";
import type { createCsrf } from "../http/security";
import { briefOfPath, canonicalVersionPath, isDeskPath, parseBriefPath, parseVersionPath, surrogateKeys, type VersionPath } from "#core/urls";
import { admits, pageAccess } from "#core/access";
import { encode, etagOf, PageCache, StateMemo, type CachedPage, type Encodings } from "./page-cache";
import { Catalogue, catalogueKey } from "./catalogue";

/** Pages whose HTML carries a CSRF token, because they hold a form that posts without JavaScript. */
const holdsForm = (path: string) => path === "/sign-in" || path === "/password-reset" || /^\/(password-reset|invitation)\/[^/]+$/.test(path);

/** The pages that exist in every language: all but the desk and a draft's preview, which follow the person signed in. */
const negotiates = (path: string) => !isDeskPath(path) && !path.startsWith("/preview/");

/** The list pages: their data is the catalogue's, and a search's or a page's query is part of their address. */
const isListPath = (path: string) => path === "/" || path === "/briefs" || /^\/topics\/[^/]+$/.test(path);

/** The language a reader chose on the site (the cookie), else the first of ours their browser asks for, else English. */
function readerLocale(chosen: unknown, acceptLanguage: string | undefined): Locale {
  if (isLocale(chosen)) return chosen;
  return negotiateLocale(acceptLanguage) ?? defaultLocale;
}

/** One cookie's value from a Cookie header, read before cookie-parser runs (the fast path). */
function cookieValue(header: string, name: string): string | undefined {
  for (const pair of header.split(";")) {
    const at = pair.indexOf("=");
    if (at > 0 && pair.slice(0, at).trim() === name) return pair.slice(at + 1).trim();
  }
  return undefined;
}

/**
 * What a page's +data may say about its HTTP answer: a status other than 200 (410 for a withdrawn
 * brief) and how it may be cached — "version" for a released version (frozen), "revalidate" for a
 * public page that changes (the latest version, lists), "private" for what only some may see.
 */
export interface PageAnswer {
  httpStatus?: number;
  caching?: "version" | "revalidate" | "private";
  /** For a version's pages: what may still change on a frozen page (newer versions, withdrawal), as one string. */
  cacheState?: string;
}

/** Where a public page is kept in memory, and the state it is checked against on every hit. */
interface Kept {
  cache: PageCache;
  key: string;
  state: () => Promise<string | null>;
}

const cacheControl = {
  version: "public, max-age=3600",
  revalidate: "public, no-cache",
  private: "private, no-store",
} as const;

export async function pageRoutes(options: {
  root: string;
  production: boolean;
  csrf: ReturnType<typeof createCsrf>;
  db: Database;
  publicUrl?: string;
  /** The session cookie's name: a request without it is anonymous, and may take the fast path. */
  sessionCookie: string;
  /** Called for each answer of the fast path, which runs before the request logger: it logs them. */
  onFastAnswer?: (req: IncomingMessage, res: ServerResponse) => void;
}): Promise<{ router: Router; fastAnswer: (req: IncomingMessage, res: ServerResponse) => Promise<boolean>; forget: (slug: string) => void }> {
  const { root, production, csrf, db, publicUrl, sessionCookie, onFastAnswer } = options;
  const router = Router();
  const cache = new PageCache();
  // The list pages apart, in less memory: a flood of distinct searches cannot push out versions' pages.
  const lists = new PageCache(16 * 1024 * 1024, "quick");
  const states = new StateMemo<string | null>();
  const catalogue = new Catalogue(db, states);
  const rendering = new Map<string, Promise<CachedPage | null>>();
  if (production) {
    // Built assets carry a content hash in their name, so they can be cached for a year.
    router.use(
      "/assets",
      express.static(path.join(root, "dist/client/assets"), { immutable: true, maxAge: "365d", index: false }),
    );
    router.use(express.static(path.join(root, "dist/client"), { index: false }));
  } else {
    const { devMiddleware } = await createDevMiddleware({ root });
    router.use(devMiddleware);
  }

  function send(req: Request, res: Response, page: Omit<CachedPage, "state" | "encodings" | "caching"> & ({ html: string; encodings?: never } | { encodings: Encodings }), caching: keyof typeof cacheControl) {
    for (const [name, value] of page.headers) res.setHeader(name, value);
    const policy = res.getHeader("content-security-policy");
    const nonce = res.locals.cspNonce as string;
    // A page served from the cache was rendered for another response: a nonce that every reader of
    // it sees is no secret, so its policy names none. Its scripts are files of this site ('self');
    // its inline scripts are JSON data, which never runs (tests/integration/public-site.test.ts).
    if (typeof policy === "string" && page.nonce !== nonce) res.setHeader("content-security-policy", policy.replace(` 'nonce-${nonce}'`, ""));
    res.setHeader("Cache-Control", cacheControl[caching]);
    if (caching !== "private") {
      res.setHeader("ETag", page.etag);
      // A CDN in front may keep public answers; one purge of brief:<slug> takes all of a brief's (docs/operations.md).
      const keys = surrogateKeys(briefOfPath(splitLocale(req.path).path));
      if (keys) res.setHeader("Surrogate-Key", keys);
    }
    if ("state" in page && page.nonce !== nonce && !page.ready && !req.user) {
      // What every anonymous answer of this page from memory says; per-answer headers are left out.
      const perAnswer = new Set(["date", "vary", "set-cookie", "content-length", "content-encoding"]);
      (page as CachedPage).ready = Object.fromEntries(Object.entries(res.getHeaders()).filter(([name]) => !perAnswer.has(name))) as CachedPage["ready"];
    }
    if (caching !== "private" && page.status === 200 && req.fresh) return res.status(304).end();
    // The type is among Vike's headers: HTML for pages, JSON for client navigation's pageContext.
    res.status(page.status);
    if (!page.encodings) return res.send(page.html);
    // Already compressed: the compression middleware leaves an answer with a Content-Encoding alone.
    const encoding = req.acceptsEncodings("br", "gzip", "identity") || "identity";
    const body = page.encodings[encoding as keyof Encodings] ?? page.encodings.identity;
    res.vary("Accept-Encoding");
    if (encoding !== "identity") res.setHeader("Content-Encoding", encoding);
    res.setHeader("Content-Length", body.length);
    res.end(req.method === "HEAD" ? undefined : body);
  }

  router.use(async (req, res, next) => {
    if (req.method !== "GET" && req.method !== "HEAD") return next();
    // The desk is rendered in the browser; a reader who is not signed in is sent to sign in first,
    // and comes back to the same screen afterwards.
    if (isDeskPath(req.path) && !admits(pageAccess["GET /desk/*"].who, req.user?.roles ?? null)) {
      return res.redirect(303, `/sign-in?next=${encodeURIComponent(req.originalUrl)}`);
    }
    const { locale, path } = splitLocale(req.path);
    const query = req.originalUrl.slice(req.path.length);
    // A first visit to an unprefixed address goes to the reader's language; a language chosen on the
    // site (the cookie) wins over the browser's. The answer depends on both, and says so.
    if (locale === defaultLocale && negotiates(path)) {
      res.vary("Accept-Language").vary("Cookie");
      const chosen = readerLocale(req.cookies?.[localeCookie], req.get("accept-language"));
      if (chosen !== defaultLocale) return res.redirect(302, localePath(chosen, path) + query);
    }
    const parsed = parseVersionPath(path);
    // A version's page has one address: another spelling of it (percent-encoding, a trailing slash)
    // is sent there, so that each page is rendered and cached once.
    if (parsed && !parsed.canonical) return res.redirect(301, localePath(locale, canonicalVersionPath(parsed)) + query);
    // A brief's and a version's page take no query: one with a query goes to the page without it, so
    // that nothing of a request's query can reach the page kept for every reader (hostile probe round 3, F7).
    if (query && (parsed || parseBriefPath(path))) return res.redirect(301, localePath(locale, path));
    try {
      const memory = memoryCached(req.user, locale, path, query, parsed);
      if (memory) {
        const cached = memory.cache.get(memory.key);
        if (cached) {
          if ((await memory.state()) === cached.state) return send(req, res, cached, cached.caching);
          memory.cache.delete(memory.key);
        }
        // One render per address at a time: readers who arrive meanwhile get its result, so that a
        // cold page under load is rendered once rather than once per reader.
        const pending = rendering.get(memory.key);
        if (pending) {
          const entry = await pending;
          if (entry) return send(req, res, entry, entry.caching);
        }
      }
      const rendered = renderAndKeep(req, res, path, memory);
      if (memory) rendering.set(memory.key, rendered.then((result) => result?.entry ?? null));
      const result = await rendered.finally(() => memory && rendering.delete(memory.key));
      if (!result) return next();
      send(req, res, result.entry ?? result.page, result.caching);
    } catch (error) {
      next(error);
    }
  });

  /**
   * Released versions and latest addresses kept in memory, answered to anonymous readers by the HTTP
   * server itself, before Express and everything in it (no session, passport, cookie parsing, nonce,
   * helmet, compression or routing, which such an answer does not need). Its headers are those the
   * full way wrote the first time it answered the page from memory (`ready`), so both ways answer
   * alike. Anything else — a reader with a session (who may see embargoed versions), a query string,
   * a page not in memory, out of date or not yet answered once, an address to redirect — resolves to
   * false and goes the full way. docs/decisions/0010-public-pages-and-caching.md.
   */
  async function fastAnswer(req: IncomingMessage, res: ServerResponse): Promise<boolean> {
    if (req.method !== "GET" && req.method !== "HEAD") return false;
    const url = req.url ?? "/";
    if (!url.startsWith("/")) return false;
    const cookies = req.headers.cookie ?? "";
    if (cookieValue(cookies, sessionCookie) !== undefined) return false;
    const at = url.indexOf("?");
    const query = at < 0 ? "" : url.slice(at);
    const { locale, path } = splitLocale(at < 0 ? url : url.slice(0, at));
    // Only a list's address carries a query that names a page of its own (a search, a page number).
    if (query && !isListPath(path)) return false;
    const negotiated = locale === defaultLocale && negotiates(path);
    if (negotiated && readerLocale(cookieValue(cookies, localeCookie), req.headers["accept-language"]) !== defaultLocale) return false;
    const parsed = parseVersionPath(path);
    if (parsed && !parsed.canonical) return false;
    const memory = memoryCached(undefined, locale, path, query, parsed);
    const cached = memory?.cache.get(memory.key);
    if (!memory || !cached?.ready || (await memory.state()) !== cached.state) return false;
    const vary = negotiated ? "Accept-Language, Cookie, Accept-Encoding" : "Accept-Encoding";
    // The same freshness and encoding rules as the full way's req.fresh and req.acceptsEncodings (Express's own packages).
    if (cached.status === 200 && fresh(req.headers, { etag: cached.etag })) {
      res.writeHead(304, { ...cached.ready, vary });
      res.end();
    } else {
      const encoding = (accepts(req).encodings("br", "gzip", "identity") || "identity") as keyof Encodings;
      const body = cached.encodings[encoding];
      res.writeHead(cached.status, { ...cached.ready, vary, ...(encoding === "identity" ? {} : { "content-encoding": encoding }), "content-length": body.length });
      res.end(req.method === "HEAD" ? undefined : body);
    }
    onFastAnswer?.(req, res);
    return true;
  }

  /**
   * The public pages kept in memory, with the state each is checked against on every hit: a released
   * version's pages and a brief's latest address (against the brief's state), and the list pages
   * (against the catalogue's). Only a reader who sees what the public sees shares them: the press and
   * editors also see embargoed versions in a page's history.
   */
  function memoryCached(reader: Request["user"], locale: Locale, path: string, query: string, version: VersionPath | null): Kept | null {
    if (mayReadEmbargoed(reader?.roles ?? [])) return null;
    if (isListPath(path)) return { cache: lists, key: PageCache.key(locale, path + query), state: () => catalogue.state() };
    const key = PageCache.key(locale, path);
    if (version) {
      const { slug, version: number } = version.at;
      return { cache, key, state: () => states.get(`${slug}/${number}`, () => publicVersionState(db, slug, number)) };
    }
    const latest = parseBriefPath(path);
    // The latest address shows the newest released version: the same state, read from version 1 on.
    if (latest) return { cache, key, state: () => states.get(`${latest}/latest`, () => publicVersionState(db, latest, 1)) };
    return null;
  }

  /** Renders the page; one that says how it may be cached in memory is kept where `kept` says. */
  async function renderAndKeep(req: Request, res: Response, path: string, kept: Kept | null) {
    let csrfToken: string | undefined;
    if (holdsForm(path)) {
      csrfToken = csrf.issueToken(req, res);
    }
    const pageContext = await renderPage({
      urlOriginal: req.originalUrl,
      headersOriginal: req.headers,
      cspNonce: res.locals.cspNonce as string,
      person: req.user ?? null,
      db,
      catalogue: (locale: Locale) => catalogue.briefs(locale),
      csrfToken,
      siteUrl: siteUrl(req, publicUrl),
    });
    const { httpResponse } = pageContext;
    if (!httpResponse) return null;
    // Vike renders its error page with a 500 when a page's data could not be read; a database that is
    // down or restarting is the client's 503 instead, as for every other answer (hostile probe round 3, F8).
    const failure = (pageContext as { errorWhileRendering?: unknown }).errorWhileRendering;
    if (failure && errorAnswer(failure).status === 503) throw failure;
    const answer = ((pageContext as { data?: unknown }).data ?? {}) as PageAnswer;
    const html = await httpResponse.getBody();
    // helmet has set the full policy with the same nonce; Vike's shorter one would replace it.
    const headers = httpResponse.headers.filter(([name]) => name.toLowerCase() !== "content-security-policy") as [string, string][];
    const nonce = res.locals.cspNonce as string;
    // The tag leaves the nonce out: every process renders the page with a nonce of its own, and a
    // reader (or a CDN) revalidating with one process's tag must get its 304 from any other.
    const page = { html, etag: etagOf(html.replaceAll(nonce, "")), status: answer.httpStatus ?? httpResponse.statusCode, headers, nonce };
    const caching = httpResponse.statusCode >= 400 && !answer.httpStatus ? "private" : (answer.caching ?? "private");
    if (kept && caching !== "private" && answer.cacheState !== undefined) {
      const entry: CachedPage = { etag: page.etag, status: page.status, headers, nonce: page.nonce, encodings: encode(html, kept.cache.effort), state: answer.cacheState, caching };
      kept.cache.set(kept.key, entry);
      return { page, caching, entry };
    }
    return { page, caching, entry: null };
  }

  /** What this process remembers of a brief's versions and of the catalogue, dropped when the database announces a change to them. */
  const forget = (slug: string) => {
    states.forget(`${slug}/`);
    states.forget(catalogueKey);
  };
  return { router, fastAnswer, forget };
}
