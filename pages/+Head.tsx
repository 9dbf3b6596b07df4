// On every public page: the same page in each language (hreflang, with English as x-default), so
// that search engines and readers find the one in theirs.
import { usePageContext } from "vike-react/usePageContext";
import { alternates } from "#core/publication/urls";

export default function Head() {
  const pageContext = usePageContext();
  const { urlPathname, urlParsed, siteUrl = "" } = pageContext;
  // Pages of one reader (the desk, a draft's preview, one-time links) have no other languages to offer.
  if (pageContext.routeParams?.token || /^\/(desk|preview)(\/|$)/.test(urlPathname)) return null;
  return (
    <>
      {alternates(urlPathname + (urlParsed.searchOriginal ?? "")).map(({ hreflang, path }) => (
        <link key={hreflang} rel="alternate" hrefLang={hreflang} href={`${siteUrl}${path}`} />
      ))}
    </>
  );
}
