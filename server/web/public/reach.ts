// Comparisons that travel: the card other sites frame (/embed/…), the oEmbed answer that gives them
// its <iframe> (oEmbed 1.0), and the share image of every version and comparison (…/share.png).
// Only released versions: an embargoed one is 404 to everyone here (these are public, shared
// addresses, never personal); a withdrawn one's card, image and oEmbed answer say it was withdrawn
// and why instead of the finding (docs/decisions/0028-reach.md).
import { Router, type Request, type Response } from "express";
import { z } from "zod";
import { dayInWords, defaultLocale, localePath, splitLocale, type Locale } from "#core/languages/locales";
import { embedUrl, pageUrl, surrogateKeys, parseBriefPath, parseVersionPath, shareImageUrl, versionNumberOf, type ComparisonAddress, type VersionAddress } from "#core/publication/urls";
import { wordsOf } from "#core/languages/words";
import type { Database } from "#db/client";
import { inLanguage } from "#db/translations";
import { readPublicVersion, readVersion } from "#db/versions";
import { createRequire } from "node:module";
import { cardFonts, cardWidth, embedCard } from "./embed";
import { escapeXml } from "./feed";
import { siteUrl } from "../http/site-url";
import { arabicImageText, shareImage, shareImageSize, shareImageText, withdrawnImageText, type ShareText } from "./share-image";

const cacheControl = "public, max-age=3600";
const require = createRequire(import.meta.url);

/** A released version as anyone reads it, in `locale` where its translation is published. */
async function releasedVersion(db: Database, slug: string, number: number, locale: Locale) {
  const found = await readVersion(db, slug, number, []);
  if (!found) return null;
  return { ...found, original: found.snapshot, snapshot: (await inLanguage(db, found.versionId, found.snapshot, locale)).snapshot };
}

/** What an image or oEmbed answer says of a version or comparison in `locale`: its finding, or its withdrawal. */
function sharedText(found: NonNullable<Awaited<ReturnType<typeof releasedVersion>>>, snapshot: typeof found.snapshot, pair: { a: string; b: string } | null, locale: Locale): ShareText | null {
  const t = wordsOf(locale, "public");
  const text = shareImageText(snapshot, pair, t, locale);
  if (!text || !found.withdrawal) return text;
  return withdrawnImageText(text, t("embed.withdrawn", { date: dayInWords(locale, found.withdrawal.at), reason: found.withdrawal.reason }));
}

const addressOf = (req: Request): VersionAddress | ComparisonAddress | null => {
  const version = versionNumberOf(String(req.params.number));
  if (version === null) return null;
  const at = { slug: String(req.params.slug), version };
  return req.params.a === undefined ? at : { ...at, treatment: String(req.params.a), comparator: String(req.params.b) };
};
const pairOf = (at: VersionAddress | ComparisonAddress) => ("treatment" in at ? { a: at.treatment, b: at.comparator } : null);

/** The card's likely height at its width: enough that a page without the resize listener shows it whole. */
const cardHeight = (outcomes: number, pair: boolean) => (pair ? 230 + 190 * outcomes : 230 + 150 * outcomes);

const oembedQuery = z.object({
  url: z.string({ message: "give the address of a brief, version or comparison as url" }).url({ message: "url must be an absolute address" }),
  format: z.enum(["json", "xml"]).default("json"),
  maxwidth: z.coerce.number().int().positive().optional(),
  maxheight: z.coerce.number().int().positive().optional(),
});

