// In the browser, a page's strings are fetched before it renders: the public ones for every page,
// the desk's too where the desk is (components/i18n.ts).
import type { PageContextClient } from "vike/types";
import { loadTranslations, namespacesFor } from "#components/i18n";

export default async function onBeforeRenderClient(pageContext: PageContextClient) {
  await loadTranslations(pageContext.locale, namespacesFor(pageContext.urlPathname));
}
