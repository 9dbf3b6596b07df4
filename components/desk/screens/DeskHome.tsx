import { useTranslation } from "react-i18next";
import { useNavigate } from "react-router";
import { DeskLink } from "../DeskLink";
import { may, type SignedInPerson } from "../api";
import { BriefList } from "./BriefList";
import { NewBriefForm } from "./NewBriefForm";
import { PressRoom } from "./PressRoom";
import { useBriefs, useCreateBrief } from "../queries";

export function DeskHome({ person }: { person: SignedInPerson }) {
  const { t } = useTranslation();
  const navigate = useNavigate();
  const staff = may(person, "GET /api/briefs");
  const briefs = useBriefs(staff);
  const createBrief = useCreateBrief();
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
      {staff ? (
        <section className="mt-10">
          <h2 className="mb-3 font-sans text-sm font-semibold uppercase tracking-wide">{t("desk.briefs")}</h2>
          {briefs.data ? <BriefList briefs={briefs.data} /> : <p aria-live="polite">{t("desk.loading")}</p>}
        </section>
      ) : null}
      {may(person, "GET /api/people") ? (
        <p className="mt-8 font-sans">
          <DeskLink to="/people">{t("desk.people.link")}</DeskLink> · <DeskLink to="/audit">{t("desk.audit.link")}</DeskLink>
        </p>
      ) : null}
      {may(person, "GET /api/translations") ? (
        <p className="mt-8 font-sans">
          <DeskLink to="/translations">{t("desk.translations.link")}</DeskLink>
        </p>
      ) : null}
      {may(person, "GET /api/press-room") ? <PressRoom canAsk={may(person, "POST /api/press-enquiries")} /> : null}
      {may(person, "POST /api/briefs") ? (
        <section className="mt-10 border-t border-rule pt-6">
          <h2 className="mb-4 text-xl font-semibold">{t("desk.newBrief")}</h2>
          <NewBriefForm
            busy={createBrief.isPending}
            error={createBrief.error?.message ?? null}
            onCreate={(fields) => createBrief.mutate(fields, { onSuccess: ({ id }) => navigate(`/briefs/${id}`) })}
          />
        </section>
      ) : null}
    </>
  );
}
