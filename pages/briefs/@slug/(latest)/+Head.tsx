import { useTranslation } from "react-i18next";
import { useData } from "vike-react/useData";
import { PageHead } from "#components/brief/PageHead";
import type { BriefPageData } from "#web/pages/page-data";

export default function Head() {
  const { t } = useTranslation();
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
      }}
    />
  );
}
