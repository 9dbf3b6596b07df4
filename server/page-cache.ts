// Rendered HTML of released versions, kept in memory: a released version never changes, so its page
// is rendered once per locale and day (the citation carries the access date) and served with an
// ETag. Only a withdrawal changes such a page, and each hit checks that one fact in the database.
import { createHash } from "node:crypto";

export interface CachedPage {
  html: string;
  etag: string;
  status: number;
  headers: [string, string][];
  /** The nonce the HTML's inline scripts carry: the response's policy must name the same one. */
  nonce: string;
  withdrawnAt: string | null;
}

/** Version pages and their comparisons: /briefs/:slug/v/:n and /briefs/:slug/v/:n/compare/:a/:b. */
const versionPath = /^\/briefs\/([^/]+)\/v\/([1-9]\d*)(?:\/compare\/[^/]+\/[^/]+)?\/?$/;

export function versionOfPath(path: string): { slug: string; number: number } | null {
  const match = versionPath.exec(path);
  return match ? { slug: decodeURIComponent(match[1]!), number: Number(match[2]) } : null;
}

export function etagOf(html: string): string {
  // Weak: compression changes the bytes on the wire, not the page.
  return `W/"${createHash("sha256").update(html).digest("base64url").slice(0, 27)}"`;
}

/** A bounded map, oldest entry out first. */
export class PageCache {
  private readonly entries = new Map<string, CachedPage>();

  constructor(private readonly capacity = 1000) {}

  static key(locale: string, path: string, day = new Date().toISOString().slice(0, 10)): string {
    return `${locale}|${day}|${path}`;
  }

  get(key: string): CachedPage | undefined {
    return this.entries.get(key);
  }

  set(key: string, page: CachedPage): void {
    this.entries.delete(key);
    this.entries.set(key, page);
    if (this.entries.size > this.capacity) this.entries.delete(this.entries.keys().next().value!);
  }

  delete(key: string): void {
    this.entries.delete(key);
  }
}
