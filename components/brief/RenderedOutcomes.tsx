// Where a brief page's outcome sections go, rendered already (server/web/pages/stored-brief.ts).
import { usePageContext } from "vike-react/usePageContext";
import { outcomesMark } from "#core/publication/outcomes-mark";

/**
 * On the server, a mark the server replaces by the sections once the page is rendered (fillOutcomes).
 * With the data on a client-side navigation and in the preview, the HTML itself. Hydration keeps the
 * server's HTML: React does not compare what dangerouslySetInnerHTML holds, and the sections hold
 * nothing that runs (their folding is <details>), so the browser is not sent them a second time.
 */
export function RenderedOutcomes({ html }: { html?: string }) {
  const { outcomesHtml, cspNonce } = usePageContext();
  const server = outcomesHtml === undefined ? undefined : outcomesMark(cspNonce);
  return <div data-testid="outcomes" dangerouslySetInnerHTML={{ __html: server ?? html ?? "" }} suppressHydrationWarning />;
}
