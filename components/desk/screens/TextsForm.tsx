// The editor's texts with a server-rendered preview, saved with the row version the editor read.
// On a conflict the editor's own text stays in the form and the other person's is shown beside it.
import { useState } from "react";
import { useTranslation } from "react-i18next";
import { buttonClass, inputClass } from "./forms";
import { ReadabilityAdvice } from "./ReadabilityAdvice";

export function TextsForm({
  initial,
  onPreview,
  onSave,
  busy,
  saved,
  error,
  theirs,
}: {
  initial: { laySummary: string; shortTake: string };
  onPreview: (markdown: string) => Promise<string>;
  onSave: (texts: { laySummary: string; shortTake: string }) => void;
  busy: boolean;
  saved: boolean;
  error: string | null;
  /** After a conflict: the texts as the other person saved them. Yours stay in the form. */
  theirs: { laySummary: string; shortTake: string } | null;
}) {
  const { t } = useTranslation();
  const [texts, setTexts] = useState(initial);
  const [preview, setPreview] = useState<{ laySummary: string; shortTake: string } | null>(null);
  return (
    <section className="mt-10 border-t border-rule pt-6">
      <h2 className="text-xl font-semibold">{t("desk.texts")}</h2>
      <p className="mt-1 text-muted">{t("desk.textsLead")}</p>
      <form
        aria-label={t("desk.texts")}
        className="mt-4 space-y-4 font-sans"
        onSubmit={(event) => {
          event.preventDefault();
          onSave(texts);
        }}
      >
        {(["laySummary", "shortTake"] as const).map((name) => (
          <div key={name}>
            <label className="block">
              <span className="block text-sm font-semibold">{t(`desk.${name}`)}</span>
              <textarea
                name={name}
                rows={6}
                value={texts[name]}
                onChange={(event) => setTexts({ ...texts, [name]: event.target.value })}
                className={`${inputClass} mt-1 font-mono text-sm`}
              />
            </label>
            {/* The texts are written in English; translators get the same check in their language. */}
            <ReadabilityAdvice text={texts[name]} locale="en" />
          </div>
        ))}
        <div className="flex gap-4">
          <button
            type="button"
            className="border border-accent px-4 py-2 text-accent"
            onClick={async () => setPreview({ laySummary: await onPreview(texts.laySummary), shortTake: await onPreview(texts.shortTake) })}
          >
            {t("desk.preview")}
          </button>
          <button type="submit" disabled={busy} className={buttonClass}>
            {busy ? t("desk.saving") : t("desk.saveTexts")}
          </button>
        </div>
        {saved ? <p role="status">{t("desk.saved")}</p> : null}
        {error ? <p role="alert" className="text-accent">{error}</p> : null}
        {theirs ? (
          <pre className="whitespace-pre-wrap border border-rule bg-paper p-3 text-sm" data-testid="their-texts">
            {theirs.laySummary}
            {"\n\n"}
            {theirs.shortTake}
          </pre>
        ) : null}
      </form>
      {preview ? (
        <div className="mt-6 border border-rule bg-white p-5" data-testid="texts-preview">
          {/* The HTML comes from the server's Markdown renderer, which sanitises it (server/core/editorial/markdown.ts). */}
          <div className="space-y-3 text-lg leading-relaxed" dangerouslySetInnerHTML={{ __html: preview.laySummary }} />
          <div className="mt-4 space-y-2" dangerouslySetInnerHTML={{ __html: preview.shortTake }} />
        </div>
      ) : null}
    </section>
  );
}
