// The one normaliser of text that readers see (titles, names, labels, Markdown): composed to NFC, and
// refused with a reason when it holds what no reader should receive — control characters (tabs and
// line breaks only in Markdown), Unicode noncharacters, bidirectional overrides and isolates that
// reverse text on pages and images, or nothing visible at all. Shared by every contract (zod). Pure.
import { z } from "zod";
import { markdownNesting, maxNesting } from "./markdown";

/** C0 and C1 controls; Markdown keeps tab, line feed and carriage return. */
// eslint-disable-next-line no-control-regex -- finding control characters is the point
const controls = /[\u0000-\u001f\u007f-\u009f]/u;
// eslint-disable-next-line no-control-regex -- finding control characters is the point
const markdownControls = /[\u0000-\u0008\u000b\u000c\u000e-\u001f\u007f-\u009f]/u;
/** U+FDD0–U+FDEF and the last two code points of every plane. */
const noncharacters = /[\uFDD0-\uFDEF]|[\uFFFE\uFFFF]|[\u{1FFFE}\u{1FFFF}\u{2FFFE}\u{2FFFF}\u{3FFFE}\u{3FFFF}\u{4FFFE}\u{4FFFF}\u{5FFFE}\u{5FFFF}\u{6FFFE}\u{6FFFF}\u{7FFFE}\u{7FFFF}\u{8FFFE}\u{8FFFF}\u{9FFFE}\u{9FFFF}\u{AFFFE}\u{AFFFF}\u{BFFFE}\u{BFFFF}\u{CFFFE}\u{CFFFF}\u{DFFFE}\u{DFFFF}\u{EFFFE}\u{EFFFF}\u{FFFFE}\u{FFFFF}\u{10FFFE}\u{10FFFF}]/u;
/** Embeddings, overrides and isolates (LRE…RLO, LRI…PDI): a name cannot reverse the text around it. */
const bidiControls = /[\u202A-\u202E\u2066-\u2069]/u;
/** What shows nothing: format characters, spaces of every kind, variation selectors. */
const invisible = /[\p{Cf}\p{Zs}\p{Zl}\p{Zp}\s\uFE00-\uFE0F\u115F\u1160\u3164\uFFA0]/gu;

/** What XML 1.0 cannot carry at all (its Char production): the feed and images drop it as a second line of defence. */
// eslint-disable-next-line no-control-regex -- finding control characters is the point
export const notXmlChar = /[\u0000-\u0008\u000b\u000c\u000e-\u001f\uFFFE\uFFFF]|[\uD800-\uDFFF]/gu;

export const hasVisibleText = (text: string) => text.replace(invisible, "").length > 0;

function refine(text: string, context: z.RefinementCtx, markdown: boolean) {
  if ((markdown ? markdownControls : controls).test(text)) context.addIssue({ code: "custom", message: markdown ? "contains a control character" : "contains a control character or a line break" });
  else if (noncharacters.test(text)) context.addIssue({ code: "custom", message: "contains a Unicode noncharacter" });
  else if (!markdown && bidiControls.test(text)) context.addIssue({ code: "custom", message: "contains a bidirectional control character, which would reverse the text around it" });
}

/** A title, name or label: one line, NFC, `min` to `max` characters, something visible when `min` is 1. */
export function lineText(max: number, min = 1) {
  return z
    .string()
    .max(max * 2)
    .transform((text) => text.normalize("NFC").trim())
    .pipe(
      z
        .string()
        .max(max)
        .superRefine((text, context) => {
          refine(text, context, false);
          if (min > 0 && !hasVisibleText(text)) context.addIssue({ code: "custom", message: text === "" ? "is empty" : "holds nothing visible" });
        }),
    );
}

/** Markdown a reader sees once rendered: NFC, tabs and line breaks allowed, no other control character, quotes and lists nested at most 20 deep. */
export function markdownText(max: number) {
  return z
    .string()
    .max(max)
    .transform((text) => text.normalize("NFC"))
    .superRefine((text, context) => {
      refine(text, context, true);
      if (markdownNesting(text) > maxNesting) context.addIssue({ code: "custom", message: `nests quotes or lists more than ${maxNesting} levels deep` });
    });
}
