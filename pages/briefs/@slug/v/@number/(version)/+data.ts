// /briefs/:slug/v/:n — one version, for ever: what reporters cite.
import type { PageContextServer } from "vike/types";
import { renderOutcomeSections } from "#components/brief/OutcomeSections";
import { versionNumberOf } from "#core/publication/urls";
import { briefPageData } from "#web/pages/page-data";

export async function data(pageContext: PageContextServer) {
  return briefPageData(pageContext, versionNumberOf(String(pageContext.routeParams.number)) ?? 0, renderOutcomeSections);
}
