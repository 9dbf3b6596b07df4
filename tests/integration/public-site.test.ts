// The public site against the production build (as `npm start` serves it) and the test cluster:
// caching of released versions, the embargo, withdrawal, citations, downloads, feed and sitemap.
import { gzipSync } from "node:zlib";
import { parse } from "csv-parse/sync";
import { Cite } from "@citation-js/core";
import "@citation-js/plugin-bibtex";
import "@citation-js/plugin-ris";
import { xml2js } from "xml-js";
import { describe, expect, it } from "vitest";
import { slugify } from "#core/publication/slug";
import { demoBriefs } from "#workflows/demo-briefs";
import { analysedBrief, approve, publishedBrief } from "../support/briefs";
import { withProductionServer } from "../support/production-server";

const { server, clients } = withProductionServer(["analyst", "editor", "press"]);

const get = (path: string, headers: Record<string, string> = {}) => fetch(`${server.url}${path}`, { headers, redirect: "manual" });
const small = slugify(demoBriefs()[0]!.title);
const large = slugify(demoBriefs()[1]!.title);

describe("a released version's page", () => {
  it("is the same HTML on two requests, with an ETag that a revalidation answers with 304", async () => {
    const first = await get(`/briefs/${small}/v/1`);
    const second = await get(`/briefs/${small}/v/1`);
    expect(first.status).toBe(200);
    const html = await first.text();
    expect(await second.text()).toBe(html);
    const etag = first.headers.get("etag")!;
    expect(etag).toMatch(/^W\/".+"$/);
    expect(second.headers.get("etag")).toBe(etag);
    expect(first.headers.get("cache-control")).toBe("public, max-age=3600");
    // fetch marks a conditional request "no-cache", which asks for the full answer; a browser revalidating sends max-age=0.
    const revalidated = await get(`/briefs/${small}/v/1`, { "if-none-match": etag, "cache-control": "max-age=0" });
    expect(revalidated.status).toBe(304);
  });

  it("holds everything in the server's HTML: groups, statements' certainty, the caution, the demo banner, the citation", async () => {
    const html = await (await get(`/briefs/${small}/v/1`)).text();
    expect(html).toContain("Fictional demonstration data.");
    expect(html).toContain("What the evidence supports");
    // Sleep aid K is rated moderate against usual care: its group is hedged, and usual care is named as a sentence names it.
    expect(html).toContain("Probably a large benefit compared with <bdi>usual care</bdi>");
    expect(html).toContain("Rank scores, and why they are not proof");
    expect(html).toContain("It is not medical advice");
    expect(html).toMatch(/Fairweigh\. \(\d{4}\)\. Sleeping well after night shifts \(fictional demonstration\) \(Version 1\)\./);
    // The rank explainer is collapsed: a <details> without the open attribute.
    expect(html).toMatch(/<details[^>]*data-testid="rank-scores"(?![^>]*\bopen\b)[^>]*>/);
  });

  it("carries citation meta tags, Open Graph and Twitter cards, a canonical permalink and JSON-LD", async () => {
    const html = await (await get(`/briefs/${small}`)).text();
    expect(html).toContain('<meta name="citation_title" content="Sleeping well after night shifts (fictional demonstration)"');
    expect(html).toContain(`<link rel="canonical" href="${server.url}/briefs/${small}/v/1"`);
    expect(html).toMatch(/<meta property="og:title" content="[^"]+"/);
    expect(html).toContain('<meta name="twitter:card" content="summary_large_image"');
    // Each page's head is its own: one canonical link and one JSON-LD block, never a parent page's too.
    expect(html.match(/<link rel="canonical"/g)).toHaveLength(1);
    expect(html.match(/application\/ld\+json/g)).toHaveLength(1);
    const comparison = await (await get(`/briefs/${small}/v/1/compare/combined/usual_care`)).text();
    expect(comparison.match(/<link rel="canonical"[^>]*>/g)).toEqual([`<link rel="canonical" href="${server.url}/briefs/${small}/v/1/compare/combined/usual_care"/>`]);
    expect(comparison.match(/application\/ld\+json/g)).toHaveLength(1);
    const jsonLd = JSON.parse(/<script type="application\/ld\+json">(.*?)<\/script>/s.exec(html)![1]!);
    expect(jsonLd).toMatchObject({ "@type": "Report", version: "1", url: `${server.url}/briefs/${small}/v/1` });
  });

  it("the latest-version address revalidates every time", async () => {
    const response = await get(`/briefs/${small}`);
    expect(response.status).toBe(200);
    expect(response.headers.get("cache-control")).toBe("public, no-cache");
    expect(response.headers.get("etag")).toBeTruthy();
  });

  it("ships under 150 KB of compressed JavaScript", async () => {
    const html = await (await get(`/briefs/${large}`)).text();
    const scripts = [...html.matchAll(/<(?:script[^>]+src|link[^>]+rel="modulepreload"[^>]+href)="([^"]+\.js)"/g)].map((m) => m[1]!);
    expect(scripts.length).toBeGreaterThan(0);
    let total = 0;
    for (const src of new Set(scripts)) {
      const response = await get(src);
      expect(response.status, src).toBe(200);
      total += gzipSync(Buffer.from(await response.arrayBuffer())).length;
    }
    expect(total).toBeLessThan(150 * 1024);
  });

  it("a comparison page has the statement, the evidence side by side and its own citation files", async () => {
    const response = await get(`/briefs/${small}/v/1/compare/combined/usual_care`);
    expect(response.status).toBe(200);
    const html = await response.text();
    expect(html).toContain("Light sessions with nap schedule vs Usual care");
    expect(html).toContain("Direct (trials comparing the two)");
    expect(html).toContain("Cite this comparison");
    expect((await get(`/briefs/${small}/v/1/compare/combined/nobody`)).status).toBe(404);
  });
});

