import type { PageContextServer } from "vike/types";
import { textDirection } from "#core/languages/locales";

/** Arabic pages read right to left: the whole document mirrors (logical CSS properties throughout). */
export default (pageContext: PageContextServer) => ({ dir: textDirection(pageContext.locale) });
