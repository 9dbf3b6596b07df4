import type { PageContext } from "vike/types";

/** /desk and everything below it; React Router takes over from there. */
export default function route(pageContext: PageContext): boolean {
  const path = pageContext.urlPathname;
  return path === "/desk" || path.startsWith("/desk/");
}