describe("the embargo", () => {
  it("keeps a scheduled brief from the public at every address, and shows it to the press with a notice", async () => {
    const releaseAt = new Date(Date.now() + 48 * 3600 * 1000).toISOString();
    const { slug } = await publishedBrief(clients.analyst!, clients.editor!, "Embargoed page", releaseAt);
    for (const path of [`/briefs/${slug}`, `/briefs/${slug}/v/1`, `/briefs/${slug}/v/1/compare/self_help/no_contact`, `/briefs/${slug}/v/1/cite.ris`, `/briefs/${slug}/v/1/downloads/results.csv`]) {
      expect((await get(path)).status, path).toBe(404);
      expect((await clients.analyst!.request("GET", path)).status, path).toBe(404);
    }
    expect(await (await get("/feed.xml")).text()).not.toContain(slug);
    expect(await (await get("/briefs?q=embargoed")).text()).not.toContain(slug);

    const press = await fetch(`${server.url}/briefs/${slug}/v/1`, { headers: { cookie: clients.press!.cookieHeader } });
    expect(press.status).toBe(200);
    expect(press.headers.get("cache-control")).toBe("private, no-store");
    expect(await press.text()).toContain("Embargoed until");
  });
});

describe("a shared cache holds only what the public may see", () => {
  const inTwoDays = () => new Date(Date.now() + 48 * 3600 * 1000).toISOString();
  const note = "An embargoed correction: a trial's arms were swapped.";

  it("a released version read by the press first never shows the public an embargoed correction", async () => {
    const { briefId, slug } = await publishedBrief(clients.analyst!, clients.editor!, "Correction under embargo");
    await approve(clients.analyst!, clients.editor!, briefId);
    const scheduled = await clients.editor!.request("POST", `/api/briefs/${briefId}/versions`, { json: { note, releaseAt: inTwoDays() } });
    expect(scheduled.status).toBe(201);
    for (const path of [`/briefs/${slug}/v/1`, `/briefs/${slug}/v/1/compare/self_help/no_contact`, `/briefs/${slug}`]) {
      // The press reads first: its page names version 2, so it is private and never cached.
      const press = await fetch(`${server.url}${path}`, { headers: { cookie: clients.press!.cookieHeader } });
      expect(press.status, path).toBe(200);
      expect(press.headers.get("cache-control"), path).toBe("private, no-store");
      expect(await press.text(), path).toContain(note);
      const editor = await fetch(`${server.url}${path}`, { headers: { cookie: clients.editor!.cookieHeader } });
      expect(editor.headers.get("cache-control"), path).toBe("private, no-store");
      // Then the public: no trace of the embargoed version, in the HTML or in the embedded page data.
      const anonymous = await get(path);
      expect(anonymous.status, path).toBe(200);
      expect(anonymous.headers.get("cache-control"), path).toMatch(/^public/);
      const html = await anonymous.text();
      expect(html, path).not.toContain(note);
      expect(html, path).not.toContain("Version 2");
      expect(html, path).not.toContain('"number":2');
    }
  });

  it("a cached version page, and the cached latest address, learn of a newer version at once", async () => {
    const { briefId, slug } = await publishedBrief(clients.analyst!, clients.editor!, "Correction after caching");
    const before = await get(`/briefs/${slug}/v/1`);
    const beforeHtml = await before.text();
    expect(beforeHtml).not.toContain("A newer version");
    // The latest address is kept in memory too: the second answer is the first, byte for byte.
    const latestBefore = await get(`/briefs/${slug}`);
    expect(await latestBefore.text()).not.toContain("Two studies were entered twice.");
    expect((await get(`/briefs/${slug}`)).headers.get("etag")).toBe(latestBefore.headers.get("etag"));
    await approve(clients.analyst!, clients.editor!, briefId);
    expect((await clients.editor!.request("POST", `/api/briefs/${briefId}/versions`, { json: { note: "Two studies were entered twice." } })).status).toBe(201);
    // The two-second memory of a version's state is the only delay a reader may see.
    await new Promise((resolve) => setTimeout(resolve, 2100));
    const after = await get(`/briefs/${slug}/v/1`);
    const afterHtml = await after.text();
    expect(after.headers.get("etag")).not.toBe(before.headers.get("etag"));
    expect(afterHtml).toContain("Two studies were entered twice.");
    expect(afterHtml).toContain("A newer version");
    const latestAfter = await get(`/briefs/${slug}`);
    expect(latestAfter.headers.get("etag")).not.toBe(latestBefore.headers.get("etag"));
    expect(await latestAfter.text()).toContain("Two studies were entered twice.");
  });

  it("a cold page asked for by many readers at once gives each the same page (rendered once, the others wait for it)", async () => {
    const { slug } = await publishedBrief(clients.analyst!, clients.editor!, "Many readers at once");
    const answers = await Promise.all(Array.from({ length: 12 }, () => get(`/briefs/${slug}/v/1`)));
    expect(answers.map((answer) => answer.status)).toEqual(answers.map(() => 200));
    expect(new Set(answers.map((answer) => answer.headers.get("etag"))).size).toBe(1);
  });
});

