import { usePageContext } from "vike-react/usePageContext";
import { useData } from "vike-react/useData";
import { PageHead } from "#components/brief/PageHead";
import { createI18n } from "#components/i18n";
import { messageText } from "#components/Message";
import type { ComparisonPageData } from "#web/pages/page-data";

export default function Head() {
  // Outside the layout: the words of the page's locale, not of whichever i18next instance was made last.
  const { locale } = usePageContext();
  const { t } = createI18n(locale);
  const { view, path, siteUrl } = useData<ComparisonPageData>();
  const versus = t("brief.versus", { treatment: view.treatment.name, comparator: view.comparator.name });
  // What the share image shows: the comparison, the first outcome's statement and its certainty.
  const first = view.outcomes[0]!;
  const imageAlt = [versus, first.statement ? messageText(t, locale, first.statement) : null, first.certainty ? `${t("brief.certainty")}: ${t(`certainty.rating.${first.certainty}`)}` : null].filter(Boolean).join(". ");
  return (
    <PageHead
      facts={{
        title: `${versus}: ${view.title}`,
        siteUrl,
        path,
        version: view.version,
        releaseAt: view.releaseAt,
        condition: view.condition,
        description: t("compare.pageDescription", { treatment: view.treatment.name, comparator: view.comparator.name, population: view.population.toLowerCase() }),
        withdrawn: view.withdrawal !== null,
        imageAlt,
      }}
    />
  );
}
