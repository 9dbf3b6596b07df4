import { useSyncExternalStore } from "react";
import { useTranslation } from "react-i18next";
import { signedInCookie } from "#core/access/access";
import { usePageContext } from "vike-react/usePageContext";
import { languageNames, locales } from "#core/languages/locales";
import { homeUrl, isDeskPath, languageChoiceUrl } from "#core/publication/urls";
import { useIntl } from "./i18n";

export function SiteHeader() {
  const { t } = useTranslation();
  const { href } = useIntl();
  const { urlPathname, urlParsed } = usePageContext();
  const here = urlPathname + (urlParsed.searchOriginal ?? "");
  const personal = isDeskPath(urlPathname) || urlPathname.startsWith("/preview/");
  const signedIn = useSignedIn();
  return (
    <header data-site-header className="border-b border-rule">
      <a href="#content" className="sr-only focus:not-sr-only focus:absolute focus:p-2">
        {t("site.skipToContent")}
      </a>
      <div className="mx-auto flex max-w-5xl flex-wrap items-baseline justify-between gap-x-6 gap-y-2 px-6 py-5">
        <a href={href(homeUrl())} className="no-underline">
          <span className="text-2xl font-semibold tracking-tight text-ink">{t("site.name")}</span>
          <span className="ms-3 hidden font-sans text-sm text-muted sm:inline">{t("site.tagline")}</span>
        </a>
        <nav aria-label={t("site.mainNav")} className="flex flex-wrap gap-5 font-sans text-sm">
          <a href="/desk">{t("site.nav.desk")}</a>
          {signedIn ? null : <a href={href("/sign-in")}>{t("site.nav.signIn")}</a>}
        </nav>
        {/* The desk speaks the language its person chose on their account screen instead. */}
        {personal ? null : <LanguageSwitcher here={here} />}
      </div>
    </header>
  );
}

/** Each language in its own name and script, for the page being read; the choice is kept for the next visit. */
function LanguageSwitcher({ here }: { here: string }) {
  const { t } = useTranslation();
  const { locale } = useIntl();
  return (
    <nav aria-label={t("site.languages")} className="flex w-full flex-wrap gap-4 font-sans text-sm sm:w-auto" data-language-switcher>
      {locales.map((other) =>
        other === locale ? (
          <span key={other} lang={other} aria-current="true" className="font-semibold">
            {languageNames[other]}
          </span>
        ) : (
          <a key={other} lang={other} hrefLang={other} href={languageChoiceUrl(other, here)}>
            {languageNames[other]}
          </a>
        ),
      )}
    </nav>
  );
}

/**
 * Whether this browser is signed in, from the readable cookie set at sign-in (server/core/access/access.ts):
 * known only once the page runs in the browser, since the page itself is the same for every reader.
 */
function useSignedIn(): boolean {
  return useSyncExternalStore(
    () => () => {},
    () => document.cookie.split("; ").includes(`${signedInCookie}=1`),
    () => false,
  );
}
