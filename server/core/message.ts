// A frozen message (a key of locales/<locale>/public.json and its facts) said in the reader's
// language: the same words for the pages (components/Message.tsx) and for what the server writes
// itself (the embedded card, the share image).
import type { TFunction } from "i18next";

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

/** The message as plain text (an aria-label, a title, a card), its values said in the reader's language. */
export const messageText = (t: TFunction, message: { key: string; values: MessageValues }) => String(t(message.key, localisedValues(t, message.values)));
