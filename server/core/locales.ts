// The languages of the product (PRODUCT.md). English is the default and its addresses carry no prefix.
export const locales = ["en"] as const;
export type Locale = (typeof locales)[number];
export const defaultLocale: Locale = "en";

/** A requested locale, or the default when it is not one of ours. */
export const localeOf = (requested: unknown): Locale => locales.find((locale) => locale === requested) ?? defaultLocale;

/** The languages briefs are translated into (PRODUCT.md): a translator is assigned some of them. */
export const translationLocales = ["es", "fr", "ar"] as const;
