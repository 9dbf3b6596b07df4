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

export function renderMarkdown(source: string): string {
  const html = marked.parse(source, { async: false });
  return sanitizeHtml(html, { ...allowed, allowedAttributes: { a: ["href", "title", "rel"] } });
}

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
