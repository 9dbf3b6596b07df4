// Markdown is rendered and sanitised on the server: nothing executable gets through.
import { describe, expect, it } from "vitest";
import { markdownNesting, renderMarkdown } from "#core/editorial/markdown";
import { markdownText } from "#core/editorial/text";

describe("renderMarkdown", () => {
  it("renders ordinary Markdown", () => {
    expect(renderMarkdown("Group counselling **probably** helps.\n\n- one\n- two")).toBe(
      "<p>Group counselling <strong>probably</strong> helps.</p>\n<ul>\n<li>one</li>\n<li>two</li>\n</ul>\n",
    );
  });

  it("shows a script tag as text instead of running it", () => {
    const html = renderMarkdown("Before <script>alert(1)</script> after");
    expect(html).not.toMatch(/<script/i);
    expect(html).toContain("&lt;script&gt;alert(1)&lt;/script&gt;");
  });

  it("leaves no element with an onerror attribute (raw HTML becomes text, images are not allowed)", () => {
    const html = renderMarkdown('<img src="x" onerror="alert(1)">\n\n![x](y.png "t")');
    expect(html).not.toMatch(/<img/i);
    expect(html).not.toMatch(/<[^>]*onerror/i);
    expect(html).toContain("&lt;img");
  });

  it("removes a javascript: link but keeps its text", () => {
    const html = renderMarkdown("[click me](javascript:alert(1)) and [ok](https://example.org)");
    expect(html).not.toMatch(/javascript:/i);
    expect(html).toContain("click me");
    expect(html).toContain('<a href="https://example.org" rel="noopener noreferrer">ok</a>');
  });
});

describe("Markdown nested beyond reason (round 3 of the hostile probe, F2)", () => {
  it("counts how deep quotes and lists go", () => {
    expect(markdownNesting("> > - item")).toBe(3);
    expect(markdownNesting("- one\n  - two\n    - three")).toBe(3);
    expect(markdownNesting("Plain text - with a dash")).toBe(0);
  });

  it("shows 2000 nested quotes and 1500 nested list markers as plain text instead of overflowing the renderer", () => {
    expect(renderMarkdown(`${"> ".repeat(2000)}deep`)).toMatch(/^<p>(&gt; ){2000}deep<\/p>$/);
    expect(renderMarkdown(`${"- ".repeat(1500)}deep`)).toMatch(/^<p>(- ){1500}deep<\/p>$/);
  });

  it("is refused where it is entered, with the reason", () => {
    const parsed = markdownText(20_000).safeParse(`${"> ".repeat(2000)}deep`);
    expect(parsed.success).toBe(false);
    expect(parsed.error!.issues[0]!.message).toBe("nests quotes or lists more than 20 levels deep");
  });
});
