import { usePageContext } from "vike-react/usePageContext";
import { useData } from "vike-react/useData";
import { PageHead } from "#components/brief/PageHead";
import { createI18n } from "#components/i18n";
import type { BriefPageData } from "#web/pages/page-data";

export default function Head() {
  // Outside the layout: the words of the page's locale, not of whichever i18next instance was made last.
  const { t } = createI18n(usePageContext().locale);
  const { view, path, siteUrl } = useData<BriefPageData>();
  return (
    <PageHead
      facts={{
        title: view.title,
        siteUrl,
        path,
        version: view.version,
        releaseAt: view.releaseAt,
        condition: view.condition,
        description: t("brief.pageDescription", { population: view.population.toLowerCase(), condition: view.condition.toLowerCase() }),
        withdrawn: view.withdrawal !== null,
        imageAlt: `${view.title}. ${t("share.versionStatement", { condition: view.condition, population: view.population })}`,
      }}
    />
  );
}
