// /desk/people, for administrators: who has an account, with which roles; invitations by e-mail,
// deactivation, and the delivery state of the e-mails sent.
import type { FormEvent } from "react";
import { useTranslation } from "react-i18next";
import { roleNames, type Role } from "#core/access/roles";
import { translationLocales } from "#core/languages/locales";
import { Field, inputClass, SubmitRow } from "./forms";
import { useChangePerson, useInvite, useMessages, usePeople, useResendInvitation } from "../queries";

/** The roles and, for translators, the locales: checkboxes shared by the invitation and the change forms. */
function RoleAndLocaleChoices({ roles, locales }: { roles: readonly string[]; locales: readonly string[] }) {
  const { t } = useTranslation();
  return (
    <>
      <fieldset>
        <legend className="text-sm font-semibold">{t("desk.people.roles")}</legend>
        {roleNames.map((role) => (
          <label key={role} className="me-4 inline-flex items-center gap-1">
            <input type="checkbox" name="roles" value={role} defaultChecked={roles.includes(role)} /> {t(`desk.role.${role}`)}
          </label>
        ))}
      </fieldset>
      <fieldset className="mt-2">
        <legend className="text-sm font-semibold">{t("desk.people.translationLocales")}</legend>
        {translationLocales.map((locale) => (
          <label key={locale} className="me-4 inline-flex items-center gap-1">
            <input type="checkbox" name="translationLocales" value={locale} defaultChecked={locales.includes(locale)} /> {locale}
          </label>
        ))}
      </fieldset>
    </>
  );
}

export function PeopleScreen({ selfId }: { selfId: string }) {
  const { t } = useTranslation();
  const people = usePeople();
  const messages = useMessages();
  const invite = useInvite();
  const change = useChangePerson();
  const resend = useResendInvitation();

  function onInvite(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = event.currentTarget;
    const data = new FormData(form);
    invite.mutate(
      {
        email: String(data.get("email") ?? ""),
        displayName: String(data.get("displayName") ?? ""),
        roles: data.getAll("roles").map(String) as Role[],
        translationLocales: data.getAll("translationLocales").map(String) as (typeof translationLocales)[number][],
      },
      { onSuccess: () => form.reset() },
    );
  }

  return (
    <>
      <h1 className="text-4xl font-semibold tracking-tight">{t("desk.people.title")}</h1>
      {change.error ?? resend.error ? (
        <p role="alert" className="mt-4 text-accent">
          {t("desk.error", { message: (change.error ?? resend.error)!.message })}
        </p>
      ) : null}
      {/* On a phone the table scrolls sideways within its box; the page itself keeps its width. */}
      <div className="mt-6 overflow-x-auto">
        <table className="w-full font-sans text-sm" data-testid="people">
          <thead>
            <tr className="border-b border-rule text-start">
              <th className="py-2 pe-3 text-start">{t("desk.people.person")}</th>
              <th className="py-2 pe-3 text-start">{t("desk.people.roles")}</th>
              <th className="py-2 pe-3 text-start">{t("desk.people.state")}</th>
              <th className="py-2" />
            </tr>
          </thead>
          <tbody>
            {people.data?.map((person) => (
              <tr key={person.id} className="border-b border-rule align-top">
                <td className="py-2 pe-3">
                  {person.displayName}
                  <br />
                  <span className="text-muted">{person.email}</span>
                </td>
                <td className="py-2 pe-3">
                  {person.roles.map((role) => t(`desk.role.${role}`)).join(", ")}
                  {person.translationLocales.length > 0 ? ` (${person.translationLocales.join(", ")})` : ""}
                  <details className="mt-1">
                    <summary className="cursor-pointer underline">{t("desk.people.change", { name: person.displayName })}</summary>
                    <form
                      aria-label={t("desk.people.change", { name: person.displayName })}
                      className="mt-2 space-y-2"
                      onSubmit={(event) => {
                        event.preventDefault();
                        const data = new FormData(event.currentTarget);
                        change.mutate({ id: person.id, roles: data.getAll("roles").map(String) as Role[], translationLocales: data.getAll("translationLocales").map(String) as (typeof translationLocales)[number][] });
                      }}
                    >
                      <RoleAndLocaleChoices roles={person.roles} locales={person.translationLocales} />
                      <button type="submit" className="border border-ink px-3 py-1 font-semibold" disabled={change.isPending}>
                        {t("desk.people.save")}
                      </button>
                    </form>
                  </details>
                </td>
                <td className="py-2 pe-3">{!person.active ? t("desk.people.inactive") : person.passwordSet ? t("desk.people.active") : t("desk.people.invited")}</td>
                <td className="space-x-3 py-2 text-end">
                  {person.active && !person.passwordSet ? (
                    <button type="button" className="underline" onClick={() => resend.mutate(person.id)}>
                      {t("desk.people.resend")}
                    </button>
                  ) : null}
                  {person.id !== selfId ? (
                    <button type="button" className="underline" onClick={() => change.mutate({ id: person.id, active: !person.active })}>
                      {person.active ? t("desk.people.deactivate") : t("desk.people.reactivate")}
                    </button>
                  ) : null}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>

      <section className="mt-10 border-t border-rule pt-6">
        <h2 className="mb-4 text-xl font-semibold">{t("desk.people.invite")}</h2>
        <form aria-label={t("desk.people.invite")} onSubmit={onInvite} className="grid gap-4 font-sans sm:grid-cols-2">
          <Field label={t("desk.people.email")}>
            <input name="email" type="email" required className={inputClass} />
          </Field>
          <Field label={t("desk.people.displayName")}>
            <input name="displayName" required className={inputClass} />
          </Field>
          <div className="sm:col-span-2">
            <RoleAndLocaleChoices roles={[]} locales={[]} />
          </div>
          <SubmitRow label={t("desk.people.send")} busy={invite.isPending} error={invite.error?.message ?? null} />
          {invite.isSuccess ? (
            <p role="status" className="sm:col-span-2">
              {t("desk.people.sent")}
            </p>
          ) : null}
        </form>
      </section>

      <section className="mt-10 border-t border-rule pt-6">
        <h2 className="mb-4 text-xl font-semibold">{t("desk.people.messages")}</h2>
        <ul className="divide-y divide-rule font-sans text-sm" data-testid="messages">
          {messages.data?.map((message) => (
            <li key={message.id} className="py-2">
              {message.subject} → {message.recipient}: <strong>{t(`desk.people.message.${message.state}`)}</strong>
              {message.attempts > 1 || message.lastError ? ` (${t("desk.people.attempts", { count: message.attempts })}${message.lastError ? `: ${message.lastError}` : ""})` : ""}
            </li>
          ))}
        </ul>
      </section>
    </>
  );
}