describe("a withdrawn brief", () => {
  it("answers 410 with its page and the reason, even after its page was cached", async () => {
    const { briefId, slug } = await publishedBrief(clients.analyst!, clients.editor!, "Withdrawn page");
    expect((await get(`/briefs/${slug}/v/1`)).status).toBe(200);
    await clients.editor!.request("POST", `/api/briefs/${briefId}/withdrawal`, { json: { reason: "A trial in the data was retracted." } });
    for (const path of [`/briefs/${slug}`, `/briefs/${slug}/v/1`]) {
      const response = await get(path);
      expect(response.status, path).toBe(410);
      const html = await response.text();
      expect(html).toContain("A trial in the data was retracted.");
      expect(html).toContain("Quit smoking");
    }
    // The feed announces the withdrawal, with its reason.
    const feed = await (await get("/feed.xml")).text();
    expect(feed).toContain('<title type="text">Withdrawn: Withdrawn page</title>');
    expect(feed).toContain("Withdrawn: A trial in the data was retracted.");
    // The withdrawn page is cached in turn: a fresh render would carry a new nonce, hence a new ETag.
    const [first, second] = [await get(`/briefs/${slug}/v/1`), await get(`/briefs/${slug}/v/1`)];
    expect(second.status).toBe(410);
    expect(second.headers.get("etag")).toBe(first.headers.get("etag"));
  });
});

