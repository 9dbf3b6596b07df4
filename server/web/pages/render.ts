// Server-side rendering of the pages/ folder by Vike, the built assets, and the HTTP caching of
// public pages: released versions from memory with an ETag, other public pages revalidated.
import path from "node:path";
import express, { Router, type Request, type Response } from "express";
import { createDevMiddleware, renderPage } from "vike/server";
import { defaultLocale, isLocale, localePath, negotiateLocale, splitLocale, type Locale } from "#core/locales";
import { mayReadEmbargoed } from "#core/roles";
import { publicVersionState } from "#db/versions";
import { localeCookie, siteUrl } from "../public/routes";
import type { Database } from "#db/client";
import type { createCsrf } from "../http/security";
import { canonicalVersionPath, isDeskPath, parseBriefPath, parseVersionPath, type VersionPath } from "#core/urls";
import { admits, pageAccess } from "#core/access";
import { encode, etagOf, PageCache, StateMemo, type CachedPage, type Encodings } from "./page-cache";

/** Pages whose HTML carries a CSRF token, because they hold a form that posts without JavaScript. */
const holdsForm = (path: string) => path === "/sign-in" || path === "/password-reset" || /^\/(password-reset|invitation)\/[^/]+$/.test(path);

/** The pages that exist in every language: all but the desk and a draft's preview, which follow the person signed in. */
const negotiates = (path: string) => !isDeskPath(path) && !path.startsWith("/preview/");

/** The language a reader chose on the site, else the first of ours their browser asks for, else English. */
function readerLocale(req: Request): Locale {
  const chosen: unknown = req.cookies?.[localeCookie];
  if (isLocale(chosen)) return chosen;
  return negotiateLocale(req.get("accept-language")) ?? defaultLocale;
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
}): Promise<Router> {
  const { root, production, csrf, db, publicUrl } = options;
  const router = Router();
  const cache = new PageCache();
  const states = new StateMemo<string | null>();
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

  function send(req: Request, res: Response, page: Omit<CachedPage, "state" | "encodings" | "caching"> & { encodings?: Encodings }, caching: keyof typeof cacheControl) {
    for (const [name, value] of page.headers) res.setHeader(name, value);
    const policy = res.getHeader("content-security-policy");
    const nonce = res.locals.cspNonce as string;
    // A page served from the cache was rendered for another response: a nonce that every reader of
    // it sees is no secret, so its policy names none. Its scripts are files of this site ('self');
    // its inline scripts are JSON data, which never runs (tests/integration/public-site.test.ts).
    if (typeof policy === "string" && page.nonce !== nonce) res.setHeader("content-security-policy", policy.replace(` 'nonce-${nonce}'`, ""));
    res.setHeader("Cache-Control", cacheControl[caching]);
    if (caching !== "private") res.setHeader("ETag", page.etag);
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
      const chosen = readerLocale(req);
      if (chosen !== defaultLocale) return res.redirect(302, localePath(chosen, path) + query);
    }
    const parsed = parseVersionPath(path);
    // A version's page has one address: another spelling of it (percent-encoding, a trailing slash)
    // is sent there, so that each page is rendered and cached once.
    if (parsed && !parsed.canonical) return res.redirect(301, localePath(locale, canonicalVersionPath(parsed)) + query);
    try {
      const memory = memoryCached(req, locale, path, parsed);
      if (memory) {
        const cached = cache.get(memory.key);
        if (cached) {
          if ((await memory.state()) === cached.state) return send(req, res, cached, cached.caching);
          cache.delete(memory.key);
        }
        // One render per address at a time: readers who arrive meanwhile get its result, so that a
        // cold page under load is rendered once rather than once per reader.
        const pending = rendering.get(memory.key);
        if (pending) {
          const entry = await pending;
          if (entry) return send(req, res, entry, entry.caching);
        }
      }
      const rendered = renderAndKeep(req, res, memory?.key ?? null);
      if (memory) rendering.set(memory.key, rendered.then((result) => result?.entry ?? null));
      const result = await rendered.finally(() => memory && rendering.delete(memory.key));
      if (!result) return next();
      send(req, res, result.entry ?? result.page, result.caching);
    } catch (error) {
      next(error);
    }
  });

  /**
   * The public pages kept in memory, with the state each is checked against on every hit: a released
   * version's pages and a brief's latest address. Only a reader who sees what the public sees shares
   * them: the press and editors also see embargoed versions in a page's history.
   */
  function memoryCached(req: Request, locale: Locale, path: string, version: VersionPath | null): { key: string; state: () => Promise<string | null> } | null {
    if (mayReadEmbargoed(req.user?.roles ?? [])) return null;
    const key = PageCache.key(locale, path);
    if (version) {
      const { slug, version: number } = version.at;
      return { key, state: () => states.get(`${slug}/${number}`, () => publicVersionState(db, slug, number)) };
    }
    const latest = parseBriefPath(path);
    // The latest address shows the newest released version: the same state, read from version 1 on.
    if (latest) return { key, state: () => states.get(`${latest}/latest`, () => publicVersionState(db, latest, 1)) };
    return null;
  }

  /** Renders the page; one that says how it may be cached in memory is kept under `key`. */
  async function renderAndKeep(req: Request, res: Response, key: string | null) {
    let csrfToken: string | undefined;
    if (holdsForm(splitLocale(req.path).path)) {
      req.session.csrfIssued = true;
      csrfToken = csrf.generateCsrfToken(req, res, { overwrite: false });
    }
    const pageContext = await renderPage({
      urlOriginal: req.originalUrl,
      headersOriginal: req.headers,
      cspNonce: res.locals.cspNonce as string,
      person: req.user ?? null,
      db,
      csrfToken,
      siteUrl: siteUrl(req, publicUrl),
    });
    const { httpResponse } = pageContext;
    if (!httpResponse) return null;
    const answer = ((pageContext as { data?: unknown }).data ?? {}) as PageAnswer;
    const html = await httpResponse.getBody();
    // helmet has set the full policy with the same nonce; Vike's shorter one would replace it.
    const headers = httpResponse.headers.filter(([name]) => name.toLowerCase() !== "content-security-policy") as [string, string][];
    const page = { html, etag: etagOf(html), status: answer.httpStatus ?? httpResponse.statusCode, headers, nonce: res.locals.cspNonce as string };
    const caching = httpResponse.statusCode >= 400 && !answer.httpStatus ? "private" : (answer.caching ?? "private");
    if (key && caching !== "private" && answer.cacheState !== undefined) {
      const entry: CachedPage = { ...page, encodings: encode(html), state: answer.cacheState, caching };
      cache.set(key, entry);
      return { page, caching, entry };
    }
    return { page, caching, entry: null };
  }

  return router;
}
