import type { Locale } from "#core/languages/locales";
import type { Database } from "#db/client";
import type { Person } from "#db/people";
import type { CatalogueView } from "#web/pages/catalogue";

declare global {
  namespace Vike {
    interface PageContext {
      /** The language the address names (pages/+onBeforeRoute.ts); the address without it is what routing sees. */
      locale: Locale;
      /** The signed-in person, on the server only. */
      person?: Person | null;
      /** The database, for +data hooks; on the server only, never passed to the client. */
      db?: Database;
      /** The released briefs in a language, kept in memory between changes; on the server only. */
      catalogue?: (locale: Locale) => Promise<CatalogueView>;
      /** For pages with a form that posts without JavaScript; see server/web/pages/render.ts. */
      csrfToken?: string;
      /** The address readers use, for permalinks and citations (no trailing slash). */
      siteUrl?: string;
      /** The build the server runs, which names the renderings it keeps (server/web/pages/stored-brief.ts); null in development. */
      build?: string | null;
      /** A brief page's outcome sections as HTML, set by its +data on the server only (components/brief/OutcomeSections.tsx). */
      outcomesHtml?: string;
    }
  }
}

export {};
