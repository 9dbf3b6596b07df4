// Where the server puts a brief page's outcome sections, rendered already
// (components/brief/RenderedOutcomes.tsx, server/web/pages/stored-brief.ts): the page is rendered
// with a mark in their place, and the sections go in once it is done, so that neither React nor Vike
// copies and scans their 200 KB on every render.

/** The mark names the response's nonce, which no text of a page can know. */
export const outcomesMark = (nonce: string | null | undefined) => `<!--outcomes ${nonce ?? ""}-->`;

/** The rendered page with its outcome sections in place of their mark; the page as it is when it has none. */
export function fillOutcomes(page: string, pageContext: { outcomesHtml?: string; cspNonce?: string | null }): string {
  if (pageContext.outcomesHtml === undefined) return page;
  const mark = outcomesMark(pageContext.cspNonce);
  const at = page.indexOf(mark);
  return at < 0 ? page : page.slice(0, at) + pageContext.outcomesHtml + page.slice(at + mark.length);
}
