// A generated sentence (a statement, a group label) in the reader's language, with each name it
// holds isolated in <bdi>: a Latin-script treatment name inside Arabic text keeps its punctuation
// where it belongs (Unicode bidirectional algorithm, UAX #9).
import { Fragment, type ReactNode } from "react";
import { useTranslation } from "react-i18next";
import type { TFunction } from "i18next";
import { localisedValues, type MessageValues as Values } from "#core/message";

export { messageText } from "#core/message";

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
