// i18next for the interface. Every user-facing string lives in locales/<locale>/common.json.
import i18next, { type i18n } from "i18next";
import { initReactI18next } from "react-i18next";
import { defaultLocale, type Locale } from "#core/locales";
import en from "../locales/en/common.json";

export { defaultLocale, locales, type Locale } from "#core/locales";

const resources = { en: { common: en } };

/** A separate instance per render, so that concurrent requests in different locales never mix. */
export function createI18n(locale: Locale = defaultLocale): i18n {
  const instance = i18next.createInstance();
  void instance.use(initReactI18next).init({
    lng: locale,
    fallbackLng: defaultLocale,
    resources,
    defaultNS: "common",
    initAsync: false,
    interpolation: { escapeValue: false },
  });
  return instance;
}

/** "rtl" for right-to-left locales, so the layout can mirror itself. */
export function textDirection(locale: Locale): "ltr" | "rtl" {
  return i18next.dir(locale);
}
