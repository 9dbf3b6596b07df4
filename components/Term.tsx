// A word explained in the glossary, linked at its first use on a page and left as plain text after
// that, so that a page is not a sea of links. "First" is in reading order: React renders a page's
// tree in document order on the server and again when the browser hydrates it, so the first Term of
// each kind to render is the first in the page. Each Term is known by its useId (the same on both
// sides), so re-rendering a page links the same words again.
import { createContext, useContext, useId, useState, type ReactNode } from "react";
import { Trans } from "react-i18next";
import { glossaryUrl } from "#core/publication/urls";
import type { GlossaryTerm } from "#core/publication/glossary";
import { useIntl } from "./i18n";

const FirstUses = createContext<Map<GlossaryTerm, string> | null>(null);

/** Around one page: the terms linked so far. Keyed by the page's address, so a new page starts again. */
export function TermLinks({ children }: { children: ReactNode }) {
  const [firstUses] = useState(() => new Map<GlossaryTerm, string>());
  return <FirstUses.Provider value={firstUses}>{children}</FirstUses.Provider>;
}

export function Term({ term, children }: { term: GlossaryTerm; children?: ReactNode }) {
  const firstUses = useContext(FirstUses);
  const id = useId();
  const { href } = useIntl();
  // Registering during render is safe here: it is idempotent, and the same tree registers in the same order.
  if (firstUses && !firstUses.has(term)) firstUses.set(term, id);
  if (firstUses?.get(term) !== id) return <>{children}</>;
  return (
    <a href={href(glossaryUrl(term))} className="decoration-dotted underline-offset-2" data-term={term}>
      {children}
    </a>
  );
}

/**
 * A sentence whose terms are marked in the locale files ("the <ci>95% confidence interval</ci>"): each
 * tag becomes a Term. Values are escaped before the tags are read, so a name holding "<" stays text.
 */
export function WithTerms({ i18nKey, values, terms }: { i18nKey: string; values?: Record<string, unknown>; terms: Record<string, GlossaryTerm> }) {
  const components = Object.fromEntries(Object.entries(terms).map(([tag, term]) => [tag, <Term term={term} />]));
  return <Trans i18nKey={i18nKey} values={values} components={components} />;
}
