// Words a reader or a colleague is told, pinned as sentences written out by hand: each of these once
// said something untrue or ungrammatical (a rank score "ignoring" intervals, a French interval that
// "crosses" when it does not, "no difference per 1000" for an interval from 30 fewer to 25 more…).
import { describe, expect, it } from "vitest";
import { createI18n } from "#components/i18n";
import { messageText } from "#components/Message";
import { imprecisionSuggestion } from "#core/grade/certainty";
import { absoluteStatement } from "#core/grade/statements";
import { releaseAlertMessage, translationRequestMessage } from "#core/languages/mail";
import { readability } from "#core/editorial/readability";

const say = (locale: "en" | "es" | "fr" | "ar") => {
  const { t } = createI18n(locale);
  return (message: { key: string; values: Record<string, string | number> }) => messageText(t, locale, message);
};
const none = { small: null, moderate: null, large: null };

describe("imprecision: whether the interval crosses is said by the rule, not by a plural form", () => {
  it("in French, an interval clear of the line does not cross it (French counts 0 as singular)", () => {
    expect(say("fr")(imprecisionSuggestion({ lower: 0.1, upper: 0.5 }, none).because)).toBe("L’intervalle de confiance à 95 % ne franchit pas la ligne d’absence d’effet.");
    expect(say("fr")(imprecisionSuggestion({ lower: -0.1, upper: 0.5 }, none).because)).toBe("L’intervalle de confiance à 95 % franchit la ligne d’absence d’effet.");
  });

  it("in English, Spanish and Arabic, both ways, and thresholds counted", () => {
    expect(say("en")(imprecisionSuggestion({ lower: 0.1, upper: 0.5 }, none).because)).toBe("The 95% confidence interval does not cross the line of no effect.");
    expect(say("es")(imprecisionSuggestion({ lower: -0.1, upper: 0.5 }, none).because)).toBe("El intervalo de confianza del 95 % cruza la línea de ausencia de efecto.");
    // Arabic: "crosses" (تعبر), not "exceeds" (تتجاوز).
    expect(say("ar")(imprecisionSuggestion({ lower: -0.1, upper: 0.5 }, none).because)).toBe("فترة الثقة 95٪ تعبر خط انعدام الأثر.");
    expect(say("ar")(imprecisionSuggestion({ lower: 0.1, upper: 0.5 }, none).because)).toBe("فترة الثقة 95٪ لا تعبر خط انعدام الأثر.");
    const thresholds = { small: 10, moderate: 30, large: null };
    expect(say("en")(imprecisionSuggestion({ lower: 5, upper: 35 }, thresholds).because)).toBe("The 95% confidence interval crosses 2 decision thresholds.");
    expect(say("fr")(imprecisionSuggestion({ lower: 12, upper: 25 }, thresholds).because)).toBe("L’intervalle de confiance à 95 % ne franchit aucun seuil de décision.");
  });
});

describe("an absolute effect that rounds to none", () => {
  it("reads “0 fewer per 1000”, with its interval, never “no difference”", () => {
    const effect = absoluteStatement({ estimate: -0.3, lower: -30.2, upper: 24.6 });
    expect(say("en")(effect)).toBe("0 fewer per 1000 (from 30 fewer to 25 more)");
    expect(say("es")(effect)).toBe("0 menos por cada 1000 (de 30 menos a 25 más)");
    expect(say("fr")(effect)).toBe("0 de moins pour 1000 (de 30 de moins à 25 de plus)");
    expect(say("ar")(effect)).toBe("أقل بـ0 لكل 1000 (من أقل بـ30 إلى أكثر بـ25)");
  });

  it("reads the same in versions frozen with the old “same” key", () => {
    expect(say("en")({ key: "statement.absolute.same", values: { count: 0, from: "30 fewer", to: "25 more" } })).toBe("0 fewer per 1000 (from 30 fewer to 25 more)");
  });
});

