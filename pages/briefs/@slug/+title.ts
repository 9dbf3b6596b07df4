import type { PageContext } from "vike/types";
import type { BriefPageData } from "../../../server/briefs/page-data";

export default (pageContext: PageContext) => {
  const { view } = pageContext.data as BriefPageData;
  return `${view.title} (version ${view.version}) · Fairweigh`;
};
