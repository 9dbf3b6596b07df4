// /briefs/:slug/v/:n/compare/:a/:b — one comparison of one version.
import type { PageContextServer } from "vike/types";
import { comparisonPageData } from "#web/pages/page-data";

export async function data(pageContext: PageContextServer) {
  return comparisonPageData(pageContext);
}
