// The translation desk: the queue of versions per language, and one version's texts in one language
// beside their source, with a preview of the Markdown and, where a source changed since it was
// translated, what changed. Translators save and mark ready; editors also publish.
import { grammarChoices } from "#core/languages/grammar";
import { useState } from "react";
import { useTranslation as useWords } from "react-i18next";
import { useParams } from "react-router";
import { DeskLink } from "../DeskLink";
import { languageNames, textDirection, type Locale } from "#core/languages/locales";
import type { Translation, TranslationQueueEntry } from "#web/api/contract";
import type { TranslationLocale } from "#core/languages/locales";
import { ReadabilityAdvice } from "./ReadabilityAdvice";
import { buttonClass, inputClass } from "./forms";
import { previewMarkdown, useTranslation, useTranslationQueue, useTranslationStep } from "../queries";
import { ApiError } from "../api";
import { useIntl } from "../../i18n";

export function TranslationQueue() {
  const { t } = useWords();
  const intl = useIntl();
  const queue = useTranslationQueue();
  // A translation carried from an earlier version and partly published needs an update, not a start.
  const stateWords = (version: TranslationQueueEntry, locale: TranslationLocale) => {
    const waiting = version.updates[locale];
    const state = version.states[locale] ?? "missing";
    return waiting !== undefined && state === "draft" ? t("desk.translations.state.update", { count: waiting }) : t(`desk.translations.state.${state}`);
  };
  if (queue.isError) return <p role="alert">{t("desk.error", { message: queue.error.message })}</p>;
  if (!queue.data) return <p aria-live="polite">{t("desk.loading")}</p>;
  const { locales, versions } = queue.data;
  return (
    <section aria-labelledby="translations-title">
      <h2 id="translations-title" className="text-3xl font-semibold">{t("desk.translations.title")}</h2>
      <p className="mt-2 text-muted">{t("desk.translations.lead")}</p>
      {locales.length === 0 ? <p className="mt-6">{t("desk.translations.noLocales")}</p> : null}
      {locales.map((locale) => (
        <section key={locale} aria-labelledby={`queue-${locale}`} className="mt-8" data-testid={`queue-${locale}`}>
          <h3 id={`queue-${locale}`} className="text-xl font-semibold">{languageNames[locale]}</h3>
          {versions.length === 0 ? <p className="mt-2">{t("desk.translations.empty")}</p> : null}
          <ul className="mt-3 divide-y divide-rule border-y border-rule font-sans text-sm">
            {versions.map((version) => (
              <li key={version.versionId} className="flex flex-wrap items-baseline justify-between gap-3 py-3">
                <span>
                  <DeskLink to={`/translations/${version.versionId}/${locale}`}>{t("desk.translations.versionOf", { title: version.title, version: version.number })}</DeskLink>
                  {version.embargoed ? (
                    <span className="mt-1 block text-accent" data-testid="translation-embargo">
                      {t("desk.translations.scheduled", { date: intl.moment(version.releaseAt) })}
                    </span>
                  ) : null}
                </span>
                <span data-testid="translation-state">{stateWords(version, locale)}</span>
              </li>
            ))}
          </ul>
        </section>
      ))}
    </section>
  );
}

export function TranslationEditor({ canPublish }: { canPublish: boolean }) {
  const { t } = useWords();
  const { versionId = "", locale = "" } = useParams();
  const translation = useTranslation(versionId, locale);
  if (translation.isError) {
    // Not one's language, or no such version: say so plainly, with the way back; anything else is a failure.
    const refused = translation.error instanceof ApiError && (translation.error.status === 403 || translation.error.status === 404);
    return (
      <section>
        <p role="alert">{refused ? translation.error.message : t("desk.error", { message: translation.error.message })}</p>
        <p className="mt-3 font-sans text-sm">
          <DeskLink to="/translations">{t("desk.translations.back")}</DeskLink>
        </p>
      </section>
    );
  }
  if (!translation.data) return <p aria-live="polite">{t("desk.loading")}</p>;
  // A new key per saved state, so the form's fields start from what was saved.
  return <EditorForm key={translation.data.fields.map((f) => f.target).join("\u0000")} translation={translation.data} canPublish={canPublish} />;
}

