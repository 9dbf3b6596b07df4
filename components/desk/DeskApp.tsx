import { QueryClient, QueryClientProvider } from "@tanstack/react-query";
import { useEffect, useState } from "react";
import { useTranslation } from "react-i18next";
import { BrowserRouter, Route, Routes } from "react-router";
import { DeskLink } from "./DeskLink";
import { BriefScreen } from "./screens/BriefScreen";
import { CertaintyScreen } from "./screens/CertaintyScreen";
import { DeskHome } from "./screens/DeskHome";
import { PeopleScreen } from "./screens/PeopleScreen";
import { AuditScreen } from "./screens/AuditScreen";
import { AccountScreen } from "./screens/AccountScreen";
import { DevMailScreen } from "./screens/DevMailScreen";
import { PressRoom } from "./screens/PressRoom";
import { ResultsScreen } from "./screens/ResultsScreen";
import { useSignedInPerson, useSignOut } from "./queries";
import { TranslationEditor, TranslationQueue } from "./screens/TranslationsScreen";
import { switchLanguage } from "../i18n";
import { may } from "./api";
import { localeOf, textDirection } from "#core/languages/locales";

export function DeskApp() {
  const [queryClient] = useState(() => new QueryClient({ defaultOptions: { queries: { retry: 1 } } }));
  return (
    <QueryClientProvider client={queryClient}>
      <BrowserRouter basename="/desk">
        <SignedInDesk />
      </BrowserRouter>
    </QueryClientProvider>
  );
}

/** Sends anonymous visitors to the sign-in page and back here afterwards. */
function SignedInDesk() {
  const { t, i18n } = useTranslation();
  const session = useSignedInPerson();
  const signOut = useSignOut();
  const person = session.data;

  // The desk speaks the signed-in person's language (chosen on their account screen).
  const deskLocale = localeOf(person?.locale);
  useEffect(() => {
    if (!person || i18n.language === deskLocale) return;
    void switchLanguage(i18n, deskLocale, ["public", "desk"]);
    document.documentElement.lang = deskLocale;
    document.documentElement.dir = textDirection(deskLocale);
  }, [person, deskLocale, i18n]);

  useEffect(() => {
    if (session.isSuccess && person === null) {
      const next = window.location.pathname + window.location.search;
      window.location.assign(`/sign-in?next=${encodeURIComponent(next)}`);
    }
  }, [session.isSuccess, person]);

  useEffect(() => {
    if (signOut.isSuccess) window.location.assign("/");
  }, [signOut.isSuccess]);

  if (session.isError) return <p role="alert">{t("desk.loadError")}</p>;
  if (!person) return <p aria-live="polite">{t("desk.loading")}</p>;
  return (
    <>
      {/* Who is signed in, on every screen of the desk, with the way out. */}
      <div className="mb-6 flex flex-wrap items-center justify-end gap-3 border-b border-rule pb-3 font-sans text-sm" data-testid="desk-person">
        <span>{t("desk.signedInShort", { name: person.displayName, roles: person.roles.map((role) => t(`desk.role.${role}`)).join(", ") })}</span>
        <DeskLink to="/account">{t("desk.account.link")}</DeskLink>
        <button type="button" onClick={() => signOut.mutate()} className="underline">
          {t("desk.signOut")}
        </button>
      </div>
      <DeskRoutes person={person} />
    </>
  );
}

function DeskRoutes({ person }: { person: NonNullable<ReturnType<typeof useSignedInPerson>["data"]> }) {
  const { t } = useTranslation();
  return (
    <Routes>
      <Route index element={<DeskHome person={person} />} />
      <Route path="briefs/:briefId" element={<BriefScreen personId={person.id} canAnalyse={may(person, "POST /api/briefs/:id/outcomes")} canEdit={may(person, "POST /api/briefs/:id/versions")} />} />
      <Route path="briefs/:briefId/outcomes/:outcomeId" element={<ResultsScreen />} />
      <Route path="briefs/:briefId/outcomes/:outcomeId/certainty" element={<CertaintyScreen canJudge={may(person, "PUT /api/outcomes/:id/certainty")} />} />
      {may(person, "GET /api/people") ? <Route path="people" element={<PeopleScreen selfId={person.id} />} /> : null}
      {may(person, "GET /api/audit") ? <Route path="audit" element={<AuditScreen />} /> : null}
      <Route path="account" element={<AccountScreen person={person} />} />
      <Route path="dev/mail" element={<DevMailScreen />} />
      {may(person, "GET /api/translations") ? <Route path="translations" element={<TranslationQueue />} /> : null}
      {may(person, "GET /api/translations/:versionId/:locale") ? (
        <Route path="translations/:versionId/:locale" element={<TranslationEditor canPublish={may(person, "POST /api/translations/:versionId/:locale/publish")} />} />
      ) : null}
      {may(person, "GET /api/press-room") ? <Route path="press" element={<PressRoom canAsk={may(person, "POST /api/press-enquiries")} />} /> : null}
      <Route path="*" element={<p>{t("desk.notFound")}</p>} />
    </Routes>
  );
}
