import { useTranslation } from "react-i18next";

export function SiteHeader() {
  const { t } = useTranslation();
  return (
    <header data-site-header className="border-b border-rule">
      <a href="#content" className="sr-only focus:not-sr-only focus:absolute focus:p-2">
        {t("site.skipToContent")}
      </a>
      <div className="mx-auto flex max-w-5xl items-baseline justify-between gap-6 px-6 py-5">
        <a href="/" className="no-underline">
          <span className="text-2xl font-semibold tracking-tight text-ink">{t("site.name")}</span>
          <span className="ms-3 hidden font-sans text-sm text-muted sm:inline">{t("site.tagline")}</span>
        </a>
        <nav aria-label="Main" className="flex gap-5 font-sans text-sm">
          <a href="/desk">{t("site.nav.desk")}</a>
          <a href="/sign-in">{t("site.nav.signIn")}</a>
        </nav>
      </div>
    </header>
  );
}
