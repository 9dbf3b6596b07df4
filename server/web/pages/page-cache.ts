// Rendered HTML of released versions, kept in memory: a released version never changes, so its page
// is rendered once per locale and day (the citation carries the access date) and served with an
// ETag. Only a newer version or a withdrawal changes such a page, and each hit checks those facts.
import { createHash } from "node:crypto";
import { promisify } from "node:util";
import { brotliCompress, brotliCompressSync, constants, gzip, gzipSync } from "node:zlib";

/**
 * How hard to compress a kept page: "thorough" for a version's pages, answered for as long as they
 * are kept (brotli 9 saves bytes on every answer, but takes some 100 ms on the 22-option brief's page:
 * it is done after the first answer, on libuv's threads, and replaces the quick bytes when done);
 * "quick" for the list pages, many of them one search's answer, kept with the quick bytes only.
 */
export type Effort = "thorough" | "quick";

/** The page's bytes, compressed once when it is cached rather than on every answer. */
export interface Encodings {
  identity: Buffer;
  gzip: Buffer;
  br: Buffer;
}

const brotliAt = (quality: number, size: number) => ({ params: { [constants.BROTLI_PARAM_QUALITY]: quality, [constants.BROTLI_PARAM_SIZE_HINT]: size } });

/** Compressed quickly (a few milliseconds for the largest page), so that a page's first answer is not kept waiting. */
export function encode(html: string): Encodings {
  const identity = Buffer.from(html);
  return { identity, gzip: gzipSync(identity, { level: 6 }), br: brotliCompressSync(identity, brotliAt(4, identity.length)) };
}

const gzipLater = promisify(gzip);
const brotliLater = promisify(brotliCompress);

/** Compressed as hard as is worth it, off the event loop. */
async function encodeThoroughly(identity: Buffer): Promise<Encodings> {
  const [gzipped, br] = await Promise.all([gzipLater(identity, { level: 9 }), brotliLater(identity, brotliAt(9, identity.length))]);
  return { identity, gzip: gzipped, br };
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

  /** `effort`: how hard to compress the pages it keeps (see Effort). */
  constructor(
    private readonly capacityBytes = 64 * 1024 * 1024,
    readonly effort: Effort = "thorough",
  ) {}

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
    this.evict(key);
    if (this.effort === "thorough") void this.refine(key, page);
  }

  private evict(kept: string): void {
    for (const [oldest, entry] of this.entries) {
      if (this.bytes <= this.capacityBytes || oldest === kept) break;
      this.entries.delete(oldest);
      this.bytes -= PageCache.sizeOf(entry);
    }
  }

  /** Replaces a kept page's quick bytes by thorough ones once they are ready, if the page is still kept. */
  private async refine(key: string, page: CachedPage): Promise<void> {
    const thorough = await encodeThoroughly(page.encodings.identity).catch(() => null);
    if (!thorough || this.entries.get(key) !== page) return;
    this.bytes += PageCache.sizeOf({ ...page, encodings: thorough }) - PageCache.sizeOf(page);
    page.encodings = thorough;
    this.evict(key);
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
