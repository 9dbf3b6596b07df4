// The four languages against the production build and the test cluster: addresses and negotiation,
// right-to-left pages, every public page type free of English interface words in es, fr and ar, the
// translation desk's rules (assigned languages, stale sources, publication that leaves the findings
// alone), and citations, the feed and the sitemap naming the language.
import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { slugify } from "#core/publication/slug";
import { demoBriefs } from "#workflows/demo-briefs";
import { withTestDatabase } from "../support/app";
import { approve, publishedBrief } from "../support/briefs";
import { withProductionServer } from "../support/production-server";
import type { Translation } from "#web/api/contract";

const { server, clients } = withProductionServer(["analyst", "editor", "translator"]);
const database = withTestDatabase();

const get = (address: string, headers: Record<string, string> = {}) => fetch(`${server.url}${address}`, { headers, redirect: "manual" });
const small = slugify(demoBriefs()[0]!.title);
const large = slugify(demoBriefs()[1]!.title);

/** What a reader reads: the page's text without its tags, scripts and styles. */
function textOf(html: string): string {
  return html
    .replace(/<(script|style)\b[\s\S]*?<\/\1>/g, " ")
    .replace(/<[^>]+>/g, " ")
    .replace(/&amp;/g, "&")
    .replace(/&quot;/g, '"')
    .replace(/&#x27;|&#39;/g, "'")
    .replace(/&lt;/g, "<")
    .replace(/&gt;/g, ">")
    .replace(/\s+/g, " ");
}

describe("addresses and negotiation", () => {
  it("sends a first visit to / in the browser's language, and says the answer depends on it", async () => {
    const spanish = await get("/", { "accept-language": "es-ES,es;q=0.9,en;q=0.5" });
    expect(spanish.status).toBe(302);
    expect(spanish.headers.get("location")).toBe("/es");
    expect(spanish.headers.get("vary")).toMatch(/Accept-Language/);
    const english = await get("/", { "accept-language": "de-DE,en;q=0.8" });
    expect(english.status).toBe(200);
    expect(english.headers.get("vary")).toMatch(/Accept-Language/);
  });

  it("keeps the language a reader chose over the browser's, and never redirects a prefixed address", async () => {
    const choose = await get(`/language/en?next=${encodeURIComponent(`/briefs/${small}`)}`);
    expect(choose.status).toBe(303);
    expect(choose.headers.get("location")).toBe(`/briefs/${small}`);
    const cookie = choose.headers.get("set-cookie")!.split(";")[0]!;
    expect((await get(`/briefs/${small}`, { "accept-language": "fr", cookie })).status).toBe(200);
    expect((await get(`/fr/briefs/${small}`, { "accept-language": "ar" })).status).toBe(200);
    const arabic = await get(`/language/ar?next=${encodeURIComponent(`/briefs/${small}?x=1`)}`);
    expect(arabic.headers.get("location")).toBe(`/ar/briefs/${small}?x=1`);
    // Only addresses of this site: anything else goes home.
    expect((await get(`/language/es?next=${encodeURIComponent("//elsewhere.example/")}`)).headers.get("location")).toBe("/es");
    expect((await get("/language/de?next=/")).status).toBe(404);
  });

  it("serves the Arabic brief right to left, with Arabic statements and every language as an alternate", async () => {
    const response = await get(`/ar/briefs/${small}/v/1`);
    expect(response.status).toBe(200);
    const html = await response.text();
    expect(html).toMatch(/<html[^>]*\bdir="rtl"/);
    expect(html).toMatch(/<html[^>]*\blang="ar"/);
    // A generated statement in Arabic with the treatment's (translated) name isolated.
    expect(html).toMatch(/(يُرجَّح أن يؤدي|يُحتمل أن|قد )[^<]*<bdi>[^<]+<\/bdi>/);
    expect(html).toContain("مقارنةً بـ");
    for (const [lang, href] of [["en", `/briefs/${small}/v/1`], ["es", `/es/briefs/${small}/v/1`], ["fr", `/fr/briefs/${small}/v/1`], ["ar", `/ar/briefs/${small}/v/1`], ["x-default", `/briefs/${small}/v/1`]]) {
      expect(html).toMatch(new RegExp(`<link rel="alternate" hrefLang="${lang}" href="${server.url}${href!.replace(/[/.]/g, "\\$&")}"`, "i"));
    }
    // The canonical permalink is the Arabic one; the numbers keep Latin digits (docs/decisions/0024-arabic-digits.md).
    expect(html).toContain(`<link rel="canonical" href="${server.url}/ar/briefs/${small}/v/1"`);
    expect(textOf(html)).toMatch(/\d\.\d\d \(\d\.\d\d إلى \d\.\d\d\)/);
  });

  it("writes numbers with a decimal comma in Spanish and French", async () => {
    for (const [locale, to] of [["es", "a"], ["fr", "à"]]) {
      const text = textOf(await (await get(`/${locale}/briefs/${small}/v/1`)).text());
      expect(text).toMatch(new RegExp(`\\d,\\d\\d \\(\\d,\\d\\d ${to} \\d,\\d\\d\\)`));
      expect(text).not.toMatch(/\d\.\d\d \(\d\.\d\d/);
    }
  });
});

describe("every public page type in every language", () => {
  const english = JSON.parse(readFileSync(path.resolve(__dirname, "../../locales/en/public.json"), "utf8"));
  const strings = (value: unknown): string[] => (typeof value === "string" ? [value] : Object.values(value as object).flatMap(strings));
  // The English interface's phrases: each string's words between placeholders, where there are at
  // least three; the one shared by every language is the product's name after a closing bracket.
  const phrases = [...new Set(strings(english).flatMap((text) => text.split(/\{\{[^}]+\}\}/)))]
    .map((part) => part.trim().replace(/[.:;,]$/, ""))
    .filter((part) => part.split(/\s+/).length >= 3 && part !== ") · Fairweigh");

  // Each page, the status it must answer, and in each language its heading and section headings as a
  // reader sees them (written out here by hand, not read from the locale files): an untranslated or
  // broken page fails. Every page ends with the caution.
  const caution = { es: "Lea esto, por favor", fr: "À lire, s’il vous plaît", ar: "يُرجى قراءة هذا" };
  type Headings = { h1: string; h2: string[] };
  const pages: { page: string; status: number; es: Headings; fr: Headings; ar: Headings }[] = [
    {
      page: "",
      status: 200,
      es: { h1: "Metaanálisis en red, publicados para leerse con justicia", h2: ["Últimos resúmenes", "Temas"] },
      fr: { h1: "Des méta-analyses en réseau, publiées pour être lues équitablement", h2: ["Dernières synthèses", "Thèmes"] },
      ar: { h1: "تحليلات تلوية شبكية تُنشر لتُقرأ بإنصاف", h2: ["أحدث الملخصات", "المواضيع"] },
    },
    { page: "/briefs", status: 200, es: { h1: "Resúmenes", h2: [] }, fr: { h1: "Synthèses", h2: [] }, ar: { h1: "الملخصات", h2: [] } },
    { page: "/briefs?q=sleep", status: 200, es: { h1: "Resúmenes", h2: [] }, fr: { h1: "Synthèses", h2: [] }, ar: { h1: "الملخصات", h2: [] } },
    {
      page: "/topics/sleep",
      status: 200,
      es: { h1: "Tema: Sueño", h2: ["Alertas por correo sobre Sueño"] },
      fr: { h1: "Thème : Sommeil", h2: ["Alertes par courriel sur Sommeil"] },
      ar: { h1: "الموضوع: النوم", h2: ["تنبيهات بالبريد عن النوم"] },
    },
    {
      page: `/briefs/${small}`,
      status: 200,
      es: { h1: "Dormir bien después del turno de noche (demostración ficticia)", h2: ["En pocas palabras", "Qué significa"] },
      fr: { h1: "Bien dormir après le travail de nuit (démonstration fictive)", h2: ["En bref", "Ce que cela signifie"] },
      ar: { h1: "النوم الجيد بعد نوبات العمل الليلية (عرض توضيحي خيالي)", h2: ["باختصار", "ماذا يعني هذا"] },
    },
    {
      page: `/briefs/${large}/v/1`,
      status: 200,
      es: { h1: "Alivio de una cefalea tensional corriente: 22 opciones comparadas (demostración ficticia)", h2: ["En pocas palabras", "Qué significa"] },
      fr: { h1: "Soulager une céphalée de tension ordinaire : 22 options comparées (démonstration fictive)", h2: ["En bref", "Ce que cela signifie"] },
      ar: { h1: "تخفيف صداع التوتر اليومي: مقارنة 22 خيارًا (عرض توضيحي خيالي)", h2: ["باختصار", "ماذا يعني هذا"] },
    },
    {
      page: `/briefs/${small}/v/1/compare/combined/usual_care`,
      status: 200,
      es: { h1: "Sesiones de luz con plan de siestas frente a Atención habitual", h2: ["Buen sueño la mayoría de los días a las 4 semanas", "Puntuación de somnolencia diurna (0 a 100) a las 4 semanas"] },
      fr: { h1: "Séances de lumière avec programme de siestes contre Soins habituels", h2: ["Bon sommeil la plupart des jours à 4 semaines", "Score de somnolence diurne (0 à 100) à 4 semaines"] },
      ar: { h1: "جلسات الضوء مع جدول القيلولة مقابل الرعاية المعتادة", h2: ["نوم جيد في معظم الأيام بعد 4 أسابيع", "درجة النعاس النهاري (من 0 إلى 100) بعد 4 أسابيع"] },
    },
    { page: "/sign-in", status: 200, es: { h1: "Iniciar sesión", h2: [] }, fr: { h1: "Se connecter", h2: [] }, ar: { h1: "تسجيل الدخول", h2: [] } },
    { page: "/password-reset", status: 200, es: { h1: "Restablecer la contraseña", h2: [] }, fr: { h1: "Réinitialiser votre mot de passe", h2: [] }, ar: { h1: "إعادة تعيين كلمة المرور", h2: [] } },
    { page: "/subscriptions/done?what=sent", status: 200, es: { h1: "Alertas por correo", h2: [] }, fr: { h1: "Alertes par courriel", h2: [] }, ar: { h1: "التنبيهات بالبريد", h2: [] } },
    {
      page: "/data",
      status: 200,
      es: { h1: "Datos para reutilizar", h2: ["Qué se puede leer", "Qué no cambia", "Licencia y cita"] },
      fr: { h1: "Données à réutiliser", h2: ["Ce que l’on peut lire", "Ce qui ne change pas", "Licence et citation"] },
      ar: { h1: "بيانات لإعادة الاستخدام", h2: ["ما يمكن قراءته", "ما لا يتغير", "الترخيص والاستشهاد"] },
    },
    { page: "/no-such-page", status: 404, es: { h1: "Página no encontrada", h2: [] }, fr: { h1: "Page introuvable", h2: [] }, ar: { h1: "الصفحة غير موجودة", h2: [] } },
  ];
  const headings = (html: string, level: "h1" | "h2") => [...html.matchAll(new RegExp(`<${level}[^>]*>([\\s\\S]*?)</${level}>`, "g"))].map((match) => textOf(match[1]!).trim());

  it.each(["es", "fr", "ar"] as const)("%s: every page answers as it should, in the language, with no English interface phrase", async (locale) => {
    for (const entry of pages) {
      const response = await get(`/${locale}${entry.page}`);
      expect(response.status, entry.page).toBe(entry.status);
      const html = await response.text();
      expect(headings(html, "h1"), `${locale}${entry.page}`).toEqual([entry[locale].h1]);
      expect(headings(html, "h2").slice(0, entry[locale].h2.length), `${locale}${entry.page}`).toEqual(entry[locale].h2);
      expect(headings(html, "h2"), `${locale}${entry.page}`).toContain(caution[locale]);
      const text = textOf(html);
      expect(phrases.filter((phrase) => text.includes(phrase)), `${locale}${entry.page}`).toEqual([]);
    }
  });
});

describe("the translation desk", () => {
  it("lets a translator work only in the languages assigned to them, and never publish", async () => {
    const { slug } = await publishedBrief(clients.analyst!, clients.editor!, "Translated brief");
    const { rows } = await database.query("select v.id from brief_versions v join briefs b on b.id = v.brief_id where b.slug = $1", [slug]);
    const versionId = rows[0].id as string;
    const translator = clients.translator!;
    expect((await translator.request("GET", `/api/translations/${versionId}/ar`)).status).toBe(403);
    expect((await translator.request("PUT", `/api/translations/${versionId}/ar`, { json: { fields: { title: "عنوان" } } })).status).toBe(403);
    const view = await translator.request("GET", `/api/translations/${versionId}/es`);
    expect(view.status).toBe(200);
    expect((view.body.translation as Translation).state).toBe("missing");
    // Nor the findings, nor publishing: those belong to analysts and editors.
    expect((await translator.request("POST", `/api/translations/${versionId}/es/publish`)).status).toBe(403);
    const brief = await clients.editor!.request("GET", "/api/briefs");
    const id = (brief.body.briefs as { id: string; slug: string }[]).find((b) => b.slug === slug)!.id;
    expect((await translator.request("PATCH", `/api/briefs/${id}`, { json: { rowVersion: 1, title: "x" } })).status).toBe(403);
    const queue = await translator.request("GET", "/api/translations");
    expect(queue.body.locales).toEqual(["es", "fr"]);
  });

  it("publishes a translation beside the version, leaving its snapshot byte for byte; a changed source shows what changed", async () => {
    const analyst = clients.analyst!;
    const editor = clients.editor!;
    const translator = clients.translator!;
    const { briefId, slug } = await publishedBrief(analyst, editor, "Brief to translate twice");
    const versionOf = async (number: number) =>
      (await database.query("select v.id, md5(v.snapshot::text) as hash from brief_versions v where v.brief_id = $1 and v.number = $2", [briefId, number])).rows[0] as { id: string; hash: string };
    const v1 = await versionOf(1);
    const audited = async () => Number((await database.query("select count(*) from audit_log where entity_id = $1 and action like 'translation.%'", [v1.id])).rows[0].count);

    const source = ((await translator.request("GET", `/api/translations/${v1.id}/es`)).body.translation as Translation).fields;
    const targets = Object.fromEntries(source.map((field) => [field.name, field.name === "summary" ? "Resumen de prueba: el asesoramiento **podría** ayudar a dejar de fumar." : `ES ${field.text}`]));
    expect((await translator.request("PUT", `/api/translations/${v1.id}/es`, { json: { fields: targets } })).status).toBe(200);
    const ready = await translator.request("POST", `/api/translations/${v1.id}/es/ready`);
    expect(ready.status).toBe(200);
    expect((ready.body.translation as Translation).state).toBe("ready");
    const published = await editor.request("POST", `/api/translations/${v1.id}/es/publish`);
    expect(published.status).toBe(200);
    expect((published.body.translation as Translation).publishedAt).toBeTruthy();
    expect(await audited()).toBe(3);
    expect((await versionOf(1)).hash).toBe(v1.hash);

    const page = await (await get(`/es/briefs/${slug}/v/1`)).text();
    expect(page).toContain("el asesoramiento <strong>podría</strong> ayudar");
    expect(page).toContain("ES Brief to translate twice");
    expect(textOf(page)).toMatch(/Esta traducción se publicó el \d+ de \w+ de \d{4}/);
    // French has no translation yet: the original texts, a notice in French, generated words in French.
    const french = textOf(await (await get(`/fr/briefs/${slug}/v/1`)).text());
    expect(french).toContain("ne sont pas encore traduits en français");
    expect(french).toContain("Test summary: counselling may help people stop smoking.");
    expect(french).toContain("Ce que soutiennent les données probantes");

    // A correction changes the summary: version 2's Spanish starts from version 1's, flagged where the source changed.
    const current = await editor.request("GET", `/api/briefs/${briefId}`);
    const rowVersion = (current.body.brief as { rowVersion: number }).rowVersion;
    expect((await editor.request("PATCH", `/api/briefs/${briefId}`, { json: { rowVersion, laySummary: "Test summary: group counselling may help people stop smoking." } })).status).toBe(200);
    await approve(analyst, editor, briefId);
    expect((await editor.request("POST", `/api/briefs/${briefId}/versions`, { json: { note: "The summary names group counselling." } })).status).toBe(201);
    const v2 = await versionOf(2);
    // Carried when version 2 was frozen: its own draft already, partly published (tests/integration/brief-through-time.test.ts).
    const carried = (await translator.request("GET", `/api/translations/${v2.id}/es`)).body.translation as Translation;
    expect(carried.state).toBe("draft");
    expect(carried.carriedFrom).toBe(false);
    expect(carried.publishedAt).not.toBeNull();
    const summary = carried.fields.find((field) => field.name === "summary")!;
    expect(summary.stale).toBe(true);
    expect(summary.target).toContain("Resumen de prueba");
    expect(summary.diff?.filter((part) => part.change === "added").map((part) => part.text.trim())).toEqual(["group"]);
    expect(carried.fields.find((field) => field.name === "title")!.stale).toBe(false);
    // The correction note is new: nothing translated yet.
    expect(carried.fields.find((field) => field.name === "note")).toMatchObject({ target: "", stale: false });
    const refused = await translator.request("POST", `/api/translations/${v2.id}/es/ready`);
    expect(refused.status).toBe(409);
    expect(refused.body.error?.key).toBe("errors.translation.unfinished");
    // Version 1's Spanish page is untouched by all this.
    expect(await (await get(`/es/briefs/${slug}/v/1`)).text()).toContain("el asesoramiento <strong>podría</strong> ayudar");
  });
});

describe("files that name the language", () => {
  it("cites the same version from every language, naming the one it was read in", async () => {
    const english = await (await get(`/briefs/${small}/v/1/cite.ris`)).text();
    const spanish = await (await get(`/es/briefs/${small}/v/1/cite.ris`)).text();
    expect(spanish).toContain(`UR  - ${server.url}/es/briefs/${small}/v/1`);
    expect(spanish).toMatch(/^LA {2}- es$/m);
    const id = (ris: string) => /^ID {2}- (.*)$/m.exec(ris)![1];
    expect(id(spanish)).toBe(id(english));
  });

  it("names a cited comparison in the reader's language, not “A vs B” in every language", async () => {
    const spanish = await (await get(`/es/briefs/${small}/v/1/compare/light/usual_care/cite.ris`)).text();
    expect(spanish).toMatch(/^TI {2}- .* frente a .*$/m);
    expect(spanish).not.toMatch(/^TI {2}- .* vs .*$/m);
    const arabic = await (await get(`/ar/briefs/${small}/v/1/compare/light/usual_care/cite.ris`)).text();
    expect(arabic).toMatch(/^TI {2}- .* مقابل .*$/m);
  });

  it("has a feed per language and a sitemap with every language's alternates", async () => {
    const feed = await (await get("/fr/feed.xml")).text();
    expect(feed).toContain('xml:lang="fr"');
    expect(feed).toContain("Fairweigh : synthèses nouvelles, corrigées et retirées");
    // Links lead to the French pages; an entry's id names the version, the same in every language.
    expect(feed).toMatch(new RegExp(`<link href="${server.url}/fr/briefs/[^"]+/v/\\d+"/>`));
    expect(feed).not.toMatch(/<id>[^<]*\/fr\//);
    const sitemap = await (await get("/sitemap.xml")).text();
    expect(sitemap).toContain(`<loc>${server.url}/ar/briefs/${small}</loc>`);
    expect(sitemap).toContain(`<xhtml:link rel="alternate" hreflang="x-default" href="${server.url}/briefs/${small}"/>`);
  });
});