describe("cautions on the brief page", () => {
  const { t } = createI18n("en");
  it("says that rank scores hide the width of the intervals, not that they ignore it", () => {
    expect(t("rankScores.caution.chance")).toBe(
      "Chance: each score folds the uncertainty of every estimate into one number and hides how wide the confidence intervals are; two treatments with different scores may not differ at all.",
    );
  });

  it("describes the scores on their 0–1 scale, in French and Arabic too (not “first place” nor “number of times”)", () => {
    // The sentence as read: its glossary link's tags (<term>…</term>) are not words.
    const read = (text: string) => text.replace(/<\/?[a-z0-9]+>/g, "");
    expect(read(createI18n("fr").t("rankScores.intro"))).toMatch(/^Les P-scores et le SUCRA situent chaque traitement sur une échelle de 0 à 1 par rapport à tous les autres \(1 : devant tous les autres traitements à chaque tirage ; 0 : derrière tous\)\./);
    expect(read(createI18n("ar").t("rankScores.intro"))).toMatch(/^تضع درجات P ودرجات SUCRA كل علاج على مقياس من 0 إلى 1 مقارنةً بسائر العلاجات/);
  });

  it("speaks of this outcome's effects, wherever the warning stands, and of designs that disagree, not that point in different directions", () => {
    expect(t("brief.plainWarnings.heterogeneity", { I2: 62 })).toBe(
      "The trials' results vary more than chance alone would explain (I² = 62%): the effects shown for this outcome are averages over studies that disagree, so the effect in any one setting may differ.",
    );
    expect(t("brief.plainWarnings.inconsistency", { p: 0.01 })).toBe(
      "Trials of different designs disagree more than chance alone would explain (p = 0.01): treat comparisons that rest on indirect evidence with extra care.",
    );
  });
});

describe("Arabic keeps the health outcome apart from the results", () => {
  it("names an outcome “النتيجة الصحية”, and results “النتائج”", () => {
    const { t } = createI18n("ar");
    expect(t("brief.outcomesNav")).toBe("النتائج الصحية في هذا الملخص");
    expect(t("brief.methods")).toBe("المنهجية والحواشي لهذه النتيجة الصحية");
    expect(t("brief.download.results_csv")).toBe("نتائج كل مقارنة (CSV)");
  });
});

describe("the desk counts in words", () => {
  const { t } = createI18n("en");
  it("“1 comparison”, and levels without “(s)”", () => {
    expect(t("desk.pendingCount", { count: 1 })).toBe("1 comparison still needs a judgement.");
    expect(t("desk.pendingCount", { count: 3 })).toBe("3 comparisons still need a judgement.");
    expect(t("desk.suggested.none")).toBe("Suggested: no change.");
    expect(t("desk.suggested.down", { count: 1 })).toBe("Suggested: 1 level down.");
    expect(t("desk.suggested.down", { count: 2 })).toBe("Suggested: 2 levels down.");
    expect(createI18n("fr").t("desk.suggested.down", { count: 2 })).toBe("Suggéré : abaisser de 2 niveaux.");
  });
});

describe("e-mails", () => {
  const version = { title: "Light and sleep", number: 2, releaseAt: new Date("2026-12-04T09:00:00Z"), note: null };
  it("name the languages to translate into in the reader's language, not their codes", () => {
    const english = translationRequestMessage({ email: "t@x.example", displayName: "T", translationLocales: ["es", "fr"] }, version, "https://x.example/desk");
    expect(english.text).toContain("Version 2 of “Light and sleep” is released. It is waiting for your translation into Spanish and French.");
    const spanish = translationRequestMessage({ email: "t@x.example", displayName: "T", locale: "es", translationLocales: ["es", "fr"] }, version, "https://x.example/desk");
    expect(spanish.text).toContain("Espera su traducción al español y francés.");
  });

  it("say when a version was released, not that it “is public since”", () => {
    const alert = releaseAlertMessage({ email: "p@x.example", displayName: "P" }, version, "https://x.example/b");
    expect(alert.text).toContain("“Light and sleep” (version 2) was released on December 4, 2026 at 9:00 AM (UTC).");
  });
});

describe("the plain-language check uses the interface's own terms and defines a confidence interval correctly", () => {
  it("defines a 95% confidence interval by how often such intervals contain the true effect", () => {
    expect(readability("The confidence interval is wide.", "en").jargon).toEqual([
      { term: "confidence interval", plain: "a range worked out from the data; 95 of every 100 ranges worked out this way contain the true effect" },
    ]);
  });

  it("fires on the Spanish and Arabic terms the pages use", () => {
    expect(readability("Un metaanálisis en red.", "es").jargon.map((j) => j.term)).toEqual(["metaanálisis en red"]);
    expect(readability("نسبة الخطر 1.2.", "ar").jargon.map((j) => j.term)).toEqual(["نسبة الخطر"]);
  });
});
