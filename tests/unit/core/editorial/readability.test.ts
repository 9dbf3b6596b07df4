// The plain-language check of the desk (server/core/editorial/readability.ts): reading-ease figures by the
// published formulas, long sentences and jargon.
import { describe, expect, it } from "vitest";
import { countsOf, easeBand, readability, readingEase } from "#core/editorial/readability";

describe("Flesch Reading Ease (Flesch 1948), on the published example passages", () => {
  it("“The cat sat on the mat.” scores 116.145 (1 sentence, 6 words, 6 syllables; the example of the flesch package's documentation)", () => {
    const report = readability("The cat sat on the mat.", "en");
    expect(report.counts).toEqual({ sentences: 1, words: 6, syllables: 6 });
    expect(report.score).toBeCloseTo(116.145, 3);
    expect(report.band).toBe("veryEasy");
  });

  it("“The Australian platypus is seemingly a hybrid of mammal and reptilian creature.” scores 32.505 from its published counts (1 sentence, 12 words, 23 syllables; same source)", () => {
    expect(readingEase("flesch", { sentences: 1, words: 12, syllables: 23 })).toBeCloseTo(32.505, 3);
    // Counting by rule finds 25 syllables here ("Aus-tra-li-an", "rep-ti-li-an"): an approximation the interface shows as such.
    const counted = countsOf("The Australian platypus is seemingly a hybrid of mammal and reptilian creature.", "en");
    expect(counted).toMatchObject({ sentences: 1, words: 12 });
    expect(Math.abs(counted.syllables - 23)).toBeLessThanOrEqual(2);
  });
});

describe("the adaptations for Spanish and French (formulas as published, worked by hand)", () => {
  it("Szigriszt-Pazos: 206.835 − 62.3·(syllables/words) − words/sentences", () => {
    // 2 sentences, 20 words, 40 syllables: 206.835 − 124.6 − 10 = 72.235, "bastante fácil" on the INFLESZ scale.
    expect(readingEase("szigriszt-pazos", { sentences: 2, words: 20, syllables: 40 })).toBeCloseTo(72.235, 6);
    expect(easeBand("szigriszt-pazos", 72.235)).toBe("fairlyEasy");
  });

  it("Kandel & Moles: 207 − 1.015·(words/sentences) − 73.6·(syllables/words)", () => {
    // 2 sentences, 20 words, 30 syllables: 207 − 10.15 − 110.4 = 86.45.
    expect(readingEase("kandel-moles", { sentences: 2, words: 20, syllables: 30 })).toBeCloseTo(86.45, 6);
  });

  it("counts Spanish and French syllables by vowel groups", () => {
    expect(countsOf("El paciente duerme mejor.", "es")).toEqual({ sentences: 1, words: 4, syllables: 8 }); // el · pa·cien·te · duer·me · me·jor
    expect(countsOf("Le patient dort mieux.", "fr")).toEqual({ sentences: 1, words: 4, syllables: 5 }); // le·pa·tient·dort·mieux
  });
});

describe("advice, never a block", () => {
  it("says that no standard formula is used for Arabic, and still finds jargon", () => {
    const report = readability("النتيجة ذو دلالة إحصائية.", "ar");
    expect(report.formula).toBeNull();
    expect(report.score).toBeNull();
    expect(report.jargon.map((j) => j.term)).toEqual(["ذو دلالة إحصائية"]);
  });

  it("points out the longest sentences and the jargon with a plainer phrasing", () => {
    const long = `The network meta-analysis found that the light sessions were statistically significant compared with usual care for people who work at night and who sleep badly after their shifts in the week.`;
    const report = readability(`${long} Short one.`, "en");
    expect(report.longest).toEqual([{ sentence: long, words: 32 }]); // "meta-analysis" is two words
    expect(report.jargon.map((j) => j.term)).toEqual(["statistically significant", "network meta-analysis"]);
    // Shortening the sentence raises the figure.
    expect(readability("Light sessions helped. Short one.", "en").score!).toBeGreaterThan(report.score!);
  });

  it("glosses a randomised trial as chance deciding who gets which treatment, in each language", () => {
    expect(readability("A randomised controlled trial.", "en").jargon).toEqual([{ term: "randomised controlled trial", plain: "a trial in which chance decides who gets which treatment" }]);
    expect(readability("Un ensayo controlado aleatorizado.", "es").jargon).toEqual([{ term: "ensayo controlado aleatorizado", plain: "un ensayo en el que el azar decide quién recibe cada tratamiento" }]);
    expect(readability("Un essai contrôlé randomisé.", "fr").jargon).toEqual([{ term: "essai contrôlé randomisé", plain: "un essai où le hasard décide qui reçoit quel traitement" }]);
    expect(readability("تجربة معشاة ذات شواهد.", "ar").jargon).toEqual([{ term: "تجربة معشاة ذات شواهد", plain: "تجربة تحدد فيها الصدفة من يتلقى كل علاج" }]);
  });

  it("reads Markdown as text: list items are sentences, links count by their words", () => {
    expect(countsOf("- First point\n- Second [point](https://example.org)\n", "en")).toMatchObject({ sentences: 2, words: 4 });
  });
});
