import type { PageContext } from "vike/types";

export default (pageContext: PageContext) => pageContext.locale;
