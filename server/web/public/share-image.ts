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
import { briefContent, comparisonContent } from "#core/publication/brief-page";
import { certaintySteps, type Rating } from "#core/grade/certainty";
import { messageText } from "#core/languages/message";
import type { Locale } from "#core/languages/locales";
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
 * Words into at most `lines` lines of at most `perLine` characters; a word longer than a line is
 * cut across lines. The last line ends in "…" when text is left over.
 */
export function wrap(text: string, perLine: number, lines: number): string[] {
  const words = text.split(/\s+/).filter(Boolean).flatMap((word) => word.match(new RegExp(`.{1,${perLine}}`, "gu")) ?? []);
  const out: string[] = [];
  let line = "";
  for (const word of words) {
    if (line && (line + " " + word).length > perLine) {
      out.push(line);
      line = word;
      if (out.length === lines) break;
    } else line = line ? `${line} ${word}` : word;
  }
  if (out.length < lines && line) out.push(line);
  const used = out.join(" ").length;
  if (used < words.join(" ").length) {
    const last = out[out.length - 1]!;
    out[out.length - 1] = `${(last.length >= perLine ? last.slice(0, perLine - 1) : last).replace(/[\s,.;:]+$/, "")}…`;
  }
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

const margin = 72;
const textWidth = shareImageSize.width - 2 * margin;
/**
 * Characters that fit the text's width at a size: an average glyph of these faces is about half the
 * font size wide; 0.56 leaves room for wide letters and capitals (measured with the shipped fonts in
 * tests/unit/web/public/share-image.test.ts).
 */
const perLine = (size: number) => Math.floor(textWidth / (size * 0.56));
/** The sizes tried in turn, largest first, until the title and the statement fit whole. */
const sizes = [
  { title: 56, statement: 34 },
  { title: 48, statement: 30 },
  { title: 42, statement: 27 },
  { title: 36, statement: 24 },
];

interface Block {
  lines: string[];
  size: number;
  leading: number;
  /** The first line's baseline. */
  y: number;
}

/**
 * Where the title and the statement go: below the product's name, above the certainty (or the
 * footer), at the largest sizes at which both fit whole; at the smallest, the statement is cut to the
 * room left, ending in "…".
 */
export function fitText(title: string, statement: string | null, withCertainty: boolean): { title: Block; statement: Block | null } {
  const top = 140;
  const bottom = withCertainty ? 470 : 535;
  const place = (size: { title: number; statement: number }, statementLines: number) => {
    const titleBlock: Block = { lines: wrap(title, perLine(size.title), 3), size: size.title, leading: 1.2, y: top + 0.9 * size.title };
    const titleEnd = titleBlock.y + (titleBlock.lines.length - 1) * size.title * 1.2 + 0.25 * size.title;
    const statementY = titleEnd + 20 + 0.9 * size.statement;
    const room = Math.max(1, Math.floor((bottom - statementY - 0.25 * size.statement) / (size.statement * 1.3)) + 1);
    const statementBlock: Block | null = statement === null ? null : { lines: wrap(statement, perLine(size.statement), Math.min(statementLines, room)), size: size.statement, leading: 1.3, y: statementY };
    const end = statementBlock ? statementBlock.y + (statementBlock.lines.length - 1) * size.statement * 1.3 + 0.25 * size.statement : titleEnd;
    const whole = !titleBlock.lines.at(-1)!.endsWith("…") && !(statementBlock?.lines.at(-1)!.endsWith("…") ?? false);
    return { title: titleBlock, statement: statementBlock, fits: whole && end <= bottom };
  };
  for (const size of sizes) {
    const placed = place(size, 8);
    if (placed.fits) return placed;
  }
  return place(sizes.at(-1)!, 8);
}

/** The image as named parts (drawn in this order), so that a test can measure each one. */
export function shareImageParts(text: ImageText, rtl: boolean): { name: string; svg: string }[] {
  const { width, height } = shareImageSize;
  const x = rtl ? width - margin : margin;
  const anchor = rtl ? `text-anchor="end" direction="rtl"` : "";
  const serif = rtl ? "Noto Naskh Arabic" : "Source Serif 4";
  // The shipped Inter file names its family by its weight.
  const sans = rtl ? "Noto Naskh Arabic" : "'Inter SemiBold', Inter";
  const lines = (block: Block, weight: number, family: string) =>
    block.lines.map((line, i) => `<text x="${x}" y="${block.y + i * block.size * block.leading}" font-family="${family}" font-size="${block.size}" font-weight="${weight}" fill="#1d1a17" ${anchor}>${escapeXml(line)}</text>`).join("");
  const fitted = fitText(text.title, text.statement, text.certainty !== null);
  const parts = [
    { name: "background", svg: `<rect width="${width}" height="${height}" fill="#fbf8f3"/><rect width="${width}" height="14" fill="#6d1f35"/>` },
    // The product's name is Latin in every language.
    { name: "kicker", svg: `<text x="${x}" y="104" font-family="'Inter SemiBold', Inter" font-size="26" font-weight="600" fill="#6d1f35" letter-spacing="2" ${rtl ? `text-anchor="end"` : ""}>${escapeXml(text.kicker)}</text>` },
    { name: "title", svg: lines(fitted.title, 600, serif) },
  ];
  if (fitted.statement) parts.push({ name: "statement", svg: lines(fitted.statement, 400, serif) });
  if (text.certainty) {
    const filled = certaintySteps(text.certainty.rating);
    // The mark beside the words, on the side the text starts from; the words are cut before it.
    const label = escapeXml(wrap(text.certainty.label, perLine(30) - 6, 1)[0]!);
    const markX = rtl ? margin : width - margin - 78;
    const steps = [0, 1, 2, 3].map((i) => `<rect x="${markX + i * 21}" y="${height - 110 - (3 + i * 3) * 3 + 9}" width="15" height="${(3 + i * 3) * 3}" fill="${i < filled ? "#6d1f35" : "none"}" stroke="#6d1f35" stroke-width="3"/>`).join("");
    parts.push({ name: "certainty", svg: `<text x="${x}" y="${height - 110}" font-family="${sans}" font-size="30" font-weight="600" fill="#6d1f35" ${anchor}>${label}</text>` }, { name: "mark", svg: steps });
  }
  parts.push({ name: "footer", svg: `<text x="${x}" y="${height - 52}" font-family="${sans}" font-size="22" font-weight="600" fill="#5b554d" ${anchor}>${escapeXml(wrap(text.footer, perLine(22), 1)[0]!)}</text>` });
  if (text.fictional) {
    // Opposite the product's name, on the top line: never hidden by a long footer.
    const fx = rtl ? margin : width - margin;
    parts.push({ name: "fictional", svg: `<text x="${fx}" y="104" font-family="${sans}" font-size="24" font-weight="600" fill="#6d1f35" text-anchor="${rtl ? "start" : "end"}">${escapeXml(text.fictional)}</text>` });
  }
  return parts;
}

/** The whole image, or only some of its parts (a test measures each alone). */
export function shareImageSvg(text: ImageText, rtl: boolean, only?: (name: string) => boolean): string {
  const { width, height } = shareImageSize;
  const parts = shareImageParts(text, rtl).filter((part) => !only || only(part.name));
  return `<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${height}" viewBox="0 0 ${width} ${height}">${parts.map((part) => part.svg).join("")}</svg>`;
}

/** What the renderer needs: the shipped fonts and no others. */
export const renderOptions = () => ({ font: { fontFiles: fonts(), loadSystemFonts: false, defaultFontFamily: "Source Serif 4" }, fitTo: { mode: "original" as const } });

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
export type { ImageText };

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

/** A withdrawn brief's image: its title, and in place of the finding the withdrawal and its reason. */
export function withdrawnImageText(text: ShareText, withdrawal: string): ShareText {
  return { ...text, statement: withdrawal, certainty: null, alt: `${text.title}. ${withdrawal}` };
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
  const promise = renderAsync(shareImageSvg(text, rtl), renderOptions()).then((image) => Buffer.from(image.asPng()));
  promise.catch(() => rendered.delete(key));
  rendered.set(key, promise);
  if (rendered.size > keep) rendered.delete(rendered.keys().next().value!);
  return promise;
}
