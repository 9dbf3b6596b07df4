// A generated sentence (a statement, a group label) in the reader's language, with each name it
// holds isolated in <bdi>: a Latin-script treatment name inside Arabic text keeps its punctuation
// where it belongs (Unicode bidirectional algorithm, UAX #9).
import { Fragment } from "react";
import { useTranslation } from "react-i18next";
import { messageParts, type MessageValues as Values } from "#core/languages/message";
import { useLocale } from "./i18n";

export { messageText } from "#core/languages/message";

export function Message({ message }: { message: { key: string; values: Values } }) {
  const { t } = useTranslation();
  const locale = useLocale();
  return <>{messageParts(t, locale, message).map((part, i) => (part.name ? <bdi key={i}>{part.text}</bdi> : <Fragment key={i}>{part.text}</Fragment>))}</>;
}
