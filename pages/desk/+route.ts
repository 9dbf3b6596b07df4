import type { PageContext } from "vike/types";
import { isDeskPath } from "#core/publication/urls";

/** /desk and everything below it; React Router takes over from there. */
export default function route(pageContext: PageContext): boolean {
  return isDeskPath(pageContext.urlPathname);
}
