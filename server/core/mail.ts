// The e-mails the product sends, composed from locales/<locale>/mail.json: a plain-text part and an
// HTML part of the same words, in the recipient's language. Pure: the queue sends what this returns.
import i18next, { type TFunction } from "i18next";
import en from "../../locales/en/mail.json";
import { localeOf, type Locale } from "./locales";
import type { Role } from "./roles";

export interface Message {
  kind: string;
  recipient: string;
  locale: Locale;
  subject: string;
  text: string;
  html: string;
  headers?: Record<string, string>;
}

const translator = i18next.createInstance();
void translator.init({ resources: { en: { mail: en } }, ns: ["mail"], defaultNS: "mail", fallbackLng: "en", initAsync: false, interpolation: { escapeValue: false } });

const t = (locale: Locale): TFunction => translator.getFixedT(locale, "mail");

const escapeHtml = (text: string) => text.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

/** Paragraphs and one link, as plain text and as simple HTML (no images, no tracking). */
function compose(locale: Locale, subject: string, paragraphs: string[], action: { label: string; url: string }, after: string[]) {
  const words = t(locale);
  const text = [...paragraphs, "", `${action.label}: ${action.url}`, "", ...after, "", "-- ", words("signature"), words("footer")].join("\n");
  const p = (line: string) => `<p>${escapeHtml(line)}</p>`;
  const html = `<!doctype html><html lang="${locale}"><head><meta charset="utf-8"><title>${escapeHtml(subject)}</title></head><body style="font-family: Georgia, serif; max-width: 36em">${paragraphs.map(p).join("")}<p><a href="${escapeHtml(action.url)}">${escapeHtml(action.label)}</a></p>${after.map(p).join("")}<hr><p style="color:#555">${escapeHtml(words("signature"))}<br>${escapeHtml(words("footer"))}</p></body></html>`;
  return { subject, text, html };
}

const utc = (date: Date) => date.toISOString().slice(0, 16).replace("T", " ");

export function invitationMessage(input: { recipient: string; name: string; inviter: string; roles: Role[]; link: string; expires: Date; locale?: string }): Message {
  const locale = localeOf(input.locale);
  const words = t(locale);
  const roles = input.roles.map((role) => words(`role.${role}`)).join(", ");
  return {
    kind: "invitation",
    recipient: input.recipient,
    locale,
    ...compose(locale, words("invitation.subject"), [words("invitation.greeting", { name: input.name }), words("invitation.body", { inviter: input.inviter, roles })], { label: words("invitation.action"), url: input.link }, [words("invitation.expiry", { expires: utc(input.expires) })]),
  };
}

export function passwordResetMessage(input: { recipient: string; name: string; link: string; expires: Date; locale?: string }): Message {
  const locale = localeOf(input.locale);
  const words = t(locale);
  return {
    kind: "password-reset",
    recipient: input.recipient,
    locale,
    ...compose(locale, words("passwordReset.subject"), [words("passwordReset.greeting", { name: input.name }), words("passwordReset.body")], { label: words("passwordReset.action"), url: input.link }, [words("passwordReset.expiry", { expires: utc(input.expires) })]),
  };
}

/** A time as the recipient reads it: their language, their time zone. */
function localTime(at: Date, locale: Locale, timeZone: string): string {
  return new Intl.DateTimeFormat(locale, { dateStyle: "long", timeStyle: "short", timeZone }).format(at);
}

interface Recipient {
  email: string;
  displayName: string;
  locale?: string;
  timeZone?: string;
}

interface Announced {
  title: string;
  number: number;
  releaseAt: Date;
  note: string | null;
}

/** To the press when a version is scheduled: the embargo's end in the reporter's time zone. */
export function pressAlertMessage(to: Recipient, version: Announced, link: string): Message {
  const locale = localeOf(to.locale);
  const words = t(locale);
  const zone = to.timeZone ?? "UTC";
  const values = { name: to.displayName, title: version.title, version: version.number, time: localTime(version.releaseAt, locale, zone), zone, note: version.note };
  return {
    kind: "press-alert",
    recipient: to.email,
    locale,
    ...compose(locale, words("pressAlert.subject", values), [words("pressAlert.greeting", values), words("pressAlert.body", values), ...(version.note ? [words("pressAlert.note", values)] : [])], { label: words("pressAlert.action"), url: link }, []),
  };
}

