// /briefs/:slug — the latest version this reader may see; it revalidates, the /v/:n permalink does not change.
import type { PageContextServer } from "vike/types";
import { renderOutcomeSections } from "#components/brief/OutcomeSections";
import { briefPageData } from "#web/pages/page-data";

export async function data(pageContext: PageContextServer) {
  return briefPageData(pageContext, "latest", renderOutcomeSections);
}
