import { QueryClient, QueryClientProvider } from "@tanstack/react-query";
import { useEffect, useState } from "react";
import { useTranslation } from "react-i18next";
import { BrowserRouter, Route, Routes } from "react-router";
import { BriefScreen } from "./BriefScreen";
import { CertaintyScreen } from "./CertaintyScreen";
import { DeskHome } from "./DeskHome";
import { ResultsScreen } from "./ResultsScreen";
import { useSignedInPerson, useSignOut } from "./queries";

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
  const { t } = useTranslation();
  const session = useSignedInPerson();
  const signOut = useSignOut();
  const person = session.data;

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
    <Routes>
      <Route index element={<DeskHome person={person} onSignOut={() => signOut.mutate()} />} />
      <Route path="briefs/:briefId" element={<BriefScreen personId={person.id} canAnalyse={person.roles.includes("analyst")} canEdit={person.roles.includes("editor")} />} />
      <Route path="briefs/:briefId/outcomes/:outcomeId" element={<ResultsScreen />} />
      <Route path="briefs/:briefId/outcomes/:outcomeId/certainty" element={<CertaintyScreen canJudge={person.roles.includes("analyst")} />} />
      <Route path="*" element={<p>{t("desk.notFound")}</p>} />
    </Routes>
  );
}
