// Runs on the server only: the latest released version of each brief, and the topics.
import type { PageContextServer } from "vike/types";
import { currentBriefs } from "#core/publication/search";

export async function data(pageContext: PageContextServer) {
  const { briefs, topics, state } = await pageContext.catalogue!(pageContext.locale);
  return { briefs: currentBriefs(briefs).slice(0, 10), topics, caching: "revalidate" as const, cacheState: state };
}

export type Data = Awaited<ReturnType<typeof data>>;
