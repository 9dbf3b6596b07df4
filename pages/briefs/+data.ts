// /briefs?q=…&topic=… — every released brief, searched by title, condition and treatment names
// (PostgreSQL full-text search, server/db/versions.ts), in the reader's language and the original.
import type { PageContextServer } from "vike/types";
import { briefsOfTopic, topicsOf } from "#core/search";
import { listReleasedBriefs, searchReleasedSlugs } from "#db/versions";

export async function data(pageContext: PageContextServer) {
  const q = (pageContext.urlParsed.search.q ?? "").slice(0, 200);
  const topic = pageContext.urlParsed.search.topic ?? "";
  const [all, found] = await Promise.all([listReleasedBriefs(pageContext.db!, pageContext.locale), q.trim() ? searchReleasedSlugs(pageContext.db!, q, pageContext.locale) : null]);
  const briefs = briefsOfTopic(found ? all.filter((brief) => found.has(brief.slug)) : all, topic);
  return { briefs, topics: topicsOf(all), q, topic, caching: "revalidate" as const };
}

export type Data = Awaited<ReturnType<typeof data>>;
