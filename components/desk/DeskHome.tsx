import { useTranslation } from "react-i18next";
import type { SignedInPerson } from "./api";

export function DeskHome({ person, onSignOut }: { person: SignedInPerson; onSignOut: () => void }) {
  const { t } = useTranslation();
  return (
    <>
      <h1 className="text-4xl font-semibold tracking-tight">{t("desk.title")}</h1>
      <p className="mt-4 text-lg">{t("desk.signedInAs", { name: person.displayName, email: person.email })}</p>
      <h2 className="mt-10 font-sans text-sm font-semibold uppercase tracking-wide">{t("desk.roles")}</h2>
      <ul className="mt-3 flex flex-wrap gap-2 font-sans" data-testid="roles">
        {person.roles.map((role) => (
          <li key={role} className="border border-rule bg-white px-3 py-1">
            {t(`desk.role.${role}`)}
          </li>
        ))}
      </ul>
      <button type="button" onClick={onSignOut} className="mt-10 border border-accent px-4 py-2 font-sans text-accent">
        {t("desk.signOut")}
      </button>
    </>
  );
}
