// What of the public pages is kept in memory, under which key, and checked against which state; how
// long browsers and caches in front may keep each kind of page (docs/decisions/0010-public-pages-and-caching.md).
import type { Request } from "express";
import type { Locale } from "#core/languages/locales";
import { mayReadEmbargoed } from "#core/access/roles";
import { isListPath, parseBriefPath, type VersionPath } from "#core/publication/urls";
import type { Database } from "#db/client";
import { publicVersionState } from "#db/versions";
import { Catalogue, catalogueKey } from "./catalogue";
import { PageCache, StateMemo } from "./page-cache";

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

export const cacheControl = {
  version: "public, max-age=3600",
  revalidate: "public, no-cache",
  private: "private, no-store",
} as const;

/** Where a public page is kept in memory, and the state it is checked against on every hit. */
export interface Kept {
  cache: PageCache;
  key: string;
  state: () => Promise<string | null>;
}

/** The pages this process keeps, the states they are checked against, and the catalogue the lists read. */
export function pageMemory(db: Database) {
  const versions = new PageCache();
  // The list pages apart, in less memory: a flood of distinct searches cannot push out versions' pages.
  const lists = new PageCache(16 * 1024 * 1024);
  const states = new StateMemo<string | null>();
  const catalogue = new Catalogue(db, states);

  /**
   * Where a page is kept, if it is: a released version's pages and a brief's latest address (checked
   * against the brief's state), and the list pages with their query (against the catalogue's). Only a
   * reader who sees what the public sees shares them: the press and editors also see embargoed
   * versions in a page's history.
   */
  function keptAt(reader: Request["user"], locale: Locale, path: string, query: string, version: VersionPath | null): Kept | null {
    if (mayReadEmbargoed(reader?.roles ?? [])) return null;
    if (isListPath(path)) return { cache: lists, key: PageCache.key(locale, path + query), state: () => catalogue.state() };
    const key = PageCache.key(locale, path);
    if (version) {
      const { slug, version: number } = version.at;
      return { cache: versions, key, state: () => states.get(`${slug}/${number}`, () => publicVersionState(db, slug, number)) };
    }
    const latest = parseBriefPath(path);
    // The latest address shows the newest released version: the same state, read from version 1 on.
    if (latest) return { cache: versions, key, state: () => states.get(`${latest}/latest`, () => publicVersionState(db, latest, 1)) };
    return null;
  }

  /** What this process remembers of a brief's versions and of the catalogue, dropped when the database announces a change to them. */
  function forget(slug: string): void {
    states.forget(`${slug}/`);
    states.forget(catalogueKey);
  }

  return { keptAt, forget, catalogue };
}
