// The product's words for what the server writes itself (e-mails, the Atom feed, API errors), from the same
// locales/<locale>/*.json files as the pages; the pages load theirs through components/i18n.ts.
import i18next, { type TFunction } from "i18next";
import arDesk from "#locales/ar/desk.json";
import arMail from "#locales/ar/mail.json";
import arPublic from "#locales/ar/public.json";
import enDesk from "#locales/en/desk.json";
import enMail from "#locales/en/mail.json";
import enPublic from "#locales/en/public.json";
import esDesk from "#locales/es/desk.json";
import esMail from "#locales/es/mail.json";
import esPublic from "#locales/es/public.json";
import frDesk from "#locales/fr/desk.json";
import frMail from "#locales/fr/mail.json";
import frPublic from "#locales/fr/public.json";
import { defaultLocale, type Locale } from "./locales";

const resources = {
  en: { mail: enMail, public: enPublic, desk: enDesk },
  es: { mail: esMail, public: esPublic, desk: esDesk },
  fr: { mail: frMail, public: frPublic, desk: frDesk },
  ar: { mail: arMail, public: arPublic, desk: arDesk },
};

const translator = i18next.createInstance();
void translator.init({ resources, ns: ["mail", "public", "desk"], defaultNS: "public", fallbackNS: "public", fallbackLng: defaultLocale, initAsync: false, interpolation: { escapeValue: false } });

/** The words of one namespace in one locale. */
export const wordsOf = (locale: Locale, namespace: "mail" | "public" | "desk"): TFunction => translator.getFixedT(locale, namespace);
