import type { PageContext } from "vike/types";
import { createI18n } from "#components/i18n";

export default (pageContext: PageContext) => createI18n(pageContext.locale).t("preview.pageTitle");
