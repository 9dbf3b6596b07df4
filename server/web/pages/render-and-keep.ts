// Renders a page with Vike, and keeps in memory a page that says it may be kept (cache-policy.ts).
import { randomBytes } from "node:crypto";
import type { Request, Response } from "express";
import { renderPage } from "vike/server";
import { localePath, locales, type Locale } from "#core/languages/locales";
import { briefUrl, holdsForm } from "#core/publication/urls";
import type { Database } from "#db/client";
import { errorAnswer } from "../http/errors";
import type { createCsrf } from "../http/security";
import { siteUrl } from "../http/site-url";
import type { Catalogue } from "./catalogue";
import type { cacheControl, Kept, PageAnswer } from "./cache-policy";
import { encode, etagOf, type CachedPage } from "./page-cache";
import { fillOutcomes } from "#core/publication/outcomes-mark";

export interface RenderContext {
  db: Database;
  csrf: ReturnType<typeof createCsrf>;
  catalogue: Catalogue;
  publicUrl?: string;
  /** The build's name, which the renderings kept in the database carry; null in development. */
  build: string | null;
}

/** A rendered page: its HTML and headers, how it may be cached, and the entry kept in memory, if it was. */
export interface Rendered {
  page: { html: string; etag: string; status: number; headers: [string, string][]; nonce: string };
  caching: keyof typeof cacheControl;
  entry: CachedPage | null;
}

/** Vike's render of one address: what the request gives, and what every page's data may use beside it. */
function render(context: RenderContext, request: { urlOriginal: string; headersOriginal: Request["headers"]; cspNonce: string; person: Request["user"] | null; csrfToken?: string; siteUrl: string }) {
  const { db, catalogue, build } = context;
  return renderPage({ ...request, db, catalogue: (locale: Locale) => catalogue.briefs(locale), build });
}

export async function renderAndKeep(context: RenderContext, req: Request, res: Response, path: string, kept: Kept | null): Promise<Rendered | null> {
  const { csrf, publicUrl } = context;
  const csrfToken = holdsForm(path) ? csrf.issueToken(req, res) : undefined;
  const pageContext = await render(context, {
    urlOriginal: req.originalUrl,
    headersOriginal: req.headers,
    cspNonce: res.locals.cspNonce as string,
    person: req.user ?? null,
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
  const html = fillOutcomes(await httpResponse.getBody(), pageContext);
  // helmet has set the full policy with the same nonce; Vike's shorter one would replace it.
  const headers = httpResponse.headers.filter(([name]) => name.toLowerCase() !== "content-security-policy") as [string, string][];
  const nonce = res.locals.cspNonce as string;
  // The tag leaves the nonce out: every process renders the page with a nonce of its own, and a
  // reader (or a CDN) revalidating with one process's tag must get its 304 from any other.
  const page = { html, etag: etagOf(html.replaceAll(nonce, "")), status: answer.httpStatus ?? httpResponse.statusCode, headers, nonce };
  const caching = httpResponse.statusCode >= 400 && !answer.httpStatus ? "private" : (answer.caching ?? "private");
  if (kept && caching !== "private" && answer.cacheState !== undefined) {
    const entry: CachedPage = { etag: page.etag, status: page.status, headers, nonce: page.nonce, encodings: encode(html), state: answer.cacheState, caching };
    kept.cache.set(kept.key, entry);
    return { page, caching, entry };
  }
  return { page, caching, entry: null };
}

/**
 * Renders a brief's latest address in every language as an anonymous reader's first visit would, so
 * that the newest released version's stored parts are there before anyone asks (stored-brief.ts,
 * server/workflows/render-ahead.ts). The pages themselves are neither answered nor kept.
 */
export async function renderAhead(context: RenderContext, slug: string): Promise<void> {
  const { publicUrl, build } = context;
  if (!build) return;
  for (const locale of locales) {
    const pageContext = await render(context, {
      urlOriginal: localePath(locale, briefUrl(slug)),
      headersOriginal: {},
      cspNonce: randomBytes(16).toString("base64url"),
      person: null,
      // Without a request, the address readers use is the configured one; a reader at another formats the reference again.
      siteUrl: publicUrl?.replace(/\/$/, "") ?? "",
    });
    const failure = (pageContext as { errorWhileRendering?: unknown }).errorWhileRendering;
    if (failure) throw failure;
  }
}
