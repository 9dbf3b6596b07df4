// Runs on the server only: the latest released version of each brief, and the topics.
import type { PageContextServer } from "vike/types";
import { topicsOf } from "#core/search";
import { listReleasedBriefs } from "#db/versions";

export async function data(pageContext: PageContextServer) {
  const briefs = await listReleasedBriefs(pageContext.db!, pageContext.locale);
  return { briefs: briefs.slice(0, 10), topics: topicsOf(briefs), caching: "revalidate" as const };
}

export type Data = Awaited<ReturnType<typeof data>>;
