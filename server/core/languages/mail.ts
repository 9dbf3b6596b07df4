// The e-mails the product sends, composed from locales/<locale>/mail.json: a plain-text part and an
// HTML part of the same words, in the recipient's language. Pure: the queue sends what this returns.
import type { TFunction } from "i18next";
import { localeOf, type Locale } from "./locales";
import { wordsOf } from "./words";
import type { Role } from "../access/roles";
import { changeSummary, type VersionChanges } from "../snapshot/changes";

export interface Message {
  kind: string;
  recipient: string;
  locale: Locale;
  subject: string;
  text: string;
  html: string;
  headers?: Record<string, string>;
}

const t = (locale: Locale): TFunction => wordsOf(locale, "mail");

const escapeHtml = (text: string) => text.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

/** What each message says: its paragraphs, one link, what follows the link, and any extra headers. */
interface Draft {
  subject: string;
  paragraphs: string[];
  action: { label: string; url: string };
  after?: string[];
  headers?: Record<string, string>;
  /** Why the reader receives it: their account (the default), or a subscription without one. */
  footer?: "footer" | "subscriptionFooter";
}

/**
 * A message in the recipient's language: the draft in words of that locale, as plain text and as
 * simple HTML of the same paragraphs and one link (no images, no tracking).
 */
function message(kind: string, recipient: string, requestedLocale: string | undefined, draft: (words: TFunction, locale: Locale) => Draft): Message {
  const locale = localeOf(requestedLocale);
  const words = t(locale);
  const { subject, paragraphs, action, after = [], headers, footer = "footer" } = draft(words, locale);
  const text = [...paragraphs, "", `${action.label}: ${action.url}`, "", ...after, "", "-- ", words("signature"), words(footer)].join("\n");
  const p = (line: string) => `<p>${escapeHtml(line)}</p>`;
  const html = `<!doctype html><html lang="${locale}"><head><meta charset="utf-8"><title>${escapeHtml(subject)}</title></head><body style="font-family: Georgia, serif; max-width: 36em">${paragraphs.map(p).join("")}<p><a href="${escapeHtml(action.url)}">${escapeHtml(action.label)}</a></p>${after.map(p).join("")}<hr><p style="color:#555">${escapeHtml(words("signature"))}<br>${escapeHtml(words(footer))}</p></body></html>`;
  return { kind, recipient, locale, ...(headers ? { headers } : {}), subject, text, html };
}

/** "Spanish and French", in the reader's language: the names of languages, never their codes. */
export function languageList(codes: string[], locale: Locale): string {
  const names = new Intl.DisplayNames([locale], { type: "language" });
  return new Intl.ListFormat(locale, { type: "conjunction" }).format(codes.map((code) => names.of(code) ?? code));
}

const utc = (date: Date) => date.toISOString().slice(0, 16).replace("T", " ");

export function invitationMessage(input: { recipient: string; name: string; inviter: string; roles: Role[]; link: string; expires: Date; locale?: string }): Message {
  return message("invitation", input.recipient, input.locale, (words) => ({
    subject: words("invitation.subject"),
    paragraphs: [words("invitation.greeting", { name: input.name }), words("invitation.body", { inviter: input.inviter, roles: input.roles.map((role) => words(`role.${role}`)).join(", ") })],
    action: { label: words("invitation.action"), url: input.link },
    after: [words("invitation.expiry", { expires: utc(input.expires) })],
  }));
}

export function passwordResetMessage(input: { recipient: string; name: string; link: string; expires: Date; locale?: string }): Message {
  return message("password-reset", input.recipient, input.locale, (words) => ({
    subject: words("passwordReset.subject"),
    paragraphs: [words("passwordReset.greeting", { name: input.name }), words("passwordReset.body")],
    action: { label: words("passwordReset.action"), url: input.link },
    after: [words("passwordReset.expiry", { expires: utc(input.expires) })],
  }));
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
  /** For a correction: what changed since the version before (server/core/snapshot/changes.ts). */
  changes?: VersionChanges | null;
}

/** A correction's computed summary, in the recipient's language; nothing for a first version. */
const changeParagraph = (version: { changes?: VersionChanges | null }, locale: Locale): string[] => (version.changes ? [changeSummary(wordsOf(locale, "public"), locale, version.changes)] : []);

/** The words an alert about a version fills in: who, which version, and its release time where the reader lives. */
function announcedValues(to: Recipient, version: Announced, locale: Locale) {
  const zone = to.timeZone ?? "UTC";
  return { name: to.displayName, title: version.title, version: version.number, time: localTime(version.releaseAt, locale, zone), zone, note: version.note };
}

