// The head of a version's pages: canonical permalink, citation meta tags for reference managers,
// Open Graph and Twitter cards, and schema.org JSON-LD. Title and description come from +title and
// +description (vike-react also writes them as og:title and og:description).
import { feedUrl, oembedUrl } from "#core/publication/urls";
import { usePageContext } from "vike-react/usePageContext";
import { localePath } from "#core/languages/locales";
export interface HeadFacts {
  title: string;
  siteUrl: string;
  /** The permalink path of what is shown: the version, or one comparison in it. */
  path: string;
  version: number;
  releaseAt: string;
  condition: string;
  description: string;
  withdrawn: boolean;
  /** What the share image shows, in words (og:image:alt). */
  imageAlt: string;
}

const citationDate = (iso: string) => iso.slice(0, 10).replaceAll("-", "/");

export function PageHead({ facts }: { facts: HeadFacts }) {
  // The permalink in the language read: each language's page is its own canonical address (hreflang names the others).
  // A <Head> renders outside the page's layout, so the locale comes from the page context, not from i18next.
  const { locale } = usePageContext();
  const href = (path: string) => localePath(locale, path);
  const url = `${facts.siteUrl}${href(facts.path)}`;
  const jsonLd = {
    "@context": "https://schema.org",
    "@type": "Report",
    name: facts.title,
    headline: facts.title,
    description: facts.description,
    url,
    version: String(facts.version),
    datePublished: facts.releaseAt,
    inLanguage: locale,
    isAccessibleForFree: true,
    about: { "@type": "MedicalCondition", name: facts.condition },
    author: { "@type": "Organization", name: "Fairweigh" },
    publisher: { "@type": "Organization", name: "Fairweigh" },
    ...(facts.withdrawn ? { creativeWorkStatus: "Withdrawn" } : {}),
  };
  return (
    <>
      <link rel="canonical" href={url} />
      <link rel="alternate" type="application/atom+xml" title="Fairweigh" href={href(feedUrl())} />
      <meta name="citation_title" content={facts.title} />
      <meta name="citation_author" content="Fairweigh" />
      <meta name="citation_publisher" content="Fairweigh" />
      <meta name="citation_publication_date" content={citationDate(facts.releaseAt)} />
      <meta name="citation_online_date" content={citationDate(facts.releaseAt)} />
      <meta name="citation_technical_report_number" content={`Version ${facts.version}`} />
      <meta name="citation_abstract_html_url" content={url} />
      <meta name="citation_language" content={locale} />
      <meta property="og:type" content="article" />
      <meta property="og:url" content={url} />
      <meta property="og:site_name" content="Fairweigh" />
      <meta property="article:published_time" content={facts.releaseAt} />
      {/* A withdrawn brief offers neither its image nor its card to other sites (server/web/public/reach.ts). */}
      {facts.withdrawn ? null : (
        <>
          <meta property="og:image" content={`${url}/share.png`} />
          <meta property="og:image:type" content="image/png" />
          <meta property="og:image:width" content="1200" />
          <meta property="og:image:height" content="630" />
          <meta property="og:image:alt" content={facts.imageAlt} />
          <meta name="twitter:image" content={`${url}/share.png`} />
          <meta name="twitter:image:alt" content={facts.imageAlt} />
          <link rel="alternate" type="application/json+oembed" href={`${facts.siteUrl}${oembedUrl(url)}`} title={facts.title} />
        </>
      )}
      <meta name="twitter:card" content={facts.withdrawn ? "summary" : "summary_large_image"} />
      <meta name="twitter:title" content={facts.title} />
      <meta name="twitter:description" content={facts.description} />
      {/* JSON.stringify escapes quotes; "<" is escaped too so that no text can close the script element. */}
      <script type="application/ld+json" dangerouslySetInnerHTML={{ __html: JSON.stringify(jsonLd).replace(/</g, "\\u003c") }} />
    </>
  );
}
