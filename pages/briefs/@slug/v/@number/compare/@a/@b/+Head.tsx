import { useTranslation } from "react-i18next";
import { useData } from "vike-react/useData";
import { PageHead } from "#components/brief/PageHead";
import type { ComparisonPageData } from "#web/pages/page-data";

export default function Head() {
  const { t } = useTranslation();
  const { view, path, siteUrl } = useData<ComparisonPageData>();
  return (
    <PageHead
      facts={{
        title: `${t("brief.versus", { treatment: view.treatment.name, comparator: view.comparator.name })}: ${view.title}`,
        siteUrl,
        path,
        version: view.version,
        releaseAt: view.releaseAt,
        condition: view.condition,
        description: t("compare.pageDescription", { treatment: view.treatment.name, comparator: view.comparator.name, population: view.population.toLowerCase() }),
        withdrawn: view.withdrawal !== null,
      }}
    />
  );
}
