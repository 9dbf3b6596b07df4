// /briefs?q=…&topic=…&page=… — the released briefs, searched by title, condition and treatment
// names (PostgreSQL full-text search, server/db/versions.ts) in the reader's language and the
// original, a page of results at a time.
import type { PageContextServer } from "vike/types";
import { briefsOfTopic, currentBriefs, pageOf } from "#core/publication/search";
import { searchReleasedSlugs } from "#db/versions";

export async function data(pageContext: PageContextServer) {
  const q = (pageContext.urlParsed.search.q ?? "").slice(0, 200);
  const topic = pageContext.urlParsed.search.topic ?? "";
  const requested = Number(pageContext.urlParsed.search.page ?? "1");
  const [{ briefs: all, topics, state }, found] = await Promise.all([
    pageContext.catalogue!(pageContext.locale),
    q.trim() ? searchReleasedSlugs(pageContext.db!, q, pageContext.locale) : null,
  ]);
  const matching = briefsOfTopic(found ? all.filter((brief) => found.has(brief.slug)) : currentBriefs(all), topic);
  const { items, page, pages } = pageOf(matching, requested);
  return { briefs: items, total: matching.length, page, pages, topics, q, topic, caching: "revalidate" as const, cacheState: state };
}

export type Data = Awaited<ReturnType<typeof data>>;
