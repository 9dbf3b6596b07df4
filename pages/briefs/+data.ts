// /briefs?q=…&topic=… — every released brief, searched by title, condition and treatment.
import type { PageContextServer } from "vike/types";
import { searchBriefs, topicsOf } from "#core/search";
import { listReleasedBriefs } from "#db/versions";

export async function data(pageContext: PageContextServer) {
  const all = await listReleasedBriefs(pageContext.db!, pageContext.locale);
  const q = (pageContext.urlParsed.search.q ?? "").slice(0, 200);
  const topic = pageContext.urlParsed.search.topic ?? "";
  return { briefs: searchBriefs(all, { q, topic }), topics: topicsOf(all), q, topic, caching: "revalidate" as const };
}

export type Data = Awaited<ReturnType<typeof data>>;
