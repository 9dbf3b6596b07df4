// What the list pages show (the newest released version of each brief, in each language), kept in
// memory while the catalogue's state stays the same: a list page asks the database one small question
// every two seconds, or after a change notice, instead of reading every brief on every request.
import type { Locale } from "#core/languages/locales";
import { topicsOf, type ReleasedBrief, type Topic } from "#core/publication/search";
import type { Database } from "#db/client";
import { catalogueState, listReleasedBriefs } from "#db/versions";
import type { StateMemo } from "./page-cache";

export interface CatalogueView {
  briefs: ReleasedBrief[];
  /** Their topics, counted once per reading rather than on every page. */
  topics: Topic[];
  /** The state these briefs were read at: a page made from them is kept in memory against it. */
  state: string;
}

/** The key of the catalogue's state among the remembered states ("*" begins no brief's slug). */
export const catalogueKey = "*catalogue";

export class Catalogue {
  private readonly kept = new Map<Locale, { state: string; view: Promise<CatalogueView> }>();

  constructor(
    private readonly db: Database,
    private readonly states: StateMemo<string | null>,
  ) {}

  state(): Promise<string | null> {
    return this.states.get(catalogueKey, () => catalogueState(this.db));
  }

  /** The released briefs in a reader's language; readers who ask while they are read share one reading. */
  async briefs(locale: Locale): Promise<CatalogueView> {
    const state = (await this.state()) ?? "";
    const kept = this.kept.get(locale);
    if (kept?.state === state) return kept.view;
    const view = listReleasedBriefs(this.db, locale).then((briefs) => ({ briefs, topics: topicsOf(briefs), state }));
    this.kept.set(locale, { state, view });
    view.catch(() => this.kept.get(locale)?.view === view && this.kept.delete(locale));
    return view;
  }
}
