// Publishing and reading frozen versions (docs/decisions/0007-frozen-versions.md).
import { Router } from "express";
import { z } from "zod";
import { requireRole } from "../auth/require-role";
import { publishVersion, readVersion } from "../briefs/versions";
import type { Database } from "../db/client";
import { rejectMalformedId, sendError, validateBody } from "../http/errors";

export function versionRoutes(db: Database): Router {
  const router = Router();
  router.param("id", rejectMalformedId);

  const publishBody = z
    .object({ releaseAt: z.iso.datetime({ offset: true }).optional(), note: z.string().trim().max(5000).optional() })
    .strict();
  router.post("/briefs/:id/versions", requireRole("editor"), validateBody(publishBody), async (req, res) => {
    const body = req.body as z.infer<typeof publishBody>;
    const outcome = await publishVersion(db, String(req.params.id), { releaseAt: body.releaseAt ? new Date(body.releaseAt) : undefined, note: body.note }, req.user!.id);
    if (outcome.ok) return res.status(201).json({ version: outcome.version, url: outcome.url });
    if (outcome.reason === "not-found") return sendError(res, 404, { key: "errors.notFound", message: "There is no such brief." });
    sendError(res, outcome.reason === "note-required" ? 400 : 409, {
      key: outcome.reason === "note-required" ? "errors.publish.noteRequired" : "errors.publish.notReady",
      message: `The brief cannot be published yet: ${outcome.detail}.`,
      details: outcome.reason === "note-required" ? [{ field: "note", message: outcome.detail }] : undefined,
    });
  });

  // Public once released; before that only for the press and editors. An embargoed version answers
  // 404 like one that does not exist, so its existence does not leak.
  router.get("/briefs/:slug/versions/:number", async (req, res) => {
    const number = Number(req.params.number);
    const text = Number.isInteger(number) && number > 0 ? await readVersion(db, String(req.params.slug), number, req.user?.roles ?? []) : null;
    if (text === null) return sendError(res, 404, { key: "errors.notFound", message: "There is no such published version." });
    res.type("application/json").send(text);
  });

  return router;
}
