// Comparisons that travel: the card other sites frame, oEmbed 1.0 and the share images, against the
// production build and the test cluster.
import { describe, expect, it } from "vitest";
import { slugify } from "#core/publication/slug";
import { demoBriefs } from "#workflows/demo-briefs";
import { publishedBrief } from "../support/briefs";
import { withProductionServer } from "../support/production-server";
import { en } from "../support/words";

const { server, clients } = withProductionServer(["analyst", "editor"]);

const small = slugify(demoBriefs()[0]!.title);
const comparison = `/briefs/${small}/v/1/compare/combined/usual_care`;
const get = (path: string) => fetch(`${server.url}${path}`, { redirect: "manual" });
const oembed = (url: string, extra = "") => get(`/oembed?url=${encodeURIComponent(url)}&format=json${extra}`);

/** The width and height of a PNG, from its IHDR chunk (PNG specification, §11.2.2). */
function pngSize(bytes: Buffer) {
  expect(bytes.subarray(0, 8)).toEqual(Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]));
  return { width: bytes.readUInt32BE(16), height: bytes.readUInt32BE(20) };
}

describe("the embedded card", () => {
  it("alone may be framed by other sites; every other page keeps frame-ancestors 'none'", async () => {
    const card = await get(`/embed${comparison}`);
    expect(card.status).toBe(200);
    expect(card.headers.get("content-security-policy")).toContain("frame-ancestors *");
    expect(card.headers.get("x-frame-options")).toBeNull();
    const page = await get(comparison);
    expect(page.headers.get("content-security-policy")).toContain("frame-ancestors 'none'");
    expect(page.headers.get("x-frame-options")).toBe("SAMEORIGIN");
  });

  it("holds the statement, the effect with its interval, the certainty in words, the caution, the fictional label and a link to this exact version", async () => {
    const html = (await (await get(`/embed${comparison}`)).text()).replaceAll("&#39;", "'");
    expect(html).toContain("The evidence is very uncertain about the effect of light sessions with a nap schedule");
    expect(html).toMatch(/Effect \(odds ratio, 95% CI\)<\/dt><dd>\d+\.\d+ \(\d+\.\d+ to \d+\.\d+\)/);
    expect(html).toContain(`<span class="certainty">${en.certainty.rating.very_low}`);
    expect(html).toContain(en.embed.caution);
    expect(html).toContain(en.embed.fictional);
    expect(html).toContain(`href="${server.url}${comparison}"`);
    expect(html).toContain("fairweigh:embed-height");
  });

  it("answers in the reader's language under a locale prefix", async () => {
    const html = await (await get(`/es/embed${comparison}`)).text();
    expect(html).toContain('<html lang="es" dir="ltr">');
    expect(html).toContain(`href="${server.url}/es${comparison}"`);
  });
});

