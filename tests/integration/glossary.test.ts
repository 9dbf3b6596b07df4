// The glossary against the production build: one page per language with every term under its own
// anchor, the confidence interval defined as an interval from a method (not a 95% chance), and each
// term linked from its first use on a brief's, a comparison's and a side-by-side page — once only.
import { describe, expect, it } from "vitest";
import { slugify } from "#core/publication/slug";
import { demoBriefs } from "#workflows/demo-briefs";
import { glossaryTerms } from "#core/publication/glossary";
import { withProductionServer } from "../support/production-server";

const { server } = withProductionServer();
const small = slugify(demoBriefs()[0]!.title);
const get = (path: string) => fetch(`${server.url}${path}`, { redirect: "manual" });

/** The glossary links of a page, in reading order, as [term, address]. */
const termLinks = (html: string) => [...html.matchAll(/<a href="([^"]+)"[^>]*data-term="([^"]+)"/g)].map((m) => [m[2], m[1]]);

describe("the glossary page", () => {
  // Written out by hand in each language: what a 95% confidence interval is, and what it is not.
  const definitions = {
    en: "It is computed by a method that, if the studies could be repeated many times, would give a range containing the true effect 95 times out of 100. It does not mean that there is a 95% chance that the true effect lies in this particular range.",
    es: "Se calcula con un método que, si los estudios pudieran repetirse muchas veces, daría intervalos que contienen el efecto real 95 de cada 100 veces. No significa que haya un 95 % de probabilidad de que el efecto real esté en este intervalo concreto.",
    fr: "Elle est calculée par une méthode qui, si les études pouvaient être répétées un grand nombre de fois, donnerait des fourchettes contenant l’effet réel 95 fois sur 100. Cela ne veut pas dire que l’effet réel a 95 % de chances de se trouver dans cette fourchette-ci.",
    ar: "يُحسب بطريقة لو أمكن تكرار الدراسات مرات كثيرة لأعطت مدى يحتوي على الأثر الحقيقي في 95 مرة من كل 100 مرة. ولا يعني ذلك أن احتمال وقوع الأثر الحقيقي في هذا المدى بعينه هو 95٪.",
  };

  it.each(Object.entries(definitions))("defines every term in %s, the confidence interval correctly", async (locale, definition) => {
    const answer = await get(locale === "en" ? "/glossary" : `/${locale}/glossary`);
    expect(answer.status).toBe(200);
    const html = await answer.text();
    expect([...html.matchAll(/<div id="([a-z0-9-]+)" class="scroll-mt-6/g)].map((m) => m[1])).toEqual([...glossaryTerms]);
    expect(html).toContain(definition);
    expect(html).toContain(locale === "ar" ? 'dir="rtl"' : 'dir="ltr"');
  });

  it("names the terms in the reader's language", async () => {
    expect(await (await get("/glossary")).text()).toContain("<dt class=\"text-2xl font-semibold\">Incoherence</dt>");
    expect(await (await get("/es/glossary")).text()).toContain("<dt class=\"text-2xl font-semibold\">Riesgo de sesgo</dt>");
    expect(await (await get("/fr/glossary")).text()).toContain("<dt class=\"text-2xl font-semibold\">Estimation indirecte</dt>");
    expect(await (await get("/ar/glossary")).text()).toContain("<dt class=\"text-2xl font-semibold\">عدم التجانس</dt>");
  });

  it("is in the sitemap and the footer of every page", async () => {
    const sitemap = await (await get("/sitemap.xml")).text();
    expect(sitemap).toMatch(/<loc>[^<]+\/fr\/glossary<\/loc>/);
    expect(await (await get(`/briefs/${small}/v/1`)).text()).toMatch(/<a href="\/glossary">Glossary<\/a>/);
  });
});

describe("links from a term's first use", () => {
  it("links each term of a brief's page once, at its first use, in the reader's language", async () => {
    // The order a reader meets them: a group's certainty, the estimates' key above the chart, the
    // baseline under the table, then risk of bias, rank scores and the methods' heterogeneity and incoherence.
    const order = ["certainty", "network-estimate", "confidence-interval", "per-1000", "risk-of-bias", "rank-scores", "heterogeneity", "incoherence"];
    expect(termLinks(await (await get(`/briefs/${small}/v/1`)).text())).toEqual(order.map((term) => [term, `/glossary#${term}`]));
    const arabic = await (await get(`/ar/briefs/${small}/v/1`)).text();
    expect(termLinks(arabic)).toEqual(order.map((term) => [term, `/ar/glossary#${term}`]));
    // The words around the links read as one sentence.
    expect(arabic).toMatch(/<a href="\/ar\/glossary#network-estimate"[^>]*>التقدير الشبكي<\/a> لكل خيار، مع <a href="\/ar\/glossary#confidence-interval"[^>]*>فترة الثقة 95٪<\/a>، و/);
  });

  it("links the terms of a comparison page and of a side-by-side page once each", async () => {
    const comparison = await (await get(`/fr/briefs/${small}/v/1/compare/light/usual_care`)).text();
    expect(termLinks(comparison).map(([term]) => term)).toEqual(["confidence-interval", "per-1000", "certainty", "direct-estimate", "indirect-estimate", "network-estimate", "risk-of-bias"]);
    expect(comparison).toContain('<a href="/fr/glossary#direct-estimate" class="decoration-dotted underline-offset-2" data-term="direct-estimate">Directes (essais comparant les deux)</a>');
    const sideBySide = await (await get(`/es/briefs/${small}/v/1/side-by-side?options=light,nap_plan`)).text();
    expect(termLinks(sideBySide).map(([term]) => term)).toEqual(["confidence-interval", "per-1000", "certainty"]);
  });
});
