import type { PageContext } from "vike/types";
import { createI18n } from "#components/i18n";
import type { SideBySidePageData } from "#web/pages/page-data";

export default (pageContext: PageContext) => {
  const { view } = pageContext.data as SideBySidePageData;
  const t = createI18n(pageContext.locale).t;
  return t("sideBySide.pageTitle", { options: new Intl.ListFormat(pageContext.locale, { type: "conjunction" }).format(view.options.map((o) => o.name)), title: view.title, version: view.version });
};