/** To the press when a version becomes public. */
export function releaseAlertMessage(to: Recipient, version: Announced, link: string): Message {
  const locale = localeOf(to.locale);
  const words = t(locale);
  const zone = to.timeZone ?? "UTC";
  const values = { name: to.displayName, title: version.title, version: version.number, time: localTime(version.releaseAt, locale, zone), zone };
  return {
    kind: "release-alert",
    recipient: to.email,
    locale,
    ...compose(locale, words("releaseAlert.subject", values), [words("releaseAlert.greeting", values), words("releaseAlert.body", values)], { label: words("releaseAlert.action"), url: link }, []),
  };
}

/** To a translator when a version is released: the locales they translate it into. */
export function translationRequestMessage(to: Recipient & { translationLocales: string[] }, version: Announced, link: string): Message {
  const locale = localeOf(to.locale);
  const words = t(locale);
  const values = { name: to.displayName, title: version.title, version: version.number, locales: to.translationLocales.join(", ") };
  return {
    kind: "translation-request",
    recipient: to.email,
    locale,
    ...compose(locale, words("translationRequest.subject", values), [words("translationRequest.greeting", values), words("translationRequest.body", values)], { label: words("translationRequest.action"), url: link }, []),
  };
}

/** The double opt-in: no alert goes out before the reader confirms with this link. */
export function subscriptionConfirmMessage(input: { recipient: string; topic: string; link: string; expires: Date; locale?: string }): Message {
  const locale = localeOf(input.locale);
  const words = t(locale);
  return {
    kind: "subscription-confirm",
    recipient: input.recipient,
    locale,
    ...compose(locale, words("subscriptionConfirm.subject", { topic: input.topic }), [words("subscriptionConfirm.body", { topic: input.topic })], { label: words("subscriptionConfirm.action"), url: input.link }, [words("subscriptionConfirm.expiry", { expires: utc(input.expires) })]),
  };
}

/**
 * A new or corrected brief in a topic, to its subscribers, with a one-click unsubscribe (RFC 8058:
 * List-Unsubscribe names the address to POST to, List-Unsubscribe-Post says it takes one click).
 */
export function topicNoticeMessage(input: { recipient: string; topic: string; title: string; version: number; note: string | null; link: string; unsubscribeUrl: string; locale?: string }): Message {
  const locale = localeOf(input.locale);
  const words = t(locale);
  const corrected = input.version > 1;
  const values = { topic: input.topic, title: input.title, version: input.version, note: input.note ?? "" };
  return {
    kind: corrected ? "correction-notice" : "release-notice",
    recipient: input.recipient,
    locale,
    headers: { "List-Unsubscribe": `<${input.unsubscribeUrl}>`, "List-Unsubscribe-Post": "List-Unsubscribe=One-Click" },
    ...compose(locale, words(corrected ? "topicNotice.correctedSubject" : "topicNotice.newSubject", values), [words(corrected ? "topicNotice.correctedBody" : "topicNotice.newBody", values)], { label: words("topicNotice.action"), url: input.link }, [words("topicNotice.unsubscribe", { link: input.unsubscribeUrl }), words("subscriptionFooter")]),
  };
}

/** A reporter's question, to each editor; a reply goes to the reporter. */
export function pressEnquiryMessage(to: Recipient, enquiry: { name: string; email: string; subject: string; body: string; briefSlug: string | null }, link: string): Message {
  const locale = localeOf(to.locale);
  const words = t(locale);
  const about = enquiry.briefSlug ? words("pressEnquiry.about", { slug: enquiry.briefSlug }) : "";
  return {
    kind: "press-enquiry",
    recipient: to.email,
    locale,
    headers: { "Reply-To": enquiry.email },
    ...compose(locale, words("pressEnquiry.subject", { subject: enquiry.subject }), [words("pressEnquiry.body", { name: enquiry.name, email: enquiry.email, about }), enquiry.body, words("pressEnquiry.reply")], { label: words("pressEnquiry.action"), url: link }, []),
  };
}
