import type { PageContextServer } from "vike/types";
import { renderOutcomeSections } from "#components/brief/OutcomeSections";
import { previewPageData } from "#web/pages/page-data";

export async function data(pageContext: PageContextServer) {
  return previewPageData(pageContext, renderOutcomeSections);
}
