import "@fontsource/source-serif-4/latin-400.css";
import "@fontsource/source-serif-4/latin-600.css";
import "@fontsource/source-serif-4/latin-400-italic.css";
import "@fontsource/inter/latin-400.css";
import "@fontsource/inter/latin-600.css";
import "./styles.css";
import { useMemo, type ReactNode } from "react";
import { I18nextProvider } from "react-i18next";
import { SiteFooter } from "#components/SiteFooter";
import { SiteHeader } from "#components/SiteHeader";
import { createI18n, defaultLocale, textDirection } from "#components/i18n";

export default function Layout({ children }: { children: ReactNode }) {
  const i18n = useMemo(() => createI18n(defaultLocale), []);
  return (
    <I18nextProvider i18n={i18n}>
      <div dir={textDirection(defaultLocale)} className="flex min-h-screen flex-col">
        <SiteHeader />
        <main id="content" className="mx-auto w-full max-w-3xl flex-1 px-6 py-12">
          {children}
        </main>
        <SiteFooter />
      </div>
    </I18nextProvider>
  );
}
