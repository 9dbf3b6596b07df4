import type { PageContext } from "vike/types";
import { pageTitle } from "#components/i18n";
import type { Data } from "./+data";

export default (pageContext: PageContext) => pageTitle(pageContext, "titles.topic", { topic: (pageContext.data as Data).topic.name });
