import type { PageContext } from "vike/types";
import { createI18n } from "#components/i18n";
import type { BriefPageData } from "#web/pages/page-data";

export default (pageContext: PageContext) => {
  const { view } = pageContext.data as BriefPageData;
  return createI18n(pageContext.locale).t("brief.pageDescription", { population: view.population.toLowerCase(), condition: view.condition.toLowerCase() });
};
