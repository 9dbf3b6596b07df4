import { useTranslation } from "react-i18next";
import { glossaryTerms } from "#core/publication/glossary";

/** The words a brief uses, each under its own anchor (/glossary#certainty), in the order a reader meets them. */
export default function Page() {
  const { t } = useTranslation();
  return (
    <div className="max-w-2xl" data-testid="glossary">
      <h1 className="text-4xl font-semibold tracking-tight">{t("glossary.title")}</h1>
      <p className="mt-6 text-lg">{t("glossary.lead")}</p>
      <dl className="mt-10 space-y-8">
        {glossaryTerms.map((term) => (
          // The entry a link lands on is marked, so that a reader arriving from a page sees which word they followed.
          <div key={term} id={term} className="scroll-mt-6 target:border-s-4 target:border-accent target:ps-4">
            <dt className="text-2xl font-semibold">{t(`glossary.entries.${term}.term`)}</dt>
            <dd className="mt-2 text-lg leading-relaxed">{t(`glossary.entries.${term}.meaning`)}</dd>
          </div>
        ))}
      </dl>
      <p className="mt-12 font-sans text-sm text-muted">{t("glossary.sources")}</p>
    </div>
  );
}
