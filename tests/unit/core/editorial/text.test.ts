// The one normaliser of text readers see (server/core/editorial/text.ts), on what round 3 of the hostile probe
// sent (F5, F12): control characters, noncharacters, bidirectional overrides, invisible titles.
import { describe, expect, it } from "vitest";
import { lineText, markdownText, notXmlChar } from "#core/editorial/text";

const line = lineText(300);
const reason = (value: string) => {
  const parsed = line.safeParse(value);
  return parsed.success ? null : parsed.error.issues[0]!.message;
};

describe("a title, name or label", () => {
  it("is composed to NFC and trimmed", () => {
    expect(line.parse("  Cafe\u0301 au lait ")).toBe("Café au lait");
  });

  it.each([
    ["U+0001", "A\u0001B", "contains a control character or a line break"],
    ["U+000B", "A\u000bB", "contains a control character or a line break"],
    ["a line break", "A\nB", "contains a control character or a line break"],
    ["U+FFFE", "A\uFFFEB", "contains a Unicode noncharacter"],
    ["U+202E", "\u202Eevil", "contains a bidirectional control character, which would reverse the text around it"],
    ["U+2066", "a\u2066b", "contains a bidirectional control character, which would reverse the text around it"],
    ["only zero-width characters", "\u200b\u200c\u200d\u2060", "holds nothing visible"],
    ["only spaces", "   ", "is empty"],
  ])("refuses %s with a reason", (_, value, message) => {
    expect(reason(value)).toBe(message);
  });

  it("keeps Arabic, accents and a zero-width joiner inside a word", () => {
    expect(line.parse("الرعاية المعتادة")).toBe("الرعاية المعتادة");
    expect(line.parse("Soins habituels — révisés")).toBe("Soins habituels — révisés");
    expect(line.parse("a\u200db")).toBe("a\u200db");
  });
});

describe("Markdown", () => {
  it("keeps tabs and line breaks and refuses other control characters", () => {
    expect(markdownText(100).parse("- one\n- two\t")).toBe("- one\n- two\t");
    expect(markdownText(100).safeParse("a\u0007b").success).toBe(false);
  });
});

describe("XML's own limits", () => {
  it("names what XML 1.0 forbids, and nothing else", () => {
    expect("a\u0001b\u000bc\uFFFEd\te\nf".replace(notXmlChar, "")).toBe("abcd\te\nf");
  });
});
