// The card other sites frame: one comparison (or one version) of a released brief in a small,
// self-contained HTML page — what the evidence says in words, the effect with its 95% CI, the
// certainty in words with the product's mark, the health caution in one line, the fictional-data
// label, and a link back to the exact version. Its styles are inline and it needs no script; one
// small script only tells the framing page its height (postMessage) for auto-sizing.
import type { TFunction } from "i18next";
import { briefContent, comparisonContent } from "#core/publication/brief-page";
import { formatInterval } from "#core/publication/effects";
import { certaintySteps, type Rating } from "#core/grade/certainty";
import { dayInWords, textDirection, type Locale } from "#core/languages/locales";
import { messageText } from "#core/languages/message";
import type { VersionSnapshot } from "#core/snapshot/schema";
import { escapeXml } from "./feed";
import { embedHeightMessage } from "#core/publication/urls";
import { dotCentre, dotGrid, dotStates, halfDot, pictographAlt, type DotState, type PictographInput } from "#core/publication/pictograph";

/** Card widths the layout is made for (the issue's 320–720 px); oEmbed answers clamp to them. */
export const cardWidth = { min: 320, max: 720, default: 560 } as const;


function mark(rating: Rating | null, t: TFunction): string {
  if (rating === null) return `<span class="muted">${escapeXml(t("certainty.notAssessed"))}</span>`;
  const filled = certaintySteps(rating);
  const steps = [0, 1, 2, 3].map((i) => `<rect x="${i * 7}" y="${9 - i * 3}" width="5" height="${3 + i * 3}" fill="${i < filled ? "#6d1f35" : "none"}" stroke="#6d1f35"/>`).join("");
  return `<span class="certainty">${escapeXml(t(`certainty.rating.${rating}`))} <svg viewBox="0 0 26 12" width="26" height="12" aria-hidden="true">${steps}</svg></span>`;
}

const ink = "#1d1a17";
function dots(states: DotState[], rtl: boolean): string {
  const size = dotGrid.columns * dotGrid.step;
  const shapes = states
    .map((state, i) => {
      const { cx, cy } = dotCentre(i, rtl);
      const circle = `<circle cx="${cx}" cy="${cy}" r="${dotGrid.radius}" fill="${state === "has" ? ink : "none"}" stroke="${ink}" stroke-width="1.2"/>`;
      return state === "band" ? `${circle}<path d="${halfDot(cx, cy, rtl)}" fill="${ink}"/>` : circle;
    })
    .join("");
  return `<svg viewBox="0 0 ${size} ${size}" width="112" height="112" aria-hidden="true">${shapes}</svg>`;
}

/**
 * A binary comparison as 100 people with each option, as on its page (components/charts/Pictograph.tsx),
 * shown only when the card is wide enough for two grids beside the figures (the .people rule); its
 * sentence gives the numbers per 1000 to assistive technology.
 */
function pictograph(input: PictographInput, t: TFunction, locale: Locale): string {
  const rtl = textDirection(locale) === "rtl";
  const alt = t("pictograph.alt", pictographAlt(input, locale));
  const grid = (label: string, states: DotState[]) => `<figure><figcaption>${escapeXml(t("pictograph.with", { name: label }))}</figcaption>${dots(states, rtl)}</figure>`;
  const legend = (["has", "band", "hasNot"] as const)
    .map((state) => {
      const swatch = `<circle cx="7" cy="7" r="${dotGrid.radius}" fill="${state === "has" ? ink : "none"}" stroke="${ink}" stroke-width="1.2"/>${state === "band" ? `<path d="${halfDot(7, 7, rtl)}" fill="${ink}"/>` : ""}`;
      return `<li><svg viewBox="0 0 14 14" width="12" height="12">${swatch}</svg> ${escapeXml(t(`pictograph.${state}`))}</li>`;
    })
    .join("");
  return `<div class="people" role="img" aria-label="${escapeXml(alt)}" data-testid="embed-pictograph"><div aria-hidden="true"><p class="muted">${escapeXml(t("pictograph.title"))}</p><div class="grids">${grid(input.comparatorName, dotStates({ estimate: input.comparatorPer1000 }))}${grid(input.optionName, dotStates(input.option))}</div><ul class="legend">${legend}</ul><p class="muted">${escapeXml(t("pictograph.cardNote"))}</p></div></div>`;
}