export function reachRoutes(db: Database, publicUrl: string | undefined): Router {
  const router = Router();
  const localeOf = (res: Response): Locale => (res.locals.locale as Locale | undefined) ?? defaultLocale;

  // Only this route may be framed by other sites: every other answer keeps frame-ancestors 'none'.
  const card = async (req: Request, res: Response) => {
    const at = addressOf(req);
    const locale = localeOf(res);
    const found = at ? await releasedVersion(db, at.slug, at.version, locale) : null;
    const html = at && found
      ? embedCard({ snapshot: found.snapshot, pair: pairOf(at), locale, t: wordsOf(locale, "public"), permalink: `${siteUrl(req, publicUrl)}${localePath(locale, pageUrl(at))}`, withdrawal: found.withdrawal, nonce: String(res.locals.cspNonce) })
      : null;
    if (!html) return res.status(404).type("text/plain").send("There is no such released comparison.");
    const policy = String(res.getHeader("Content-Security-Policy") ?? "");
    res.setHeader("Content-Security-Policy", policy.replace("frame-ancestors 'none'", "frame-ancestors *"));
    res.removeHeader("X-Frame-Options");
    res.status(found!.withdrawal ? 410 : 200).set({ "Cache-Control": cacheControl, "Cross-Origin-Resource-Policy": "cross-origin", "Surrogate-Key": surrogateKeys({ slug: at!.slug, version: at!.version })! }).type("html").send(html);
  };
  // The card's fonts (embed.ts): the same files whatever the build, kept for a year.
  router.get("/embed/fonts/:file", (req, res) => {
    const name = String(req.params.file);
    if (!Object.hasOwn(cardFonts, name)) return res.status(404).type("text/plain").send("There is no such font.");
    res.set({ "Cache-Control": "public, max-age=31536000, immutable", "Cross-Origin-Resource-Policy": "cross-origin" }).type("font/woff2").sendFile(require.resolve(cardFonts[name as keyof typeof cardFonts].file));
  });
  router.get("/embed/briefs/:slug/v/:number", card);
  router.get("/embed/briefs/:slug/v/:number/compare/:a/:b", card);

  const image = async (req: Request, res: Response) => {
    const at = addressOf(req);
    const locale = localeOf(res);
    const found = at ? await releasedVersion(db, at.slug, at.version, locale) : null;
    const text = at && found ? sharedText(found, found.snapshot, pairOf(at), locale) : null;
    if (!at || !found || !text) return res.status(404).type("text/plain").send("There is no such released version.");
    // An Arabic image needs every word in Arabic script; else the English one (share-image.ts says why).
    const arabic = locale === "ar" ? arabicImageText(text) : null;
    const drawn = locale !== "ar" ? text : (arabic ?? sharedText(found, found.original, pairOf(at), defaultLocale)!);
    const shown = `${arabic ? "ar" : locale === "ar" ? "en" : locale}|${shareImageUrl(at)}|${found.translatedAt ?? ""}|${found.withdrawal?.at ?? ""}`;
    const png = await shareImage(shown, drawn, arabic !== null);
    // Other sites show it (cards of social networks, a reporter's page): not bound to this origin.
    res.set({ "Cache-Control": cacheControl, "Cross-Origin-Resource-Policy": "cross-origin", "Surrogate-Key": surrogateKeys({ slug: at.slug, version: at.version })! }).type("png").send(png);
  };
  router.get("/briefs/:slug/v/:number/share.png", image);
  router.get("/briefs/:slug/v/:number/compare/:a/:b/share.png", image);

  // oEmbed 1.0 (https://oembed.com, §2): a "rich" answer whose html frames the card.
  router.get("/oembed", async (req, res) => {
    const query = oembedQuery.safeParse(req.query);
    if (!query.success) return res.status(400).type("text/plain").send(query.error.issues.map((i) => i.message).join("; "));
    // §2.3.4: a format the provider does not offer is 501 Not Implemented.
    if (query.data.format !== "json") return res.status(501).type("text/plain").send("Only format=json is offered.");
    const site = siteUrl(req, publicUrl);
    const target = new URL(query.data.url);
    const { locale, path } = splitLocale(target.pathname);
    const parsed = target.origin === new URL(site).origin ? parseVersionPath(path) : null;
    const briefSlug = target.origin === new URL(site).origin && !parsed ? parseBriefPath(path) : null;
    let at: VersionAddress | ComparisonAddress | null = parsed?.at ?? null;
    if (briefSlug !== null) {
      const latest = await readPublicVersion(db, briefSlug, "latest", []);
      at = latest && !latest.found.embargoed ? { slug: briefSlug, version: latest.found.snapshot.version } : null;
    }
    const found = at ? await releasedVersion(db, at.slug, at.version, locale) : null;
    const text = at && found ? sharedText(found, found.snapshot, pairOf(at), locale) : null;
    // §2.3.4: 404 when there is no response for the address; an unreleased version has none. A withdrawn
    // one has its card, which says so: a site that embedded it keeps showing why it was withdrawn.
    if (!at || !found || !text) return res.status(404).type("text/plain").send("There is no released brief, version or comparison at this address.");
    const pair = pairOf(at);
    const outcomes = pair ? found.snapshot.outcomes.filter((o) => o.pairs.some((p) => (p.treatment === pair.a && p.comparator === pair.b) || (p.treatment === pair.b && p.comparator === pair.a))).length : found.snapshot.outcomes.length;
    const width = Math.min(query.data.maxwidth ?? cardWidth.default, cardWidth.max);
    const height = Math.min(query.data.maxheight ?? Number.POSITIVE_INFINITY, cardHeight(outcomes, pair !== null));
    const src = `${site}${localePath(locale, embedUrl(at))}`;
    const title = `${text.title} · Fairweigh`;
    // Filed under the brief too: withdrawing it must take its oEmbed answers out of a CDN as well.
    res.set({ "Cache-Control": cacheControl, "Access-Control-Allow-Origin": "*", "Surrogate-Key": surrogateKeys({ slug: at.slug, version: at.version })! }).json({
      version: "1.0",
      type: "rich",
      title: found.withdrawal ? wordsOf(locale, "public")("feed.withdrawn", { title: text.title }) : text.title,
      provider_name: "Fairweigh",
      provider_url: `${site}/`,
      cache_age: 3600,
      html: `<iframe src="${escapeXml(src)}" title="${escapeXml(title)}" width="${width}" height="${height}" style="border:0;max-width:100%" loading="lazy"></iframe>`,
      width,
      height,
      thumbnail_url: `${site}${localePath(locale, shareImageUrl(at))}`,
      thumbnail_width: shareImageSize.width,
      thumbnail_height: shareImageSize.height,
    });
  });

  return router;
}
