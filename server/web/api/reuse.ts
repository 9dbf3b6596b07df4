// The public reads, for the site's readers and for outside use (docs/data.md): the released briefs,
// their topics, a released version's frozen snapshot, and this API's OpenAPI document. Every reader
// gets the same answer for a released version, so caches may keep it; an embargoed one is only for
// the press and editors, kept by nobody.
import { Router } from "express";
import { topicsOf } from "#core/publication/search";
import { snapshotUrl, versionNumberOf, versionUrl } from "#core/publication/urls";
import type { Database } from "#db/client";
import { listReleasedBriefs, readVersion } from "#db/versions";
import { sendError } from "../http/errors";
import { sharedFor } from "../http/security";
import { siteUrl } from "../http/site-url";
import { handle } from "./handle";
import { openApiDocument } from "./openapi";

/** How long a shared cache may keep a public list before asking again (the purge hook clears it sooner). */
const listSeconds = 60;

export function reuseRoutes(db: Database, publicUrl: string | undefined): Router {
  const router = Router();

  handle(router, "GET /api/openapi.json", (req, res) => {
    sharedFor(res, 3600);
    res.json(openApiDocument(siteUrl(req, publicUrl)));
  });

  handle(router, "GET /api/releases", async (_req, res) => {
    const briefs = await listReleasedBriefs(db);
    sharedFor(res, listSeconds);
    res.json({
      briefs: briefs.map((brief) => ({
        ...brief,
        page: versionUrl(brief),
        snapshot: snapshotUrl(brief),
      })),
    });
  });

  // The topics of the released briefs (the press choose which alert them).
  handle(router, "GET /api/topics", async (_req, res) => {
    const topics = topicsOf(await listReleasedBriefs(db));
    sharedFor(res, listSeconds);
    res.json({ topics });
  });

  // Public once released; before that only for the press and editors. An embargoed version answers
  // 404 like one that does not exist, so its existence does not leak.
  handle(router, "GET /api/briefs/:slug/versions/:number", async (req, res) => {
    const number = versionNumberOf(req.params.number);
    const found = number === null ? null : await readVersion(db, req.params.slug, number, req.user?.roles ?? []);
    if (found === null) return sendError(res, 404, { key: "errors.notFound", message: "There is no such published version." });
    // A released version never changes; the hour only bounds how long a withdrawal takes to show.
    if (!found.embargoed) sharedFor(res, 3600);
    res.json(found.snapshot);
  });

  return router;
}