/**
 * The card's faces: the site's own (Source Serif 4 for text, Inter for labels, Noto Naskh Arabic for
 * Arabic), served from the app's npm packages at stable addresses so that a framed card needs no build
 * manifest (server/web/public/reach.ts serves them).
 */
export const cardFonts = {
  "source-serif-4-400.woff2": { family: "Source Serif 4", weight: 400, file: "@fontsource/source-serif-4/files/source-serif-4-latin-400-normal.woff2" },
  "source-serif-4-600.woff2": { family: "Source Serif 4", weight: 600, file: "@fontsource/source-serif-4/files/source-serif-4-latin-600-normal.woff2" },
  "inter-400.woff2": { family: "Inter", weight: 400, file: "@fontsource/inter/files/inter-latin-400-normal.woff2" },
  "inter-600.woff2": { family: "Inter", weight: 600, file: "@fontsource/inter/files/inter-latin-600-normal.woff2" },
  "noto-naskh-arabic-400.woff2": { family: "Noto Naskh Arabic", weight: 400, file: "@fontsource/noto-naskh-arabic/files/noto-naskh-arabic-arabic-400-normal.woff2" },
  "noto-naskh-arabic-600.woff2": { family: "Noto Naskh Arabic", weight: 600, file: "@fontsource/noto-naskh-arabic/files/noto-naskh-arabic-arabic-600-normal.woff2" },
} as const;

const fontFaces = Object.entries(cardFonts)
  .map(([name, face]) => `@font-face{font-family:"${face.family}";font-weight:${face.weight};font-display:swap;src:url(/embed/fonts/${name}) format("woff2")}`)
  .join("\n");
const sans = `Inter,"Noto Naskh Arabic",system-ui,sans-serif`;

const styles = `
${fontFaces}
:root{color-scheme:light}
*{box-sizing:border-box}
body{margin:0;font:16px/1.45 "Source Serif 4",Georgia,"Noto Naskh Arabic",serif;color:#1d1a17;background:#fbf8f3}
.card{max-width:${cardWidth.max}px;border:1px solid #d9d1c5;border-block-start:4px solid #6d1f35;padding:16px 18px;background:#fbf8f3}
.brand{font:600 13px/1.2 ${sans};letter-spacing:.04em;text-transform:uppercase;color:#6d1f35;margin:0}
h1{font-size:22px;line-height:1.2;margin:6px 0 2px}
.from,.muted{color:#5b554d;font:13px/1.4 ${sans}}
.fictional{display:inline-block;margin:8px 0 0;padding:2px 8px;border:1px solid #6d1f35;color:#6d1f35;font:600 12px/1.4 ${sans}}
section{border-block-start:1px solid #d9d1c5;margin-block-start:12px;padding-block-start:10px}
h2{font:600 15px/1.3 ${sans};margin:0 0 4px}
.statement{font-size:17px;margin:0 0 6px}
dl{display:grid;grid-template-columns:minmax(6em,38%) minmax(0,1fr);gap:2px 12px;margin:0;font:14px/1.4 ${sans}}
dt{color:#5b554d}dd{margin:0;font-variant-numeric:tabular-nums;overflow-wrap:anywhere}
.certainty{white-space:nowrap}.certainty svg{vertical-align:middle}
.caution{margin:12px 0 0;font:13px/1.4 ${sans};border-inline-start:3px solid #6d1f35;padding-inline-start:8px}
.withdrawn{margin:12px 0 0;padding:8px 10px;border:2px solid #6d1f35;font:14px/1.4 ${sans}}
a{color:#6d1f35}.link{display:block;margin-block-start:10px;font:600 14px/1.4 ${sans}}
ul{margin:4px 0 0;padding-inline-start:18px;font-size:15px}
.people{display:none;margin-block-start:8px}
.grids{display:flex;gap:20px;align-items:flex-end}.grids figure{margin:0}.grids figcaption{font:600 13px/1.3 ${sans};max-width:112px}
.legend{display:flex;flex-wrap:wrap;gap:2px 14px;list-style:none;padding:0;margin:6px 0 0;font:12px/1.4 ${sans}}.legend svg{vertical-align:-1px}
@media (min-width:480px){.people{display:block}}
`;

