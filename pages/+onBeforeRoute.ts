// The locale an address names (/es/briefs/… → es): routing then sees the address without it, so one
// pages/ folder serves every language (docs/decisions/0023-locale-addresses.md).
import type { PageContext } from "vike/types";
import { modifyUrl } from "vike/modifyUrl";
import { splitLocale } from "#core/languages/locales";

export default function onBeforeRoute(pageContext: PageContext) {
  const { locale, path } = splitLocale(pageContext.urlParsed.pathname);
  return { pageContext: { locale, urlLogical: modifyUrl(pageContext.urlParsed.href, { pathname: path }) } };
}