/** To the press when a version is scheduled: the embargo's end in the reporter's time zone. */
export function pressAlertMessage(to: Recipient, version: Announced, link: string): Message {
  return message("press-alert", to.email, to.locale, (words, locale) => {
    const values = announcedValues(to, version, locale);
    return {
      subject: words("pressAlert.subject", values),
      paragraphs: [words("pressAlert.greeting", values), words("pressAlert.body", values), ...(version.note ? [words("pressAlert.note", values)] : []), ...changeParagraph(version, locale)],
      action: { label: words("pressAlert.action"), url: link },
    };
  });
}

/** To the press when a version becomes public. */
export function releaseAlertMessage(to: Recipient, version: Announced, link: string): Message {
  return message("release-alert", to.email, to.locale, (words, locale) => {
    const values = announcedValues(to, version, locale);
    return {
      subject: words("releaseAlert.subject", values),
      paragraphs: [words("releaseAlert.greeting", values), words("releaseAlert.body", values), ...changeParagraph(version, locale)],
      action: { label: words("releaseAlert.action"), url: link },
    };
  });
}

/**
 * To a translator when a version is scheduled or released: the languages it waits for, and in a
 * language whose earlier translation was carried over (`carried`), how many passages need an update.
 */
export function translationRequestMessage(to: Recipient & { translationLocales: string[] }, version: Announced, link: string, carried: Partial<Record<string, number>> = {}): Message {
  return message("translation-request", to.email, to.locale, (words, locale) => {
    const values = { ...announcedValues(to, version, locale), name: to.displayName };
    const fresh = to.translationLocales.filter((code) => carried[code] === undefined);
    const updates = to.translationLocales.filter((code) => (carried[code] ?? 0) > 0);
    const scheduled = version.releaseAt.getTime() > Date.now();
    const opening = words(scheduled ? "translationRequest.scheduled" : "translationRequest.released", values);
    return {
      subject: words("translationRequest.subject", values),
      paragraphs: [
        words("translationRequest.greeting", values),
        fresh.length > 0 ? `${opening} ${words("translationRequest.waiting", { locales: languageList(fresh, locale) })}` : opening,
        ...updates.map((code) => words("translationRequest.update", { language: languageList([code], locale), count: carried[code] })),
        ...changeParagraph(version, locale),
      ],
      action: { label: words("translationRequest.action"), url: link },
    };
  });
}

/** The double opt-in: no alert goes out before the reader confirms with this link. */
export function subscriptionConfirmMessage(input: { recipient: string; topic: string; link: string; expires: Date; locale?: string }): Message {
  return message("subscription-confirm", input.recipient, input.locale, (words) => ({
    subject: words("subscriptionConfirm.subject", { topic: input.topic }),
    paragraphs: [words("subscriptionConfirm.body", { topic: input.topic })],
    action: { label: words("subscriptionConfirm.action"), url: input.link },
    after: [words("subscriptionConfirm.expiry", { expires: utc(input.expires) })],
    footer: "subscriptionFooter",
  }));
}

/**
 * A new or corrected brief in a topic, to its subscribers, with a one-click unsubscribe (RFC 8058:
 * List-Unsubscribe names the address to POST to, List-Unsubscribe-Post says it takes one click).
 */
export function topicNoticeMessage(input: { recipient: string; topic: string; title: string; version: number; note: string | null; changes?: VersionChanges | null; link: string; unsubscribeUrl: string; locale?: string }): Message {
  const corrected = input.version > 1;
  return message(corrected ? "correction-notice" : "release-notice", input.recipient, input.locale, (words, locale) => {
    const values = { topic: input.topic, title: input.title, version: input.version, note: input.note ?? "" };
    return {
      subject: words(corrected ? "topicNotice.correctedSubject" : "topicNotice.newSubject", values),
      paragraphs: [words(corrected ? "topicNotice.correctedBody" : "topicNotice.newBody", values), ...changeParagraph(input, locale)],
      action: { label: words("topicNotice.action"), url: input.link },
      after: [words("topicNotice.unsubscribe", { link: input.unsubscribeUrl })],
      footer: "subscriptionFooter",
      headers: { "List-Unsubscribe": `<${input.unsubscribeUrl}>`, "List-Unsubscribe-Post": "List-Unsubscribe=One-Click" },
    };
  });
}

/** A reporter's question, to each editor; a reply goes to the reporter. */
export function pressEnquiryMessage(to: Recipient, enquiry: { name: string; email: string; subject: string; body: string; briefSlug: string | null }, link: string): Message {
  return message("press-enquiry", to.email, to.locale, (words) => ({
    subject: words("pressEnquiry.subject", { subject: enquiry.subject }),
    paragraphs: [words("pressEnquiry.body", { name: enquiry.name, email: enquiry.email, about: enquiry.briefSlug ? words("pressEnquiry.about", { slug: enquiry.briefSlug }) : "" }), enquiry.body, words("pressEnquiry.reply")],
    action: { label: words("pressEnquiry.action"), url: link },
    headers: { "Reply-To": enquiry.email },
  }));
}