function EditorForm({ translation, canPublish }: { translation: Translation; canPublish: boolean }) {
  const { t } = useWords();
  const intl = useIntl();
  const step = useTranslationStep(translation.versionId, translation.locale);
  const [previews, setPreviews] = useState<Record<string, string>>({});
  // What the translator has typed so far, for the plain-language check (the fields themselves stay uncontrolled).
  const [drafts, setDrafts] = useState<Record<string, string>>({});
  const locale = translation.locale as Locale;
  // The fields a correction left to translate again: their source changed, or they are new and empty.
  const open = translation.state === "published" ? [] : translation.fields.filter((field) => field.stale || (!field.optional && field.target.trim() === "" && translation.publishedAt !== null));
  // A correction's translation opens on what needs an update; hidden fields keep their values in the form.
  const [onlyOpen, setOnlyOpen] = useState(open.length > 0);
  const fieldLabel = (name: string) => {
    const [kind, which] = name.split(":");
    // A treatment's phrase and grammar are named after the treatment itself.
    const about = kind === "treatmentPhrase" || kind === "treatmentGrammar" ? `treatment:${which}` : name;
    return which === undefined ? t(`desk.translations.field.${kind}`) : t(`desk.translations.field.${kind}`, { name: translation.fields.find((f) => f.name === about)?.text ?? which });
  };
  const grammarWords = (choice: string) => t(`desk.translations.grammar.${choice.replace(/ (\w)/, (_, c: string) => c.toUpperCase())}`);
  const save = (form: HTMLFormElement) => {
    const data = new FormData(form);
    const fields = Object.fromEntries(translation.fields.map((field) => [field.name, String(data.get(field.name) ?? "")]));
    step.mutate({ save: { fields } });
  };
  return (
    <section aria-labelledby="translation-title">
      <p className="font-sans text-sm">
        <DeskLink to="/translations">{t("desk.translations.back")}</DeskLink>
      </p>
      <h2 id="translation-title" className="mt-2 text-3xl font-semibold">
        {t("desk.translations.editing", { title: translation.title, version: translation.number, language: languageNames[locale] })}
      </h2>
      <p className="mt-2 font-sans text-sm" data-testid="translation-status">
        {t(`desk.translations.state.${translation.state}`)}
        {translation.publishedAt ? ` · ${t("desk.translations.publishedAt", { date: intl.date({ dateStyle: "long", timeStyle: "short" }).format(new Date(translation.publishedAt)) })}` : null}
      </p>
      {translation.carriedFrom ? <p className="mt-2 border-s-4 border-accent ps-3 font-sans text-sm">{t("desk.translations.carried")}</p> : null}
      {open.length > 0 ? (
        <div role="note" className="mt-4 border-s-4 border-accent bg-white p-4 font-sans text-sm" data-testid="needs-update">
          <p className="font-semibold">{t("desk.translations.needsUpdate", { count: open.length })}</p>
          <ul className="mt-2 list-disc ps-6">
            {open.map((field) => (
              <li key={field.name}>
                <a href={`#field-${field.name}`}>{fieldLabel(field.name)}</a>
              </li>
            ))}
          </ul>
          <button type="button" className="mt-2 underline" onClick={() => setOnlyOpen(!onlyOpen)}>
            {onlyOpen ? t("desk.translations.showAll") : t("desk.translations.showOpen")}
          </button>
        </div>
      ) : null}
      <form
        className="mt-6 space-y-8"
        onSubmit={(event) => {
          event.preventDefault();
          save(event.currentTarget);
        }}
      >
        {translation.fields.map((field) => (
          <fieldset key={field.name} id={`field-${field.name}`} hidden={onlyOpen && !open.includes(field)} className="grid gap-4 border-t border-rule pt-4 md:grid-cols-2" data-testid={`field-${field.name}`}>
            <legend className="font-sans text-sm font-semibold">{fieldLabel(field.name)}</legend>
            <div>
              <p className="font-sans text-xs uppercase tracking-wide text-muted">{t("desk.translations.source")}</p>
              {field.html ? (
                <div lang="en" className="prose-brief mt-1" dangerouslySetInnerHTML={{ __html: field.html }} />
              ) : (
                <p lang="en" className="mt-1">{field.kind === "grammar" ? t(`desk.number.${field.text}`) : field.text}</p>
              )}
              {field.stale && field.diff ? (
                <div role="note" className="mt-3 border-s-4 border-accent ps-3 font-sans text-sm" data-testid="source-changed">
                  <p className="font-semibold">{t("desk.translations.sourceChanged")}</p>
                  <p lang="en" className="mt-1">
                    {field.diff.map((part, i) =>
                      part.change === "added" ? <ins key={i} className="bg-white font-semibold">{part.text}</ins> : part.change === "removed" ? <del key={i} className="text-muted">{part.text}</del> : <span key={i}>{part.text}</span>,
                    )}
                  </p>
                </div>
              ) : null}
            </div>
            <div>
              <label className="block">
                <span className="font-sans text-xs uppercase tracking-wide text-muted">{t("desk.translations.target", { language: languageNames[locale] })}</span>
                {field.kind === "markdown" ? (
                  <textarea
                    name={field.name}
                    lang={locale}
                    dir={textDirection(locale)}
                    defaultValue={field.target}
                    rows={8}
                    className={`${inputClass} mt-1`}
                    onInput={(event) => {
                      const value = event.currentTarget.value;
                      setDrafts((all) => ({ ...all, [field.name]: value }));
                    }}
                  />
                ) : field.kind === "grammar" ? (
                  <select name={field.name} defaultValue={field.target} className={`${inputClass} mt-1`}>
                    <option value="">{t("desk.translations.grammar.default")}</option>
                    {grammarChoices.map((choice) => (
                      <option key={choice} value={choice}>{grammarWords(choice)}</option>
                    ))}
                  </select>
                ) : (
                  <input name={field.name} lang={locale} dir={textDirection(locale)} defaultValue={field.target} className={`${inputClass} mt-1`} />
                )}
              </label>
              {field.kind === "markdown" ? (
                <>
                  <ReadabilityAdvice text={drafts[field.name] ?? field.target} locale={locale} />
                  <button
                    type="button"
                    className="mt-2 font-sans text-sm underline"
                    onClick={(event) => {
                      const area = event.currentTarget.form?.elements.namedItem(field.name) as HTMLTextAreaElement | null;
                      void previewMarkdown(area?.value ?? "").then((html) => setPreviews((all) => ({ ...all, [field.name]: html })));
                    }}
                  >
                    {t("desk.translations.preview")}
                  </button>
                  {previews[field.name] !== undefined ? (
                    <div lang={locale} dir={textDirection(locale)} className="prose-brief mt-2 bg-white p-3" data-testid="translation-preview" dangerouslySetInnerHTML={{ __html: previews[field.name]! }} />
                  ) : null}
                </>
              ) : null}
            </div>
          </fieldset>
        ))}
        <div className="flex flex-wrap gap-4 font-sans">
          <button type="submit" disabled={step.isPending} className={buttonClass}>
            {step.isPending ? t("desk.saving") : t("desk.translations.save")}
          </button>
          <button type="button" disabled={step.isPending || translation.state !== "draft" || translation.carriedFrom} className={buttonClass} onClick={() => step.mutate({ ready: true })}>
            {t("desk.translations.markReady")}
          </button>
          {canPublish ? (
            <button type="button" disabled={step.isPending || translation.state !== "ready"} className={buttonClass} onClick={() => step.mutate({ publish: true })}>
              {t("desk.translations.publish")}
            </button>
          ) : null}
        </div>
        {step.error ? (
          <p role="alert" className="font-sans text-accent">
            {t("desk.error", { message: step.error.message })}
          </p>
        ) : null}
        {step.isSuccess ? <p role="status" className="font-sans">{t(`desk.translations.state.${step.data.translation.state}`)}</p> : null}
      </form>
    </section>
  );
}
