// "Cite this": the formatted reference with its access date, the permalink, and the files for
// reference managers. The reference itself is formatted on the server by the citation library.
import { useTranslation } from "react-i18next";
import { citationUrl, type ComparisonAddress, type VersionAddress } from "#core/publication/urls";
import { useIntl } from "../i18n";

export function CiteBlock({ heading, reference, accessed, permalink, citing }: { heading: string; reference: string; accessed: string; permalink: string; citing: VersionAddress | ComparisonAddress }) {
  const { t } = useTranslation();
  const intl = useIntl();
  const date = intl.date({ dateStyle: "long", timeZone: "UTC" }).format(new Date(accessed));
  return (
    <section aria-labelledby="cite-title" className="mt-16 border-t border-rule pt-6 print:break-inside-avoid" data-testid="cite">
      <h2 id="cite-title" className="text-xl font-semibold">{heading}</h2>
      {/* The reference holds the permalink, which must wrap anywhere rather than widen a phone's page. */}
      <p className="mt-3 bg-white p-4 [overflow-wrap:anywhere]" data-testid="citation">
        {reference} {t("cite.accessed", { date })}
      </p>
      <p className="mt-2 font-sans text-sm">
        {t("cite.permalink")} <a href={permalink} className="break-all">{permalink}</a>
      </p>
      <p className="mt-2 font-sans text-sm print:hidden">
        {t("cite.download")} <a href={intl.href(citationUrl(citing, "ris"))}>RIS</a> · <a href={intl.href(citationUrl(citing, "bib"))}>BibTeX</a> · <a href={intl.href(citationUrl(citing, "json"))}>CSL-JSON</a>
      </p>
    </section>
  );
}
