import type { PageContext } from "vike/types";
import { pageTitle } from "#components/i18n";

export default (pageContext: PageContext) => pageTitle(pageContext);
