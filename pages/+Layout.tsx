import "@fontsource/source-serif-4/latin-400.css";
import "@fontsource/source-serif-4/latin-600.css";
import "@fontsource/source-serif-4/latin-400-italic.css";
import "@fontsource/inter/latin-400.css";
import "@fontsource/inter/latin-600.css";
// Arabic script beside Source Serif 4: the browser fetches these only for Arabic letters (unicode-range).
import "@fontsource/noto-naskh-arabic/arabic-400.css";
import "@fontsource/noto-naskh-arabic/arabic-600.css";
import "./styles.css";
import { useMemo, type ReactNode } from "react";
import { I18nextProvider } from "react-i18next";
import { usePageContext } from "vike-react/usePageContext";
import { SiteFooter } from "#components/SiteFooter";
import { SiteHeader } from "#components/SiteHeader";
import { TermLinks } from "#components/Term";
import { createI18n, namespacesFor } from "#components/i18n";

export default function Layout({ children }: { children: ReactNode }) {
  const { locale, urlPathname } = usePageContext();
  // The desk and the preview need the desk's words too: one instance per locale and set of words.
  const desk = namespacesFor(urlPathname).includes("desk");
  const i18n = useMemo(() => createI18n(locale, desk ? ["public", "desk"] : ["public"]), [locale, desk]);
  return (
    <I18nextProvider i18n={i18n}>
      <div className="flex min-h-screen flex-col">
        <SiteHeader />
        <main id="content" className="mx-auto w-full max-w-3xl flex-1 px-6 py-12">
          <TermLinks key={urlPathname}>{children}</TermLinks>
        </main>
        <SiteFooter />
      </div>
    </I18nextProvider>
  );
}
