// The product's words for what the server writes itself (e-mails, the Atom feed), from the same
// locales/<locale>/*.json files as the pages; the pages load theirs through components/i18n.ts.
import i18next, { type TFunction } from "i18next";
import arMail from "#locales/ar/mail.json";
import arPublic from "#locales/ar/public.json";
import enMail from "#locales/en/mail.json";
import enPublic from "#locales/en/public.json";
import esMail from "#locales/es/mail.json";
import esPublic from "#locales/es/public.json";
import frMail from "#locales/fr/mail.json";
import frPublic from "#locales/fr/public.json";
import { defaultLocale, type Locale } from "./locales";

const resources = {
  en: { mail: enMail, public: enPublic },
  es: { mail: esMail, public: esPublic },
  fr: { mail: frMail, public: frPublic },
  ar: { mail: arMail, public: arPublic },
};

const translator = i18next.createInstance();
void translator.init({ resources, ns: ["mail", "public"], defaultNS: "public", fallbackLng: defaultLocale, initAsync: false, interpolation: { escapeValue: false } });

/** The words of one namespace in one locale. */
export const wordsOf = (locale: Locale, namespace: "mail" | "public"): TFunction => translator.getFixedT(locale, namespace);
