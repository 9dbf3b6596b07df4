import { useTranslation } from "react-i18next";
import { HealthCaution } from "./HealthCaution";
import { feedUrl, searchUrl } from "#core/urls";

export function SiteFooter() {
  const { t } = useTranslation();
  return (
    <footer data-site-footer className="mt-16 border-t border-rule bg-white/60">
      <div className="mx-auto max-w-5xl px-6 py-10">
        <HealthCaution />
        <nav aria-label={t("site.footerNav")} className="mt-8 flex flex-wrap gap-5 font-sans text-sm">
          <a href={searchUrl()}>{t("site.footer.briefs")}</a>
          <a href={feedUrl()}>{t("site.footer.feed")}</a>
        </nav>
        <p className="mt-4 font-sans text-xs text-muted">{t("site.name")}</p>
      </div>
    </footer>
  );
}