describe("oEmbed 1.0", () => {
  it("answers a rich type with the required fields for a comparison, a version and a brief's address", async () => {
    for (const path of [comparison, `/briefs/${small}/v/1`, `/briefs/${small}`]) {
      const response = await oembed(`${server.url}${path}`);
      expect(response.status, path).toBe(200);
      expect(response.headers.get("content-type")).toContain("application/json");
      const answer = (await response.json()) as Record<string, unknown>;
      // oEmbed 1.0 §2.3.4: type and version always; html, width and height for "rich".
      expect(answer).toMatchObject({ type: "rich", version: "1.0", provider_name: "Fairweigh" });
      expect(answer.html).toMatch(new RegExp(`^<iframe src="${server.url}/embed/briefs/${small}/v/1`));
      expect(Number.isInteger(answer.width) && Number.isInteger(answer.height)).toBe(true);
    }
  });

  it("keeps within maxwidth and offers discovery from the page", async () => {
    const answer = (await (await oembed(`${server.url}${comparison}`, "&maxwidth=400")).json()) as { width: number };
    expect(answer.width).toBeLessThanOrEqual(400);
    const page = await (await get(comparison)).text();
    expect(page).toContain(`<link rel="alternate" type="application/json+oembed" href="${server.url}/oembed?url=${encodeURIComponent(`${server.url}${comparison}`)}&amp;format=json"`);
  });

  it("gives 404 for an address that is not released (embargoed, unknown or another site's), a withdrawn brief's card that says so, and 501 for XML", async () => {
    const embargoed = await publishedBrief(clients.analyst!, clients.editor!, "Embargoed for oEmbed", new Date(Date.now() + 48 * 3600 * 1000).toISOString());
    expect((await oembed(`${server.url}/briefs/${embargoed.slug}/v/1/compare/grp_counseling/no_contact`)).status).toBe(404);
    expect((await get(`/embed/briefs/${embargoed.slug}/v/1/compare/grp_counseling/no_contact`)).status).toBe(404);
    expect((await get(`/briefs/${embargoed.slug}/v/1/share.png`)).status).toBe(404);

    const withdrawn = await publishedBrief(clients.analyst!, clients.editor!, "Withdrawn for oEmbed");
    expect((await oembed(`${server.url}/briefs/${withdrawn.slug}/v/1/compare/grp_counseling/no_contact`)).status).toBe(200);
    expect((await clients.editor!.request("POST", `/api/briefs/${withdrawn.briefId}/withdrawal`, { json: { reason: "A trial in the data was retracted." } })).status).toBe(200);
    // oEmbed still answers, with a card that says it was withdrawn and why, without its findings.
    const answer = await oembed(`${server.url}/briefs/${withdrawn.slug}/v/1/compare/grp_counseling/no_contact`);
    expect(answer.status).toBe(200);
    expect(((await answer.json()) as { title: string }).title).toBe("Withdrawn: Group counselling vs No contact");
    const card = await get(`/embed/briefs/${withdrawn.slug}/v/1/compare/grp_counseling/no_contact`);
    expect(card.status).toBe(410);
    const html = await card.text();
    expect(html).toContain("A trial in the data was retracted.");
    expect(html).not.toContain(en.compare.absolute);

    expect((await oembed(`${server.url}/briefs/no-such-brief/v/1`)).status).toBe(404);
    expect((await oembed(`https://elsewhere.example${comparison}`)).status).toBe(404);
    expect((await get(`/oembed?url=${encodeURIComponent(`${server.url}${comparison}`)}&format=xml`)).status).toBe(501);
    expect((await get("/oembed?format=json")).status).toBe(400);
  });
});

describe("the card's fonts", () => {
  it("are the site's own faces, served from stable addresses, not whatever the framing site has", async () => {
    const card = await (await get(`/embed${comparison}`)).text();
    for (const family of ["Source Serif 4", "Inter", "Noto Naskh Arabic"]) expect(card).toContain(`@font-face{font-family:"${family}"`);
    expect(card).not.toContain("font:13px/1.4 system-ui");
    const font = await get("/embed/fonts/inter-400.woff2");
    expect(font.status).toBe(200);
    expect(font.headers.get("content-type")).toBe("font/woff2");
    expect(Buffer.from(await font.arrayBuffer()).subarray(0, 4).toString("latin1")).toBe("wOF2");
    expect((await get("/embed/fonts/__proto__")).status).toBe(404);
  });
});

describe("share images", () => {
  it("are PNGs of 1200 × 630, the same bytes on two requests, and named by og:image on the page", async () => {
    for (const path of [`${comparison}/share.png`, `/briefs/${small}/v/1/share.png`, `/ar${comparison}/share.png`]) {
      const first = await get(path);
      expect(first.status, path).toBe(200);
      expect(first.headers.get("content-type")).toBe("image/png");
      const bytes = Buffer.from(await first.arrayBuffer());
      expect(pngSize(bytes)).toEqual({ width: 1200, height: 630 });
      expect(Buffer.compare(Buffer.from(await (await get(path)).arrayBuffer()), bytes)).toBe(0);
    }
    const page = await (await get(comparison)).text();
    expect(page).toContain(`<meta property="og:image" content="${server.url}${comparison}/share.png"/>`);
    expect(page).toMatch(/<meta property="og:image:alt" content="Light sessions with nap schedule vs Usual care\. The evidence is very uncertain/);
    expect(page).toContain('<meta name="twitter:card" content="summary_large_image"/>');
  });
});
