// The share image with long treatment names (hostile probe round 3: 60-character names made the
// statement run over its certainty label). Each part of the image is drawn alone by the same renderer
// with the shipped fonts and measured: no two parts overlap, every part stays inside the image's
// margins, and at 60 characters a name is shown whole, in every language.
import { Resvg } from "@resvg/resvg-js";
import { describe, expect, it } from "vitest";
import { createI18n } from "#components/i18n";
import type { Locale } from "#core/languages/locales";
import { arabicImageText, renderOptions, shareImageParts, shareImageSize, shareImageSvg, type ShareText } from "#web/public/share-image";

/** Invented names of 60 characters each, written per language (the Arabic ones in Arabic script, as a translation gives them). */
const names: Record<Locale, { treatment: string; comparator: string; outcome: string; brief: string }> = {
  en: { treatment: "Guided evening light therapy with one mobile coaching course", comparator: "Usual care with printed sleep hygiene advice and diary cards", outcome: "sleep quality at twelve weeks", brief: "Evening light for shift workers" },
  es: { treatment: "Terapia de luz vespertina guiada con programa de apoyo móvil", comparator: "Atención habitual con consejos impresos de higiene del sueño", outcome: "calidad del sueño a las doce semanas", brief: "Luz vespertina para trabajadores por turnos" },
  fr: { treatment: "Luminothérapie du soir, guidée, avec un suivi sur téléphones", comparator: "Soins habituels, avec conseils imprimés d’hygiène du sommeil", outcome: "qualité du sommeil à douze semaines", brief: "La lumière du soir pour le travail posté" },
  ar: { treatment: "العلاج بالضوء المسائي الموجّه مع برنامج دعم عبر الهاتف الذكي", comparator: "الرعاية المعتادة مع نصائح مطبوعة لصحة النوم وبطاقات اليوميات", outcome: "جودة النوم بعد اثني عشر أسبوعًا", brief: "ضوء المساء لعمال المناوبات" },
};

function comparisonImage(locale: Locale, name: { treatment: string; comparator: string; outcome: string; brief: string }): ShareText {
  const { t } = createI18n(locale);
  const text: ShareText = {
    kicker: "FAIRWEIGH",
    title: t("brief.versus", name),
    statement: t("statement.moderate.large.increase", name),
    certainty: { label: `${t("brief.certainty")}: ${t("certainty.rating.moderate")}`, rating: "moderate" },
    footer: `${name.brief} · ${t("share.footer", { version: 3 })}`,
    fictional: t("embed.fictional"),
    alt: "",
  };
  return locale === "ar" ? arabicImageText(text)! : text;
}

type Box = { name: string; x: number; y: number; width: number; height: number };

/** Each part drawn alone by the renderer, and the box its ink covers. */
function measuredParts(text: ShareText, rtl: boolean): Box[] {
  return shareImageParts(text, rtl)
    .filter((part) => part.name !== "background")
    .map((part) => {
      const box = new Resvg(shareImageSvg(text, rtl, (name) => name === part.name), renderOptions()).getBBox();
      expect(box, part.name).toBeDefined();
      return { name: part.name, x: box!.x, y: box!.y, width: box!.width, height: box!.height };
    });
}

const overlaps = (a: Box, b: Box) => a.x < b.x + b.width && b.x < a.x + a.width && a.y < b.y + b.height && b.y < a.y + a.height;

describe("the share image of a comparison with 60-character names", () => {
  it.each(["en", "es", "fr", "ar"] as const)("in %s: every part inside the margins, none over another, the names whole", (locale) => {
    const name = names[locale];
    expect([...name.treatment].length).toBe(60);
    expect([...name.comparator].length).toBe(60);
    const text = comparisonImage(locale, name);
    expect(text, "the Arabic image is drawn in Arabic script").toBeTruthy();
    const boxes = measuredParts(text, locale === "ar");
    for (const box of boxes) {
      expect(box.x, `${box.name} starts inside the left margin`).toBeGreaterThanOrEqual(72 - 4);
      expect(box.x + box.width, `${box.name} ends inside the right margin`).toBeLessThanOrEqual(shareImageSize.width - 72 + 4);
      expect(box.y + box.height, `${box.name} ends above the bottom`).toBeLessThanOrEqual(shareImageSize.height - 20);
    }
    for (const [i, a] of boxes.entries()) for (const b of boxes.slice(i + 1)) expect(overlaps(a, b), `${a.name} and ${b.name} overlap`).toBe(false);

    // Shown whole: the drawn lines, joined, are the title and the statement as written.
    const drawn = (part: string) =>
      [...shareImageParts(text, locale === "ar").find((p) => p.name === part)!.svg.matchAll(/>([^<]*)<\/text>/g)].map((m) => m[1]).join(" ").replace(/&amp;/g, "&");
    expect(drawn("title")).toBe(text.title);
    expect(drawn("statement")).toBe(text.statement);
  });

  it("a name of one 60-letter word is cut across lines, still inside the margins", () => {
    const word = "Schlafhygieneberatungsprogrammverwaltungsgesellschaftsmitgli";
    expect(word.length).toBe(60);
    const text = comparisonImage("en", { treatment: word, comparator: word, outcome: "sleep quality", brief: word });
    for (const box of measuredParts(text, false)) expect(box.x + box.width, box.name).toBeLessThanOrEqual(shareImageSize.width - 72 + 4);
  });

  it("short names keep the largest type", () => {
    const text = comparisonImage("en", { treatment: "Light therapy", comparator: "Usual care", outcome: "sleep quality", brief: "Evening light" });
    expect(shareImageParts(text, false).find((p) => p.name === "title")!.svg).toContain('font-size="56"');
  });
});
