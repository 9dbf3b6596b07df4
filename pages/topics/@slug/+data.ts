// /topics/:slug — the released briefs of one topic, the newest first page of them (the search page,
// filtered by the topic, pages through the rest).
import { render } from "vike/abort";
import type { PageContextServer } from "vike/types";
import { briefsOfTopic, currentBriefs, pageOf } from "#core/publication/search";

export async function data(pageContext: PageContextServer) {
  const { briefs: all, topics, state } = await pageContext.catalogue!(pageContext.locale);
  const topic = topics.find((t) => t.slug === pageContext.routeParams.slug);
  if (!topic) throw render(404);
  return { topic, briefs: pageOf(briefsOfTopic(currentBriefs(all), topic.slug), 1).items, caching: "revalidate" as const, cacheState: state };
}

export type Data = Awaited<ReturnType<typeof data>>;
