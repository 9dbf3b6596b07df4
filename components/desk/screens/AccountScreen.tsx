// /desk/account: one's own name, the time zone of one's e-mails, and one's password.
import type { FormEvent } from "react";
import { useTranslation } from "react-i18next";
import { may, type SignedInPerson } from "../api";
import { Field, formValues, inputClass, SubmitRow } from "./forms";
import { useTopics, useUpdateAccount } from "../queries";
import { languageNames, localeOf, locales } from "#core/languages/locales";

export function AccountScreen({ person }: { person: SignedInPerson }) {
  const { t } = useTranslation();
  const details = useUpdateAccount();
  const password = useUpdateAccount();
  const zones = ["UTC", ...Intl.supportedValuesOf("timeZone")];
  // Topic alerts are for the press: they say when an embargoed brief is ready for them.
  const press = may(person, "POST /api/press-enquiries");
  const topics = useTopics();

  function onDetails(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = event.currentTarget;
    const { displayName, timeZone, locale } = formValues(form);
    const alertTopics = press ? new FormData(form).getAll("alertTopics").map(String) : undefined;
    details.mutate({ displayName, timeZone, locale: localeOf(locale), alertTopics });
  }
  function onPassword(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = event.currentTarget;
    const { currentPassword, newPassword } = formValues(form);
    password.mutate({ currentPassword, newPassword }, { onSuccess: () => form.reset() });
  }

  return (
    <>
      <h1 className="text-4xl font-semibold tracking-tight">{t("desk.account.title")}</h1>
      <form aria-label={t("desk.account.title")} onSubmit={onDetails} className="mt-6 grid gap-4 font-sans sm:grid-cols-2">
        <Field label={t("desk.account.displayName")}>
          <input name="displayName" required defaultValue={person.displayName} className={inputClass} />
        </Field>
        <Field label={t("desk.account.timeZone")}>
          <select name="timeZone" defaultValue={person.timeZone} className={inputClass}>
            {zones.map((zone) => (
              <option key={zone}>{zone}</option>
            ))}
          </select>
        </Field>
        <Field label={t("desk.account.language")}>
          <select name="locale" defaultValue={person.locale} className={inputClass}>
            {locales.map((locale) => (
              <option key={locale} value={locale} lang={locale}>
                {languageNames[locale]}
              </option>
            ))}
          </select>
        </Field>
        {press ? (
          <fieldset className="sm:col-span-2">
            <legend className="text-sm font-semibold">{t("desk.account.alertTopics")}</legend>
            {topics.data?.map((topic) => (
              <label key={topic.slug} className="me-4 inline-flex items-center gap-1">
                <input type="checkbox" name="alertTopics" value={topic.slug} defaultChecked={person.alertTopics.includes(topic.slug)} /> {topic.name}
              </label>
            ))}
          </fieldset>
        ) : null}
        <SubmitRow label={t("desk.account.save")} busy={details.isPending} error={details.error?.message ?? null} />
        {details.isSuccess ? <p role="status">{t("desk.account.saved")}</p> : null}
      </form>
      <section className="mt-10 border-t border-rule pt-6">
        <h2 className="mb-4 text-xl font-semibold">{t("desk.account.password")}</h2>
        <form aria-label={t("desk.account.password")} onSubmit={onPassword} className="grid gap-4 font-sans sm:grid-cols-2">
          <Field label={t("desk.account.currentPassword")}>
            <input name="currentPassword" type="password" autoComplete="current-password" required className={inputClass} />
          </Field>
          <Field label={t("desk.account.newPassword")}>
            <input name="newPassword" type="password" autoComplete="new-password" minLength={12} required className={inputClass} />
          </Field>
          <SubmitRow label={t("desk.account.changePassword")} busy={password.isPending} error={password.error?.message ?? null} />
          {password.isSuccess ? <p role="status">{t("desk.account.passwordChanged")}</p> : null}
        </form>
      </section>
    </>
  );
}