describe("citations", () => {
  it("RIS, BibTeX and CSL-JSON parse back (through citation-js) to the same title, version and permalink", async () => {
    const base = `/briefs/${small}/v/1`;
    const files = await Promise.all(["ris", "bib", "json"].map(async (format) => (await get(`${base}/cite.${format}`)).text()));
    const [ris, bib, csl] = files.map((text) => new Cite(text).data[0] as { title: string; URL: string; version?: string; type: string });
    expect(ris!.title).toBe("Sleeping well after night shifts (fictional demonstration)");
    expect(ris!.URL).toBe(`${server.url}${base}`);
    expect(bib!.title).toBe(ris!.title);
    expect(bib!.URL).toBe(ris!.URL);
    expect(csl).toMatchObject({ title: ris!.title, URL: ris!.URL, version: "1", type: "report" });
    expect((await get(`${base}/cite.ris`)).headers.get("content-type")).toContain("application/x-research-info-systems");
  });

  it("carry the version (RIS ET, BibTeX edition) and an id unique to the brief, the version and the comparison", async () => {
    const version = `/briefs/${small}/v/1`;
    const comparison = `${version}/compare/light/usual_care`;
    const [versionRis = "", comparisonRis = "", versionBib = "", comparisonBib = ""] = await Promise.all(
      [`${version}/cite.ris`, `${comparison}/cite.ris`, `${version}/cite.bib`, `${comparison}/cite.bib`].map(async (path) => (await get(path)).text()),
    );
    expect(versionRis).toMatch(/^ET {2}- Version 1$/m);
    expect(versionBib).toContain("edition = {Version 1}");
    const risId = (ris: string) => /^ID {2}- (.+)$/m.exec(ris)![1];
    const bibKey = (bib: string) => /^@\w+\{([^,]+),/.exec(bib)![1];
    expect(risId(versionRis)).toBe(`fairweigh-briefs-${small}-v-1`);
    expect(risId(comparisonRis)).toBe(`fairweigh-briefs-${small}-v-1-compare-light-usual-care`);
    expect(bibKey(versionBib)).toBe(risId(versionRis));
    expect(bibKey(comparisonBib)).toBe(risId(comparisonRis));
  });

  it("name the brief's author team as their author", async () => {
    const { briefId, slug } = await analysedBrief(clients.analyst!, "Cited with its author team");
    const { rowVersion } = (await clients.analyst!.request("GET", `/api/briefs/${briefId}`)).body.brief as { rowVersion: number };
    expect((await clients.analyst!.request("PATCH", `/api/briefs/${briefId}`, { json: { rowVersion, authorTeam: "Northfield Evidence Unit (fictional)" } })).status).toBe(200);
    await approve(clients.analyst!, clients.editor!, briefId);
    expect((await clients.editor!.request("POST", `/api/briefs/${briefId}/versions`, { json: {} })).status).toBe(201);
    const ris = await (await get(`/briefs/${slug}/v/1/cite.ris`)).text();
    expect(ris).toMatch(/^AU {2}- Northfield Evidence Unit \(fictional\)$/m);
    expect(await (await get(`/briefs/${slug}/v/1`)).text()).toContain("Northfield Evidence Unit (fictional). (");
  });

  it("a comparison's citation names the comparison and its own permalink", async () => {
    const path = `/briefs/${small}/v/1/compare/light/usual_care`;
    const csl = new Cite(await (await get(`${path}/cite.json`)).text()).data[0] as { title: string; URL: string };
    expect(csl.title).toBe("Timed bright-light sessions vs Usual care: Sleeping well after night shifts (fictional demonstration)");
    expect(csl.URL).toBe(`${server.url}${path}`);
  });
});

describe("downloads", () => {
  it("give the inputs and results of a version as CSV and JSON", async () => {
    const base = `/briefs/${small}/v/1/downloads`;
    const results = await get(`${base}/results.csv`);
    expect(results.headers.get("content-type")).toContain("text/csv");
    const lines = (await results.text()).trim().split("\n");
    // Each estimate column states its scale, and reader names stand beside the labels of the data.
    expect(lines[0]).toBe(
      "outcome,treatment,treatment_name,comparator,comparator_name,measure,scale,model,estimate,se,lower,upper,direct_estimate,direct_se,direct_studies,indirect_estimate,indirect_se,incoherence_p,certainty," +
        "direct_weight_low_risk_of_bias,direct_weight_some_concerns,direct_weight_high_risk_of_bias,direct_weight_not_assessed,important_studies",
    );
    // The studies that matter most (METHODS.md §13), "label:importance" largest first, and the direct weight by risk of bias.
    const combinedVsLight = (parse(lines.join("\n"), { columns: true }) as Record<string, string>[]).find((row) => row.treatment === "combined" && row.comparator === "light")!;
    expect(combinedVsLight.important_studies).toMatch(/^D\d{3}:0\.\d+(; D\d{3}:[\d.e-]+)*$/);
    const shares = ["direct_weight_low_risk_of_bias", "direct_weight_some_concerns", "direct_weight_high_risk_of_bias", "direct_weight_not_assessed"].map((c) => Number(combinedVsLight[c]));
    expect(shares.reduce((a, b) => a + b, 0)).toBeCloseTo(1, 12);
    expect(lines[1]).toMatch(/^Good sleep on most days at 4 weeks,combined,Light sessions with nap schedule,drug_k,Sleep aid K \(fictional\),OR,log odds ratio,random,/);
    expect(lines).toHaveLength(1 + 2 * 15); // two outcomes, 15 pairs of 6 treatments each
    const inputs = (await (await get(`${base}/inputs.json`)).json()) as { outcomes: { studies: unknown[] }[] };
    expect(inputs.outcomes[0]!.studies).toHaveLength(15);
    // The invented risk-of-bias column travels with the inputs, in the words of the input format.
    const inputRows = (await (await get(`${base}/inputs.csv`)).text()).trim().split("\n");
    expect(inputRows[0]!.endsWith(",risk_of_bias")).toBe(true);
    expect(inputRows.filter((row) => row.endsWith(",some concerns")).length).toBeGreaterThan(0);
    expect((await get(`${base}/nothing.csv`)).status).toBe(404);
  });
});

describe("feed, sitemap, robots, search and topics", () => {
  it("the Atom feed parses as XML and lists the released briefs", async () => {
    const response = await get("/feed.xml");
    expect(response.headers.get("content-type")).toContain("application/atom+xml");
    const feed = xml2js(await response.text(), { compact: true }) as { feed: { entry: { link: { _attributes: { href: string } } }[] } };
    const links = feed.feed.entry.map((e) => e.link._attributes.href);
    expect(links).toContain(`${server.url}/briefs/${small}/v/1`);
    expect(links).toContain(`${server.url}/briefs/${large}/v/1`);
  });

  it("the sitemap lists every released version and robots.txt points to it", async () => {
    const sitemap = xml2js(await (await get("/sitemap.xml")).text(), { compact: true }) as { urlset: { url: { loc: { _text: string } }[] } };
    expect(sitemap.urlset.url.map((u) => u.loc._text)).toContain(`${server.url}/briefs/${small}/v/1`);
    expect(await (await get("/robots.txt")).text()).toContain(`Sitemap: ${server.url}/sitemap.xml`);
  });

  it("search matches title, condition and treatment names; a topic lists its briefs", async () => {
    const byTreatment = await (await get("/briefs?q=compound+k")).text();
    expect(byTreatment).toContain(`/briefs/${large}`);
    expect(byTreatment).not.toContain(`/briefs/${small}"`);
    const byCondition = await (await get("/briefs?q=night-shift")).text();
    expect(byCondition).toContain(`/briefs/${small}`);
    const topic = await get("/topics/headache");
    expect(topic.status).toBe(200);
    expect(await topic.text()).toContain(`/briefs/${large}`);
    expect((await get("/topics/nothing-here")).status).toBe(404);
  });

  it("search is PostgreSQL full-text: words as prefixes in any case, accents aside, in the reader's language and the original", async () => {
    expect(await (await get("/briefs?q=NIGHT+shif")).text()).toContain(`/briefs/${small}`);
    // The Spanish translation's condition says "sueño"; a reader typing without the accent finds it, in Spanish only.
    expect(await (await get("/es/briefs?q=sueno")).text()).toContain(`/es/briefs/${small}`);
    expect(await (await get("/briefs?q=sueno")).text()).not.toContain(`/briefs/${small}`);
    // Original names are found in every language.
    expect(await (await get("/fr/briefs?q=compound+k")).text()).toContain(`/fr/briefs/${large}`);
    expect(await (await get("/briefs?q=%27%29%3A*%7C%21")).text()).not.toContain(`/briefs/${small}`);
  });
});
