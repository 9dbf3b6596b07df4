import type { PageContext } from "vike/types";
import type { BriefPageData } from "../../../server/briefs/page-data";

export default (pageContext: PageContext) => {
  const { view } = pageContext.data as BriefPageData;
  return `A network meta-analysis on ${view.condition.toLowerCase()} in ${view.population.toLowerCase()}: what the evidence supports, with its certainty.`;
};
