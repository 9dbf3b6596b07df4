// Rendered HTML of released versions, kept in memory: a released version never changes, so its page
// is rendered once per locale and day (the citation carries the access date) and served with an
// ETag. Only a newer version or a withdrawal changes such a page, and each hit checks those facts.
import { createHash } from "node:crypto";
import { brotliCompressSync, constants, gzipSync } from "node:zlib";

/** The page's bytes, compressed once when it is cached rather than on every answer. */
export interface Encodings {
  identity: Buffer;
  gzip: Buffer;
  br: Buffer;
}

/**
 * Compressed quickly: some 4 ms for the largest page (brotli 4, gzip 6). Brotli 9 saved 8% of its
 * bytes (21.7 against 23.7 KB) for 80 ms of a core per page, which on two cores slowed the next
 * pages' renders more than the bytes were worth (docs/decisions/0046-stored-brief-pages.md).
 */
export function encode(html: string): Encodings {
  const identity = Buffer.from(html);
  const br = brotliCompressSync(identity, { params: { [constants.BROTLI_PARAM_QUALITY]: 4, [constants.BROTLI_PARAM_SIZE_HINT]: identity.length } });
  return { identity, gzip: gzipSync(identity, { level: 6 }), br };
}

export interface CachedPage {
  /** The page's bytes only, not its text as well: a string beside them would double what a page holds, unbounded. */
  encodings: Encodings;
  etag: string;
  status: number;
  headers: [string, string][];
  /** The nonce of the response that rendered it: only that response's policy names it. */
  nonce: string;
  /** What may still change on the frozen page (newer versions, withdrawal): checked on every hit. */
  state: string;
  /** "version" for a released version's pages (cached by browsers for an hour), "revalidate" for a brief's latest address. */
  caching: "version" | "revalidate";
  /**
   * The headers of an answer from memory (security headers, type, caching, ETag), taken from the
   * first such answer the full way gave: later ones are written from here (render.ts, answer-from-cache.ts).
   */
  ready?: Record<string, string | number | string[]>;
}

export function etagOf(html: string): string {
  // Weak: compression changes the bytes on the wire, not the page.
  return `W/"${createHash("sha256").update(html).digest("base64url").slice(0, 27)}"`;
}

/**
 * A version's public state, remembered for two seconds: under load, one query per version and
 * two seconds instead of one per request. A change is announced by the database and forgotten at once
 * (server/db/notices.ts); were a notice lost, it would still show within the two seconds.
 */
export class StateMemo<T> {
  private readonly entries = new Map<string, { value: T; until: number }>();

  constructor(private readonly millis = 2000) {}

  async get(key: string, read: () => Promise<T>): Promise<T> {
    const now = Date.now();
    const hit = this.entries.get(key);
    if (hit && hit.until > now) return hit.value;
    const value = await read();
    this.entries.set(key, { value, until: now + this.millis });
    if (this.entries.size > 5000) this.entries.clear();
    return value;
  }

  /** Forgets every entry whose key starts with `prefix` (a brief's versions, when the database announces a change). */
  forget(prefix: string): void {
    for (const key of this.entries.keys()) if (key.startsWith(prefix)) this.entries.delete(key);
  }
}

/**
 * A map bounded by the bytes it holds (the page and its two compressions), oldest entry out first:
 * a flood of distinct addresses cannot grow the memory past the bound.
 */
export class PageCache {
  private readonly entries = new Map<string, CachedPage>();
  private bytes = 0;

  constructor(private readonly capacityBytes = 64 * 1024 * 1024) {}

  static key(locale: string, path: string, day = new Date().toISOString().slice(0, 10)): string {
    return `${locale}|${day}|${path}`;
  }

  private static sizeOf(page: CachedPage): number {
    return page.encodings.identity.length + page.encodings.gzip.length + page.encodings.br.length;
  }

  get(key: string): CachedPage | undefined {
    return this.entries.get(key);
  }

  set(key: string, page: CachedPage): void {
    this.delete(key);
    this.entries.set(key, page);
    this.bytes += PageCache.sizeOf(page);
    for (const [oldest, entry] of this.entries) {
      if (this.bytes <= this.capacityBytes || oldest === key) break;
      this.entries.delete(oldest);
      this.bytes -= PageCache.sizeOf(entry);
    }
  }

  delete(key: string): void {
    const entry = this.entries.get(key);
    if (!entry) return;
    this.entries.delete(key);
    this.bytes -= PageCache.sizeOf(entry);
  }

  /** The bytes held now, for tests and the benchmark. */
  get size(): number {
    return this.bytes;
  }
}
