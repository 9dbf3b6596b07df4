// The pages/ folder rendered by Vike, and the built assets: the wiring of the public pages' way
// through the server. A reader's language and a page's one address come first (redirects); then a
// page kept in memory is answered from there (cache-policy.ts, answer-from-cache.ts), and anything
// else is rendered, and kept where it may be (render-and-keep.ts). Anonymous readers of kept pages
// are answered before Express runs at all (fastAnswer).
import { createHash } from "node:crypto";
import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import type { IncomingMessage, ServerResponse } from "node:http";
import express, { Router, type Request, type Response } from "express";
import { createDevMiddleware } from "vike/server";
import { defaultLocale, localeCookie, localePath, readerLocale, splitLocale } from "#core/languages/locales";
import type { Database } from "#db/client";
import type { createCsrf } from "../http/security";
import { briefOfPath, canonicalVersionPath, isDeskPath, isListPath, negotiates, parseBriefPath, parseVersionPath, surrogateKeys } from "#core/publication/urls";
import { admits, pageAccess } from "#core/access/access";
import type { CachedPage } from "./page-cache";
import { answerFromCache } from "./answer-from-cache";
import { cacheControl, pageMemory } from "./cache-policy";
import { renderAhead, renderAndKeep, type Rendered } from "./render-and-keep";

/**
 * What names this build: a hash of the built server and of the client's manifest, which change with
 * any code or words a page is rendered from. Renderings kept in the database are those of one build
 * (server/web/pages/stored-brief.ts).
 */
export function buildId(root: string): string {
  const hash = createHash("sha256");
  const files = readdirSync(path.join(root, "dist/server"), { recursive: true, withFileTypes: true })
    .filter((entry) => entry.isFile())
    .map((entry) => path.join(entry.parentPath, entry.name))
    .sort();
  for (const file of [...files, path.join(root, "dist/assets.json")]) hash.update(path.relative(root, file)).update(readFileSync(file));
  return hash.digest("base64url").slice(0, 16);
}

/** One cookie's value from a Cookie header, read before cookie-parser runs (the fast path). */
function cookieValue(header: string, name: string): string | undefined {
  for (const pair of header.split(";")) {
    const at = pair.indexOf("=");
    if (at > 0 && pair.slice(0, at).trim() === name) return pair.slice(at + 1).trim();
  }
  return undefined;
}

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
}): Promise<{
  router: Router;
  fastAnswer: (req: IncomingMessage, res: ServerResponse) => Promise<boolean>;
  forget: (slug: string) => void;
  renderAhead: (slug: string) => Promise<void>;
}> {
  const { root, production, csrf, db, publicUrl, sessionCookie, onFastAnswer } = options;
  const router = Router();
  const { keptAt, forget, catalogue } = pageMemory(db);
  // In development the code changes under the server: nothing rendered is kept beyond memory.
  const build = production ? buildId(root) : null;
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

  function send(req: Request, res: Response, page: CachedPage | Rendered["page"], caching: keyof typeof cacheControl) {
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
    // Already compressed: the compression middleware leaves an answer with a Content-Encoding alone.
    if ("encodings" in page) return answerFromCache(req, res, page, {});
    if (caching !== "private" && page.status === 200 && req.fresh) return res.status(304).end();
    // The type is among Vike's headers: HTML for pages, JSON for client navigation's pageContext.
    res.status(page.status).send(page.html);
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
      const memory = keptAt(req.user, locale, path, query, parsed);
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
      const rendered = renderAndKeep({ db, csrf, catalogue, publicUrl, build }, req, res, path, memory);
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
    const memory = keptAt(undefined, locale, path, query, parsed);
    const cached = memory?.cache.get(memory.key);
    if (!memory || !cached?.ready || (await memory.state()) !== cached.state) return false;
    answerFromCache(req, res, cached, negotiated ? { ...cached.ready, vary: "Accept-Language, Cookie" } : cached.ready);
    onFastAnswer?.(req, res);
    return true;
  }

  return { router, fastAnswer, forget, renderAhead: (slug: string) => renderAhead({ db, csrf, catalogue, publicUrl, build }, slug) };
}
