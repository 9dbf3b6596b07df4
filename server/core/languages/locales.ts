// The languages of the product (PRODUCT.md) and how an address names one
// (docs/decisions/0023-locale-addresses.md): English is the default and its addresses carry no
// prefix; the others put theirs first (/es/briefs/…). Pure, shared by the server and the pages.
export const locales = ["en", "es", "fr", "ar"] as const;
export type Locale = (typeof locales)[number];
export const defaultLocale: Locale = "en";

/** The languages briefs are translated into (PRODUCT.md): a translator is assigned some of them. */
export const translationLocales = ["es", "fr", "ar"] as const;
export type TranslationLocale = (typeof translationLocales)[number];

export const isLocale = (value: unknown): value is Locale => locales.includes(value as Locale);
export const isTranslationLocale = (value: unknown): value is TranslationLocale => translationLocales.includes(value as TranslationLocale);

/** A requested locale, or the default when it is not one of ours. */
export const localeOf = (requested: unknown): Locale => (isLocale(requested) ? requested : defaultLocale);

/** Each language's own name, as its readers write it: the language switcher shows these. */
export const languageNames: Record<Locale, string> = { en: "English", es: "Español", fr: "Français", ar: "العربية" };

export const textDirection = (locale: Locale): "ltr" | "rtl" => (locale === "ar" ? "rtl" : "ltr");

/**
 * The Intl locale numbers and dates are formatted in. Arabic pages use Latin digits
 * (docs/decisions/0024-arabic-digits.md): the numbers then read the same in the chart, the table, the
 * downloads and a citation, as on many Arabic health pages.
 */
export const intlLocale = (locale: Locale): string => (locale === "ar" ? "ar-u-nu-latn" : locale);

/** A day as the language writes it in full ("4 December 2026"), in UTC: the date a file or card states. */
export const dayInWords = (locale: Locale, iso: string): string => new Intl.DateTimeFormat(intlLocale(locale), { dateStyle: "long", timeZone: "UTC" }).format(new Date(iso));

/** The locale a path names and the path without it: /es/briefs/x → es, /briefs/x; /briefs/x → en, /briefs/x. */
export function splitLocale(path: string): { locale: Locale; path: string } {
  const match = /^\/([a-z]{2})(?=\/|$)(.*)$/.exec(path);
  if (match && match[1] !== defaultLocale && isLocale(match[1])) return { locale: match[1], path: match[2] || "/" };
  return { locale: defaultLocale, path };
}

/** The address of an unprefixed path in a locale: /briefs/x in es → /es/briefs/x; / in fr → /fr. */
export function localePath(locale: Locale, path: string): string {
  if (locale === defaultLocale) return path;
  return path === "/" || path.startsWith("/?") ? `/${locale}${path.slice(1)}` : `/${locale}${path}`;
}

/**
 * The reader's language from an Accept-Language header (RFC 9110 §12.5.4): the first of ours by
 * quality, matching on the primary subtag (es-MX → es); null when none of ours is asked for.
 */
export function negotiateLocale(header: string | undefined): Locale | null {
  if (!header) return null;
  const ranges = header
    .split(",")
    .map((part, order) => {
      const [tag = "", ...params] = part.trim().split(";");
      const q = params.map((p) => /^\s*q=([0-9.]+)\s*$/.exec(p)).find(Boolean);
      return { tag: tag.trim().toLowerCase(), quality: q ? Number(q[1]) : 1, order };
    })
    .filter((range) => range.tag !== "" && range.quality > 0)
    .sort((a, b) => b.quality - a.quality || a.order - b.order);
  for (const range of ranges) {
    const primary = range.tag.split("-")[0];
    if (isLocale(primary)) return primary;
  }
  return null;
}

/** The cookie that keeps a reader's choice of language; the page router reads it on a first visit. */
export const localeCookie = "fairweigh.locale";

/** The language a reader chose on the site (the cookie), else the first of ours their browser asks for, else English. */
export function readerLocale(chosen: unknown, acceptLanguage: string | undefined): Locale {
  if (isLocale(chosen)) return chosen;
  return negotiateLocale(acceptLanguage) ?? defaultLocale;
}
