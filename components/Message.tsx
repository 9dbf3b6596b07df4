// A generated sentence (a statement, a group label) in the reader's language, with each name it
// holds isolated in <bdi>: a Latin-script treatment name inside Arabic text keeps its punctuation
// where it belongs (Unicode bidirectional algorithm, UAX #9).
import { Fragment, type ReactNode } from "react";
import { useTranslation } from "react-i18next";
import type { TFunction } from "i18next";

type Values = Record<string, string | number>;

const mark = (index: number) => `\u2063${index}\u2063`;
const marked = /\u2063(\d+)\u2063/;

/** The message with every text value in <bdi>; numbers pass through for plurals and are written by the locale's words. */
export function isolated(t: TFunction, key: string, values: Values): ReactNode {
  const names: string[] = [];
  const withMarks = Object.fromEntries(Object.entries(values).map(([name, value]) => [name, typeof value === "string" ? mark(names.push(value) - 1) : value]));
  const parts = String(t(key, withMarks)).split(marked);
  return parts.map((part, i) => (i % 2 === 1 ? <bdi key={i}>{names[Number(part)]}</bdi> : <Fragment key={i}>{part}</Fragment>));
}

export function Message({ message }: { message: { key: string; values: Values } }) {
  const { t } = useTranslation();
  return <>{isolated(t, message.key, localisedValues(t, message.values))}</>;
}

/**
 * Versions frozen before the counts were words of their own hold "12 fewer" as a value of the
 * per-1000 statement: the count and its side are read back and said in the reader's language.
 */
export function localisedValues(t: TFunction, values: Values): Values {
  return Object.fromEntries(
    Object.entries(values).map(([name, value]) => {
      const side = typeof value === "string" ? /^(\d+) (fewer|more|same)$/.exec(value) : null;
      return [name, side ? t(`statement.side.${side[2]}`, { count: Number(side[1]) }) : value];
    }),
  );
}

/** The same message as plain text (an aria-label, a title), its values said in the reader's language. */
export const messageText = (t: TFunction, message: { key: string; values: Values }) => String(t(message.key, localisedValues(t, message.values)));
