// A version's outcome sections: most of its page, and all of what a version's language and
// translation decide alone. The server renders them to HTML once per version and language and keeps
// them (server/web/pages/stored-brief.ts); the page puts that HTML in place (RenderedOutcomes.tsx).
// Used on the server only: the browser never renders them.
import { renderToString } from "react-dom/server";
import { I18nextProvider } from "react-i18next";
import type { OutcomeView } from "#core/publication/brief-page";
import type { Locale } from "#core/languages/locales";
import type { VersionAddress } from "#core/publication/urls";
import { createI18n } from "../i18n";
import { TermLinks } from "../Term";
import { OutcomeSection } from "./OutcomeSection";
import { useUntranslated, type TranslationState } from "./Notices";

function OutcomeSections({ outcomes, version, translation }: { outcomes: OutcomeView[]; version: VersionAddress; translation: TranslationState }) {
  const untranslated = useUntranslated(translation);
  return outcomes.map((outcome) => <OutcomeSection key={outcome.index} outcome={outcome} version={version} nameMark={untranslated.mark(`outcome:${outcome.index}`)} />);
}

/**
 * The outcome sections of a version in a language, as HTML: the same components as any page, with
 * glossary links counted from the first section (no term is linked before them on a brief page).
 */
export function renderOutcomeSections(outcomes: OutcomeView[], version: VersionAddress, locale: Locale, translation: TranslationState): string {
  return renderToString(
    <I18nextProvider i18n={createI18n(locale, ["public"])}>
      <TermLinks>
        <OutcomeSections outcomes={outcomes} version={version} translation={translation} />
      </TermLinks>
    </I18nextProvider>,
    { identifierPrefix: "outcomes-" },
  );
}
