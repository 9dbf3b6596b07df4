// i18next for the interface. Every user-facing string lives in locales/<locale>/<namespace>.json:
// "public" holds what public pages say, "desk" what only the signed-in desk says, so that a public
// page loads only the public strings. The server holds every file; the browser fetches the one
// locale a page is in before it renders (pages/+onBeforeRenderClient.ts).
import i18next, { type i18n, type Resource } from "i18next";
import { initReactI18next, useTranslation } from "react-i18next";
import type { PageContext } from "vike/types";
import { isDeskPath } from "#core/publication/urls";
import { formatNumber } from "#core/publication/effects";
import { defaultLocale, intlLocale, localeOf, localePath, locales, type Locale } from "#core/languages/locales";

export { defaultLocale, locales, textDirection, type Locale } from "#core/languages/locales";

export type Namespace = "public" | "desk";
type Strings = Record<string, unknown>;

// Each file is a chunk of its own: the browser fetches only the locale a page is in. (An eager glob
// on the server would pull every file into the browser's main chunk as well.)
const files = import.meta.glob<Strings>("../locales/*/{public,desk}.json", { import: "default" });
const fileOf = (locale: Locale, namespace: Namespace) => `../locales/${locale}/${namespace}.json`;

const loaded: Resource = {};

async function load(locale: Locale, namespace: Namespace): Promise<void> {
  if (loaded[locale]?.[namespace]) return;
  const file = files[fileOf(locale, namespace)];
  if (file) (loaded[locale] ??= {})[namespace] = await file();
}

/** Makes a locale's strings (and English, the fallback for a key missing in development) available to createI18n. */
export async function loadTranslations(locale: Locale, namespaces: Namespace[]): Promise<void> {
  await Promise.all([...new Set([locale, defaultLocale])].flatMap((l) => namespaces.map((ns) => load(l, ns))));
}

/**
 * Moves a browser's instance to another locale: fetches its strings and hands them to the instance
 * before changing its language. An instance holds only the strings it was made with (createI18n), so
 * changing its language alone would fall back to English for every string.
 */
export async function switchLanguage(instance: i18n, locale: Locale, namespaces: Namespace[]): Promise<void> {
  await loadTranslations(locale, namespaces);
  for (const namespace of namespaces) {
    const strings = loaded[locale]?.[namespace];
    if (strings) instance.addResourceBundle(locale, namespace, strings);
  }
  await instance.changeLanguage(locale);
}

// The server holds every language from the start, so that any page renders without waiting.
if (import.meta.env.SSR) await Promise.all(locales.map((locale) => loadTranslations(locale, ["public", "desk"])));

/** The namespaces a page needs: the desk and the draft preview speak the desk's words too. */
export const namespacesFor = (path: string): Namespace[] => (isDeskPath(path) || path.startsWith("/preview/") ? ["public", "desk"] : ["public"]);

/** A page's <title>: "Sign in · Fairweigh" in the page's locale; the site's name alone without a key. */
export function pageTitle(pageContext: PageContext, key?: string, values?: Record<string, unknown>): string {
  const { t } = createI18n(pageContext.locale);
  return key ? t("site.pageTitle", { page: t(key, values) }) : t("site.name");
}

/** The +title of a page whose title is one string: `export default titled("signIn.title")`. */
export const titled = (key: string) => (pageContext: PageContext) => pageTitle(pageContext, key);

/**
 * An i18next instance for one locale. On the server one per locale and set of namespaces, shared by
 * every render: its language never changes there, so concurrent requests in different locales never
 * mix. In the browser a new one each time (the desk changes its language after sign-in).
 */
export function createI18n(locale: Locale = defaultLocale, namespaces: Namespace[] = ["public", "desk"]): i18n {
  const key = `${locale}|${namespaces.join()}`;
  const shared = import.meta.env.SSR ? instances.get(key) : undefined;
  if (shared) return shared;
  const instance = i18next.createInstance();
  void instance.use(initReactI18next).init({
    lng: locale,
    fallbackLng: defaultLocale,
    // Only this locale and the fallback: the instance need not hold every language.
    resources: { [locale]: loaded[locale] ?? {}, [defaultLocale]: loaded[defaultLocale] ?? {} },
    ns: namespaces,
    defaultNS: "public",
    fallbackNS: namespaces.filter((ns) => ns !== "public"),
    initAsync: false,
    interpolation: { escapeValue: false },
  });
  if (import.meta.env.SSR) instances.set(key, instance);
  return instance;
}

const instances = new Map<string, i18n>();

/** The locale of the page being rendered. */
export function useLocale(): Locale {
  return localeOf(useTranslation().i18n.language);
}

/** Formats numbers and dates in the page's locale (Arabic with Latin digits: decision 0024). */
export function useIntl() {
  const locale = useLocale();
  const intl = intlLocale(locale);
  return {
    locale,
    /** An unprefixed address (from server/core/publication/urls.ts) in the page's locale. */
    href: (path: string) => localePath(locale, path),
    date: (options: Intl.DateTimeFormatOptions) => new Intl.DateTimeFormat(intl, options),
    /** A moment with its time zone named ("December 6, 2026 at 10:00 AM GMT+1"); the browser's zone when none is given. */
    moment: (at: string, timeZone?: string) =>
      new Intl.DateTimeFormat(intl, { year: "numeric", month: "long", day: "numeric", hour: "numeric", minute: "2-digit", timeZone, timeZoneName: "short" }).format(new Date(at)),
    /** A fixed count of decimals: "0.73" in en, "0,73" in es and fr. */
    number: (value: number, digits: number) => formatNumber(value, digits, locale),
    /** Significant digits, for p-values: "0.031". */
    precise: (value: number, digits: number) => new Intl.NumberFormat(intl, { minimumSignificantDigits: digits, maximumSignificantDigits: digits }).format(value),
  };
}
