// Lay summaries and short take are written in Markdown and rendered to HTML on the server. Raw
// HTML in the source is escaped, and the output passes an allow-list sanitiser (sanitize-html), so
// no script, event handler or javascript: link reaches a reader.
import { Marked } from "marked";
import sanitizeHtml from "sanitize-html";

const marked = new Marked({
  gfm: true,
  renderer: {
    // Raw HTML written into the Markdown is shown as text, never passed through.
    html: ({ text }) => escapeHtml(text),
  },
});

function escapeHtml(text: string): string {
  return text.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;").replace(/"/g, "&quot;");
}

const allowed: sanitizeHtml.IOptions = {
  allowedTags: ["p", "br", "strong", "em", "ul", "ol", "li", "a", "blockquote", "h3", "h4", "code", "table", "thead", "tbody", "tr", "th", "td"],
  allowedAttributes: { a: ["href", "title"] },
  allowedSchemes: ["https", "http", "mailto"],
  allowProtocolRelative: false,
  transformTags: {
    // Links leave the site without handing it the reader's page.
    a: sanitizeHtml.simpleTransform("a", { rel: "noopener noreferrer" }),
  },
};

/** Quotes and lists nest at most this deep: readers never need more, and the renderer recurses once a level. */
export const maxNesting = 20;

/** How deep a line's quotes and lists go at most: "> > - x" is 3. */
export function markdownNesting(source: string): number {
  let deepest = 0;
  for (const line of source.split("\n")) {
    const markers = /^(?:[ \t]*(?:>|[-*+](?=[ \t]|$)|\d{1,9}[.)](?=[ \t]|$)))*/.exec(line)![0];
    const indent = /^[ \t]*/.exec(line)![0].replace(/\t/g, "    ").length;
    const depth = (markers.match(/>|[-*+]|\d{1,9}[.)]/g)?.length ?? 0) + Math.floor(indent / 2);
    if (depth > deepest) deepest = depth;
  }
  return deepest;
}

/**
 * Sanitised HTML of the Markdown. Text nested deeper than `maxNesting` (refused where it is entered)
 * is shown as plain text, never rendered, so that a stored text cannot overflow the renderer's stack.
 */
export function renderMarkdown(source: string): string {
  if (markdownNesting(source) > maxNesting) return plainParagraphs(source);
  let html: string;
  try {
    html = marked.parse(source, { async: false });
  } catch (error) {
    if (error instanceof RangeError) return plainParagraphs(source);
    throw error;
  }
  return sanitizeHtml(html, { ...allowed, allowedAttributes: { a: ["href", "title", "rel"] } });
}

const plainParagraphs = (source: string) => `<p>${escapeHtml(source)}</p>`;

/** The words of sanitised HTML, without its tags: what a translation's source is compared by. */
export function textOf(html: string): string {
  const text = sanitizeHtml(html.replace(/<\/(p|li|h3|h4|blockquote|tr)>/g, "$&\n"), { allowedTags: [], allowedAttributes: {} });
  return text
    .replace(/&lt;/g, "<")
    .replace(/&gt;/g, ">")
    .replace(/&quot;/g, '"')
    .replace(/&#39;/g, "'")
    .replace(/&amp;/g, "&")
    .replace(/\n{2,}/g, "\n")
    .trim();
}
