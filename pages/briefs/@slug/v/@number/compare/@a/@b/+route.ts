// /briefs/:slug/v/:n/compare/:a/:b, parsed by the URL map rather than by folder names: a treatment
// label may hold "/" (sent as %2F), which a route string would read as two segments.
import type { PageContext } from "vike/types";
import { parseVersionPath } from "#core/publication/urls";

export default function route(pageContext: PageContext) {
  // The path as sent (still percent-encoded), without the suffix of a client navigation's
  // pageContext.json request: urlOriginal would carry that suffix and match nothing.
  const parsed = parseVersionPath(pageContext.urlParsed.pathnameOriginal);
  if (parsed?.kind !== "comparison") return false;
  const { slug, version, treatment, comparator } = parsed.at;
  return { routeParams: { slug, number: String(version), a: treatment, b: comparator } };
}
