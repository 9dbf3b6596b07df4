// The share image of a version or one comparison (Open Graph / social cards, 1200 × 630): the
// title, what the evidence says, the certainty in words with the product's mark, and the product's
// name. Drawn as SVG and rendered to PNG by resvg (@resvg/resvg-js, whose binary comes inside its npm
// package) with the fonts the app ships. Frozen versions never change, so each image is rendered once
// per process and kept (bounded), keyed by what it shows.
import { mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { createRequire } from "node:module";
import { tmpdir } from "node:os";
import path from "node:path";
import { renderAsync } from "@resvg/resvg-js";
import type { TFunction } from "i18next";
import { briefContent, comparisonContent } from "#core/brief-page";
import { certaintySteps, type Rating } from "#core/grade/certainty";
import { messageText } from "#core/message";
import type { Locale } from "#core/locales";
import type { VersionSnapshot } from "#core/snapshot/schema";
import { escapeXml } from "./feed";
import { sfntFromWoff } from "./woff";

export const shareImageSize = { width: 1200, height: 630 } as const;

const require = createRequire(import.meta.url);
const fontSources = [
  "@fontsource/source-serif-4/files/source-serif-4-latin-400-normal.woff",
  "@fontsource/source-serif-4/files/source-serif-4-latin-600-normal.woff",
  "@fontsource/inter/files/inter-latin-600-normal.woff",
  "@fontsource/noto-naskh-arabic/files/noto-naskh-arabic-arabic-400-normal.woff",
  "@fontsource/noto-naskh-arabic/files/noto-naskh-arabic-arabic-600-normal.woff",
];

let fontFiles: string[] | null = null;
/** The shipped WOFF fonts as TrueType files the renderer can read, written once per process. */
function fonts(): string[] {
  if (!fontFiles) {
    const folder = mkdtempSync(path.join(tmpdir(), "fairweigh-fonts-"));
    fontFiles = fontSources.map((source) => {
      const file = path.join(folder, `${path.basename(source, ".woff")}.ttf`);
      writeFileSync(file, sfntFromWoff(readFileSync(require.resolve(source))));
      return file;
    });
  }
  return fontFiles;
}


/**
 * Words into at most `lines` lines of about `perLine` characters (an average glyph is about half
 * the font size wide in these faces); the last line ends in "…" when text is left over.
 */
export function wrap(text: string, perLine: number, lines: number): string[] {
  const out: string[] = [];
  let line = "";
  for (const word of text.split(/\s+/).filter(Boolean)) {
    if (line && (line + " " + word).length > perLine) {
      out.push(line);
      line = word;
      if (out.length === lines) break;
    } else line = line ? `${line} ${word}` : word;
  }
  if (out.length < lines && line) out.push(line);
  const used = out.join(" ").length;
  if (used < text.replace(/\s+/g, " ").trim().length) out[out.length - 1] = `${out[out.length - 1]!.replace(/[\s,.;:]*\S{0,3}$/, "")}…`;
  return out;
}

interface ImageText {
  kicker: string;
  title: string;
  statement: string | null;
  certainty: { label: string; rating: Rating } | null;
  footer: string;
  fictional: string | null;
}

function svgOf(text: ImageText, rtl: boolean): string {
  const { width, height } = shareImageSize;
  const margin = 72;
  const x = rtl ? width - margin : margin;
  const anchor = rtl ? `text-anchor="end" direction="rtl"` : "";
  const serif = rtl ? "Noto Naskh Arabic" : "Source Serif 4";
  // The shipped Inter file names its family by its weight.
  const sans = rtl ? "Noto Naskh Arabic" : "'Inter SemiBold', Inter";
  const lines = (content: string[], y: number, size: number, weight: number, family: string, leading = 1.2) =>
    content.map((line, i) => `<text x="${x}" y="${y + i * size * leading}" font-family="${family}" font-size="${size}" font-weight="${weight}" fill="#1d1a17" ${anchor}>${escapeXml(line)}</text>`).join("");
  const title = wrap(text.title, 36, 3);
  let y = 190;
  const parts = [
    `<rect width="${width}" height="${height}" fill="#fbf8f3"/>`,
    `<rect width="${width}" height="14" fill="#6d1f35"/>`,
    // The product's name is Latin in every language.
    `<text x="${x}" y="104" font-family="'Inter SemiBold', Inter" font-size="26" font-weight="600" fill="#6d1f35" letter-spacing="2" ${rtl ? `text-anchor="end"` : ""}>${escapeXml(text.kicker)}</text>`,
    lines(title, y, 56, 600, serif),
  ];
  y += title.length * 56 * 1.2 + 20;
  if (text.statement) {
    const statement = wrap(text.statement, 60, 4);
    parts.push(lines(statement, y, 34, 400, serif, 1.3));
    y += statement.length * 34 * 1.3;
  }
  if (text.certainty) {
    const filled = certaintySteps(text.certainty.rating);
    const label = escapeXml(text.certainty.label);
    // The mark beside the words, on the side the text starts from.
    const markX = rtl ? margin : width - margin - 78;
    const steps = [0, 1, 2, 3].map((i) => `<rect x="${markX + i * 21}" y="${height - 110 - (3 + i * 3) * 3 + 9}" width="15" height="${(3 + i * 3) * 3}" fill="${i < filled ? "#6d1f35" : "none"}" stroke="#6d1f35" stroke-width="3"/>`).join("");
    parts.push(`<text x="${x}" y="${height - 110}" font-family="${sans}" font-size="30" font-weight="600" fill="#6d1f35" ${anchor}>${label}</text>`, steps);
  }
  parts.push(`<text x="${x}" y="${height - 52}" font-family="${sans}" font-size="22" font-weight="600" fill="#5b554d" ${anchor}>${escapeXml(text.footer)}</text>`);
  if (text.fictional) {
    // Opposite the product's name, on the top line: never hidden by a long footer.
    const fx = rtl ? margin : width - margin;
    parts.push(`<text x="${fx}" y="104" font-family="${sans}" font-size="24" font-weight="600" fill="#6d1f35" text-anchor="${rtl ? "start" : "end"}">${escapeXml(text.fictional)}</text>`);
  }
  return `<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${height}" viewBox="0 0 ${width} ${height}">${parts.join("")}</svg>`;
}

/**
 * The renderer shapes a line in one face and cannot mix faces within it, and the Arabic face the app
 * ships holds Arabic script only: in an Arabic image, digits are written in Arabic-Indic form and
 * Latin punctuation in its Arabic equivalent. Null when Latin letters remain (an untranslated name):
 * that image is drawn in English instead (docs/decisions/0028-reach.md).
 */
export function inArabicScript(text: string): string | null {
  const arabic = text
    .replace(/[0-9]/g, (d) => String.fromCharCode(0x0660 + Number(d)))
    .replace(/%/g, "\u066A")
    .replace(/[,·]/g, "\u060C")
    .replace(/\./g, "\u06D4")
    .replace(/[-–—]/g, "\u2010")
    .replace(/[:()«»"“”]/g, "")
    .replace(/\s+/g, " ")
    .trim();
  return /[\u0021-\u007E\u00A0-\u024F]/.test(arabic) ? null : arabic;
}

export type ShareText = ImageText & { alt: string };

/** The image's words for an Arabic reader, or null when they cannot all be drawn in Arabic script. */
export function arabicImageText(text: ShareText): ShareText | null {
  const title = inArabicScript(text.title);
  const statement = text.statement === null ? null : inArabicScript(text.statement);
  const footer = inArabicScript(text.footer);
  const fictional = text.fictional === null ? null : inArabicScript(text.fictional);
  const certainty = text.certainty ? inArabicScript(text.certainty.label) : null;
  if (title === null || footer === null || (text.statement !== null && statement === null) || (text.certainty && certainty === null) || (text.fictional !== null && fictional === null)) return null;
  return { ...text, title, statement, footer, fictional, certainty: text.certainty ? { ...text.certainty, label: certainty! } : null };
}

/** What a version's or a comparison's image says; null when the version has no such comparison. */
export function shareImageText(snapshot: VersionSnapshot, pair: { a: string; b: string } | null, t: TFunction, locale: Locale): ShareText | null {
  const footer = t("share.footer", { version: snapshot.version });
  const fictional = snapshot.brief.demo ? t("embed.fictional") : null;
  if (!pair) {
    const view = briefContent(snapshot);
    const text = { kicker: "FAIRWEIGH", title: view.title, statement: t("share.versionStatement", { condition: view.condition, population: view.population }), certainty: null, footer, fictional };
    return { ...text, alt: `${view.title}. ${text.statement}` };
  }
  const view = comparisonContent(snapshot, pair.a, pair.b);
  if (!view) return null;
  const first = view.outcomes[0]!;
  const statement = first.statement ? messageText(t, locale, first.statement) : null;
  const certainty = first.certainty ? { label: `${t("brief.certainty")}: ${t(`certainty.rating.${first.certainty}`)}`, rating: first.certainty } : null;
  const title = t("brief.versus", { treatment: view.treatment.name, comparator: view.comparator.name });
  return {
    kicker: "FAIRWEIGH",
    title,
    statement,
    certainty,
    footer: `${view.title} · ${footer}`,
    fictional,
    alt: [title, statement, certainty?.label].filter(Boolean).join(". "),
  };
}

const rendered = new Map<string, Promise<Buffer>>();
/** Enough for every version and comparison readers share at once; the oldest go first. */
const keep = 500;

/** The PNG of one image, rendered once per key and kept (rendering runs off the event loop, in libuv's pool). */
export function shareImage(key: string, text: ImageText, rtl: boolean): Promise<Buffer> {
  const known = rendered.get(key);
  if (known) {
    rendered.delete(key);
    rendered.set(key, known);
    return known;
  }
  const svg = svgOf(text, rtl);
  const promise = renderAsync(svg, { font: { fontFiles: fonts(), loadSystemFonts: false, defaultFontFamily: "Source Serif 4" }, fitTo: { mode: "original" } }).then((image) => Buffer.from(image.asPng()));
  promise.catch(() => rendered.delete(key));
  rendered.set(key, promise);
  if (rendered.size > keep) rendered.delete(rendered.keys().next().value!);
  return promise;
}
