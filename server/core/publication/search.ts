// Topics over the released briefs; the words of a search are matched by PostgreSQL
// (server/db/versions.ts, searchReleasedSlugs).

export interface ReleasedBrief {
  slug: string;
  title: string;
  topic: string;
  topicSlug: string;
  condition: string;
  population: string;
  demo: boolean;
  withdrawn: boolean;
  version: number;
  /** When that version was released: the same name as the version's own release time everywhere. */
  releaseAt: string;
}

/** Results per page of the search page: its cost stays the same however large the catalogue. */
export const resultsPerPage = 25;

/** One page of a list (1-based, clamped to the pages there are). */
export function pageOf<T>(items: T[], requested: number): { items: T[]; page: number; pages: number } {
  const pages = Math.max(1, Math.ceil(items.length / resultsPerPage));
  const page = Math.min(Math.max(1, Number.isInteger(requested) ? requested : 1), pages);
  return { items: items.slice((page - 1) * resultsPerPage, page * resultsPerPage), page, pages };
}

/** The briefs of one topic (all of them without one). */
export function briefsOfTopic(briefs: ReleasedBrief[], topic: string | undefined): ReleasedBrief[] {
  return topic ? briefs.filter((brief) => brief.topicSlug === topic) : briefs;
}

/**
 * The briefs a list offers as current reading: a withdrawn brief leaves the home, topic and list
 * pages (its own page stays, marked); a search that names it still finds it, marked withdrawn.
 */
export const currentBriefs = (briefs: ReleasedBrief[]) => briefs.filter((brief) => !brief.withdrawn);

export interface Topic {
  slug: string;
  name: string;
  count: number;
}

/** The topics of the current briefs, each with how many it holds. */
export function topicsOf(briefs: ReleasedBrief[]): Topic[] {
  const topics = new Map<string, Topic>();
  for (const brief of currentBriefs(briefs)) {
    const topic = topics.get(brief.topicSlug) ?? { slug: brief.topicSlug, name: brief.topic, count: 0 };
    topic.count += 1;
    topics.set(brief.topicSlug, topic);
  }
  return [...topics.values()].sort((a, b) => a.name.localeCompare(b.name));
}
