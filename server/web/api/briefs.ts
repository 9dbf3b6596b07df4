// Briefs and their outcomes, treatment names and the Markdown preview: the desk's drafts.
import { Router } from "express";

import { handle } from "./handle";
import { briefWithOutcomes, createBrief, findBrief, listBriefs, nameTreatments, updateBrief } from "#db/briefs";
import { createOutcome } from "#db/outcomes";

import { renderMarkdown } from "#core/editorial/markdown";
import type { Database } from "#db/client";
import { sendError } from "../http/errors";

/** Who may change what in a brief: analysts its description, editors also its texts. */
const editorialFields = ["laySummary", "shortTake"] as const;

export function briefRoutes(db: Database): Router {
  const router = Router();

  handle(router, "GET /api/briefs", async (_req, res) => {
    res.json({ briefs: await listBriefs(db) });
  });

  handle(router, "POST /api/briefs", async (req, res) => {
    const brief = await createBrief(db, req.body, req.user!.id);
    res.status(201).json({ id: brief.id, slug: brief.slug });
  });

  handle(router, "GET /api/briefs/:id", async (req, res) => {
    const brief = await briefWithOutcomes(db, req.params.id);
    if (!brief) return sendError(res, 404, { key: "errors.notFound", message: "There is no such brief." });
    res.json({ brief });
  });

  handle(router, "PATCH /api/briefs/:id", async (req, res) => {
    const { rowVersion, ...changes } = req.body;
    if (editorialFields.some((field) => field in changes) && !req.user!.roles.includes("editor")) {
      return sendError(res, 403, { key: "errors.roleRequired", message: "The lay summary and short take need the role editor.", details: { required: ["editor"] } });
    }
    const outcome = await updateBrief(db, req.params.id, rowVersion, changes, req.user!.id);
    if (outcome.ok) return res.json({ brief: outcome.brief });
    if (!outcome.current) return sendError(res, 404, { key: "errors.notFound", message: "There is no such brief." });
    sendError(res, 409, {
      key: "errors.conflict",
      message: `Someone else changed this brief (now version ${outcome.current.rowVersion}, you edited version ${rowVersion}). Review their change, then apply yours again.`,
      details: { current: outcome.current },
    });
  });

  handle(router, "PUT /api/briefs/:id/treatments", async (req, res) => {
    const current = await briefWithOutcomes(db, req.params.id);
    if (!current) return sendError(res, 404, { key: "errors.notFound", message: "There is no such brief." });
    const { names, grammar = {} } = req.body;
    // Names are for the labels in the brief's data only: anything else would be stored and never shown.
    const known = new Set(current.treatments.map((t) => t.label));
    const unknown = [...new Set([...Object.keys(names), ...Object.keys(grammar)])].filter((label) => !known.has(label));
    if (unknown.length > 0) {
      return sendError(res, 400, {
        key: "errors.treatments.unknownLabel",
        message: `These labels are not treatments in the brief's data: ${unknown.slice(0, 10).join(", ")}.`,
        details: unknown.slice(0, 10).map((label) => ({ field: `names.${label}`, message: "not a treatment in the data" })),
      });
    }
    // Grammar is given with a name: a label named before keeps its name when only its grammar changes.
    const withNames = { ...Object.fromEntries(current.treatments.filter((t) => t.named && t.label in grammar).map((t) => [t.label, t.displayName])), ...names };
    await nameTreatments(db, req.params.id, withNames, req.user!.id, grammar);
    const brief = await briefWithOutcomes(db, req.params.id);
    res.json({ treatments: brief!.treatments });
  });

  handle(router, "POST /api/preview", (req, res) => {
    res.json({ html: renderMarkdown(req.body.markdown) });
  });

  handle(router, "POST /api/briefs/:id/outcomes", async (req, res) => {
    if (!(await findBrief(db, req.params.id))) return sendError(res, 404, { key: "errors.notFound", message: "There is no such brief." });
    const outcome = await createOutcome(db, req.params.id, req.body, req.user!.id);
    res.status(201).json({ outcome });
  });

  return router;
}
