// A frozen message (a key of locales/<locale>/public.json and its facts) said in the reader's
// language: the same words for the pages (components/Message.tsx) and for what the server writes
// itself (the embedded card, the share image).
import type { TFunction } from "i18next";
import { joinParts } from "./grammar";
import type { Locale } from "./locales";

export type MessageValues = Record<string, string | number>;

/**
 * Versions frozen before the counts were words of their own hold "12 fewer" as a value of the
 * per-1000 statement: the count and its side are read back and said in the reader's language.
 */
export function localisedValues(t: TFunction, values: MessageValues): MessageValues {
  return Object.fromEntries(
    Object.entries(values).map(([name, value]) => {
      const side = typeof value === "string" ? /^(\d+) (fewer|more|same)$/.exec(value) : null;
      return [name, side ? t(`statement.side.${side[2]}`, { count: Number(side[1]) }) : value];
    }),
  );
}

const mark = (index: number) => `\u2063${index}\u2063`;
const marked = /\u2063(\d+)\u2063/;

/**
 * The message as parts, template text and the names it holds, each name kept apart (the pages isolate
 * it for bidirectional text), contracted and capitalised as the language wants (./grammar.ts).
 * `context` is the template's agreement, not a name.
 */
export function messageParts(t: TFunction, locale: Locale, message: { key: string; values: MessageValues }): { text: string; name: boolean }[] {
  const names: string[] = [];
  const values = localisedValues(t, message.values);
  const withMarks = Object.fromEntries(Object.entries(values).map(([name, value]) => [name, typeof value === "string" && name !== "context" ? mark(names.push(value) - 1) : value]));
  const parts = String(t(message.key, withMarks)).split(marked);
  return joinParts(locale, parts.map((part, i) => (i % 2 === 1 ? { text: names[Number(part)]!, name: true } : { text: part, name: false })));
}

/** The message as plain text (an aria-label, a title, a card). */
export const messageText = (t: TFunction, locale: Locale, message: { key: string; values: MessageValues }) =>
  messageParts(t, locale, message)
    .map((part) => part.text)
    .join("");
