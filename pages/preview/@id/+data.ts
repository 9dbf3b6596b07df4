import type { PageContextServer } from "vike/types";
import { previewPageData } from "../../../server/briefs/page-data";

export async function data(pageContext: PageContextServer) {
  return previewPageData(pageContext);
}
