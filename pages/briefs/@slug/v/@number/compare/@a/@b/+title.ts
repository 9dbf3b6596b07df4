import type { PageContext } from "vike/types";
import type { ComparisonPageData } from "../../../../../../../../server/briefs/page-data";

export default (pageContext: PageContext) => {
  const { view } = pageContext.data as ComparisonPageData;
  return `${view.treatment.name} vs ${view.comparator.name} · ${view.title} (version ${view.version}) · Fairweigh`;
};
