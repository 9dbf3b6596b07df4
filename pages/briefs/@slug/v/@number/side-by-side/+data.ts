// /briefs/:slug/v/:n/side-by-side?options=a,b[,c,d] — the reader's own side-by-side of 2 to 4 options.
import type { PageContextServer } from "vike/types";
import { sideBySidePageData } from "#web/pages/page-data";

export async function data(pageContext: PageContextServer) {
  return sideBySidePageData(pageContext);
}
