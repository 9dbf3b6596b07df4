// The e-mails (server/core/languages/mail.ts), in the recipient's language, as plain text and HTML of
// the same words; the expected words are written out here by hand.
import { describe, expect, it } from "vitest";
import { invitationMessage, languageList } from "#core/languages/mail";

const expires = new Date("2026-12-11T09:30:00Z");

describe("an invitation", () => {
  it("reads in the recipient's language, with the link in both parts", () => {
    const message = invitationMessage({ recipient: "ana@example.org", name: "Ana", inviter: "Eve", roles: ["translator"], link: "https://fairweigh.example/invitation/abc", expires, locale: "es" });
    expect(message).toMatchObject({ kind: "invitation", recipient: "ana@example.org", locale: "es", subject: "Le invitan a Fairweigh" });
    expect(message.text.split("\n")[0]).toBe("Hola, Ana:");
    expect(message.text).toContain("Elegir la contraseña: https://fairweigh.example/invitation/abc");
    expect(message.html).toContain('<a href="https://fairweigh.example/invitation/abc">Elegir la contraseña</a>');
  });

  it("escapes a name in its HTML part", () => {
    const message = invitationMessage({ recipient: "x@example.org", name: "<b>Ana</b>", inviter: "Eve", roles: ["analyst"], link: "https://fairweigh.example/i", expires });
    expect(message.text.split("\n")[0]).toBe("Hello <b>Ana</b>,");
    expect(message.html).toContain("<p>Hello &#60;b&#62;Ana&#60;/b&#62;,</p>");
    expect(message.html).not.toContain("<b>Ana</b>");
  });
});

describe("a list of languages", () => {
  it("names them in the reader's language", () => {
    expect(languageList(["es", "fr"], "en")).toBe("Spanish and French");
    expect(languageList(["es", "fr"], "fr")).toBe("espagnol et français");
  });
});
