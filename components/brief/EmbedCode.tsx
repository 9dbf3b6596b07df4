// "Embed this comparison": the <iframe> of the comparison's card (server/web/public/embed.ts) and a
// one-line listener that sets its height from the card's postMessage, ready to copy.
import { useState } from "react";
import { useTranslation } from "react-i18next";
import { embedHeightMessage, embedUrl, type ComparisonAddress } from "#core/publication/urls";
import { useIntl } from "../i18n";

export function EmbedCode({ at, permalink, title, outcomes }: { at: ComparisonAddress; permalink: string; title: string; outcomes: number }) {
  const { t } = useTranslation();
  const intl = useIntl();
  const [copied, setCopied] = useState(false);
  const origin = new URL(permalink).origin;
  const src = `${origin}${intl.href(embedUrl(at))}`;
  const attribute = (value: string) => value.replace(/&/g, "&amp;").replace(/"/g, "&quot;").replace(/</g, "&lt;");
  const code =
    `<iframe src="${attribute(src)}" title="${attribute(`${title} · Fairweigh`)}" width="560" height="${230 + 190 * outcomes}" style="border:0;max-width:100%" loading="lazy"></iframe>\n` +
    `<script>addEventListener("message",function(e){if(e.origin!=="${origin}"||!e.data||e.data.type!=="${embedHeightMessage}")return;document.querySelectorAll("iframe").forEach(function(f){if(f.contentWindow===e.source)f.style.height=e.data.height+"px"})});</script>`;
  return (
    <details className="mt-10 border-t border-rule pt-4" data-testid="embed-code">
      <summary className="cursor-pointer font-sans font-semibold">{t("embed.heading")}</summary>
      <p className="mt-2 text-sm">{t("embed.instructions")}</p>
      <textarea readOnly value={code} rows={5} aria-label={t("embed.code")} className="mt-2 w-full border border-rule bg-white p-2 font-mono text-xs" onFocus={(event) => event.currentTarget.select()} />
      <button
        type="button"
        className="mt-2 border border-ink px-4 py-1 font-sans text-sm font-semibold"
        onClick={() => void navigator.clipboard?.writeText(code).then(() => setCopied(true))}
      >
        {copied ? t("embed.copied") : t("embed.copy")}
      </button>
    </details>
  );
}