export interface CardInput {
  snapshot: VersionSnapshot;
  /** The comparison's two labels, or null for the version's card. */
  pair: { a: string; b: string } | null;
  locale: Locale;
  t: TFunction;
  /** The absolute address of the page the card stands for. */
  permalink: string;
  withdrawal: { at: string; reason: string } | null;
  nonce: string;
}

/** The card's HTML page; null when the version has no such comparison. */
export function embedCard(input: CardInput): string | null {
  const { snapshot, pair, locale, t, permalink, withdrawal } = input;
  const date = (iso: string) => dayInWords(locale, iso);
  const from = t("embed.inBrief", { title: snapshot.brief.title, version: snapshot.version, date: date(snapshot.releaseAt) });
  let heading: string;
  let body: string;
  if (pair) {
    const view = comparisonContent(snapshot, pair.a, pair.b);
    if (!view) return null;
    heading = t("brief.versus", { treatment: view.treatment.name, comparator: view.comparator.name });
    body = view.outcomes
      .map((outcome) => {
        const rows = [
          `<dt>${escapeXml(t("compare.relative", { measure: t(`brief.measure.${outcome.measure}`) }))}</dt><dd>${escapeXml(formatInterval(outcome.measure, outcome.network, t("brief.to"), locale))}${outcome.unit ? ` ${escapeXml(outcome.unit)}` : ""}</dd>`,
          outcome.absolute ? `<dt>${escapeXml(t("compare.absolute"))}</dt><dd>${escapeXml(messageText(t, locale, outcome.absolute.statement))}</dd>` : "",
          `<dt>${escapeXml(t("brief.certainty"))}</dt><dd>${mark(outcome.certainty, t)}</dd>`,
        ].join("");
        const statement = outcome.statement ? messageText(t, locale, outcome.statement) : t("compare.noStatement");
        const people = outcome.absolute
          ? pictograph({ outcome: outcome.name, comparatorName: view.comparator.name, optionName: view.treatment.name, comparatorPer1000: outcome.absolute.baselinePer1000, option: outcome.absolute.treatmentPer1000 }, t, locale)
          : "";
        return `<section><h2>${escapeXml(outcome.name)}</h2><p class="statement">${escapeXml(statement)}</p><dl>${rows}</dl>${people}</section>`;
      })
      .join("");
  } else {
    const view = briefContent(snapshot);
    heading = view.title;
    body = view.outcomes
      .map((outcome) => {
        const groups = outcome.groups.map((g) => `<li>${escapeXml(messageText(t, locale, g.label))}: ${escapeXml(g.treatments.map((x) => x.name).join(", "))}</li>`).join("");
        return `<section><h2>${escapeXml(outcome.name)}</h2><ul>${groups}</ul></section>`;
      })
      .join("");
  }
  const link = t(pair ? "embed.readComparison" : "embed.readBrief", { version: snapshot.version });
  // A withdrawn brief's card keeps saying what it was, and that it was withdrawn and why, without its findings.
  const main = withdrawal ? `<p class="withdrawn" role="alert">${escapeXml(t("embed.withdrawn", { date: date(withdrawal.at), reason: withdrawal.reason }))}</p>` : body;
  const height = `(function(){function send(){parent.postMessage({type:"${embedHeightMessage}",height:Math.ceil(document.documentElement.getBoundingClientRect().height)},"*")}addEventListener("load",send);if(window.ResizeObserver)new ResizeObserver(send).observe(document.documentElement)})();`;
  return `<!doctype html>
<html lang="${locale}" dir="${textDirection(locale)}">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<meta name="robots" content="noindex">
<title>${escapeXml(`${heading} · Fairweigh`)}</title>
<link rel="canonical" href="${escapeXml(permalink)}">
<style>${styles}</style>
</head>
<body>
<article class="card" data-testid="embed-card">
<p class="brand">Fairweigh</p>
<h1>${escapeXml(heading)}</h1>
<p class="from">${escapeXml(from)}</p>
${snapshot.brief.demo ? `<p class="fictional">${escapeXml(t("embed.fictional"))}</p>` : ""}
${main}
<p class="caution">${escapeXml(t("embed.caution"))}</p>
<a class="link" href="${escapeXml(permalink)}" target="_blank" rel="noopener">${escapeXml(link)}</a>
</article>
<script nonce="${escapeXml(input.nonce)}">${height}</script>
</body>
</html>
`;
}
