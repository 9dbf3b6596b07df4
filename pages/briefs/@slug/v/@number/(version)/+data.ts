// /briefs/:slug/v/:n — one version, for ever: what reporters cite.
import type { PageContextServer } from "vike/types";
import { briefPageData } from "../../../../../../server/briefs/page-data";

export async function data(pageContext: PageContextServer) {
  return briefPageData(pageContext, Number(pageContext.routeParams.number));
}
