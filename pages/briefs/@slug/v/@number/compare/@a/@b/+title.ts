import type { PageContext } from "vike/types";
import { createI18n } from "#components/i18n";
import type { ComparisonPageData } from "#web/pages/page-data";

export default (pageContext: PageContext) => {
  const { view } = pageContext.data as ComparisonPageData;
  return createI18n(pageContext.locale).t("compare.pageTitle", { treatment: view.treatment.name, comparator: view.comparator.name, title: view.title, version: view.version });
};
