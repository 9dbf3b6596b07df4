import { useTranslation } from "react-i18next";
import { HealthCaution } from "./HealthCaution";
import { dataUrl, feedUrl, glossaryUrl, searchUrl } from "#core/publication/urls";
import { useIntl } from "./i18n";

export function SiteFooter() {
  const { t } = useTranslation();
  const { href } = useIntl();
  return (
    <footer data-site-footer className="mt-16 border-t border-rule bg-white/60">
      <div className="mx-auto max-w-5xl px-6 py-10">
        <HealthCaution />
        <nav aria-label={t("site.footerNav")} className="mt-8 flex flex-wrap gap-5 font-sans text-sm">
          <a href={href(searchUrl())}>{t("site.footer.briefs")}</a>
          <a href={href(feedUrl())}>{t("site.footer.feed")}</a>
          <a href={href(glossaryUrl())}>{t("site.footer.glossary")}</a>
          <a href={href(dataUrl())}>{t("site.footer.data")}</a>
        </nav>
        <p className="mt-4 font-sans text-xs text-muted">{t("site.name")}</p>
      </div>
    </footer>
  );
}
