// Review, publishing, withdrawal and reading frozen versions (docs/decisions/0007-frozen-versions.md,
// 0009-review-and-withdrawal.md).
import { Router } from "express";
import type { MailContext } from "#workflows/mail";

import { versionNumberOf } from "#core/publication/urls";
import { handle } from "./handle";
import type { AddressedRequest } from "../http/site-url";
import { reviewBrief, reviewHistory, withdrawBrief } from "#workflows/review";
import { listPressRoom } from "#db/versions";
import type { ReadinessItem } from "#core/editorial/readiness";
import { publishVersion, rescheduleRelease } from "#workflows/publish";
import { briefReadiness } from "#workflows/readiness";
import { draftChanges } from "#workflows/snapshot";
import { localeOf } from "#core/languages/locales";
import type { Database } from "#db/client";
import { sendError } from "../http/errors";

import { askEditors } from "#workflows/press";

/** The HTTP status and message key for each reason a step is refused. */
const refusals = {
  "not-found": [404, "errors.notFound"],
  "not-ready": [409, "errors.publish.notReady"],
  warnings: [409, "errors.review.warnings"],
  "not-approved": [409, "errors.publish.notApproved"],
  withdrawn: [409, "errors.withdrawn"],
  "note-required": [400, "errors.publish.noteRequired"],
  "wrong-status": [409, "errors.review.wrongStatus"],
  "own-submission": [403, "errors.review.ownSubmission"],
  "comment-required": [400, "errors.review.commentRequired"],
  "not-published": [409, "errors.withdrawal.notPublished"],
  released: [409, "errors.publish.released"],
  past: [400, "errors.publish.pastRelease"],
} as const;

type Refusal = keyof typeof refusals;

/** The readiness items travel as details, so the desk can list each one in words too. */
function refuse(res: Parameters<typeof sendError>[0], reason: Refusal, detail: string, field?: string, items?: ReadinessItem[]) {
  const [status, key] = refusals[reason];
  // The checklist's items are worded by sendError, in the caller's language.
  sendError(res, status, { key, message: `${detail.charAt(0).toUpperCase()}${detail.slice(1)}.`, details: items ?? (field && status === 400 ? [{ field, message: detail }] : undefined) });
}

export function versionRoutes(db: Database, mail: (req: AddressedRequest) => MailContext): Router {
  const router = Router();

  handle(router, "POST /api/briefs/:id/reviews", async (req, res) => {
    const step = req.body;
    if ((step.decision === "approved" || step.decision === "returned") && !req.user!.roles.includes("editor")) {
      return sendError(res, 403, { key: "errors.roleRequired", message: "Returning or approving a brief needs the role editor.", details: { required: ["editor"] } });
    }
    const outcome = await reviewBrief(db, req.params.id, step, req.user!.id);
    if (!outcome.ok) return refuse(res, outcome.reason, outcome.detail, "comment", "items" in outcome ? outcome.items : undefined);
    res.status(201).json({ decision: outcome.decision, status: outcome.status });
  });

  handle(router, "GET /api/briefs/:id/readiness", async (req, res) => {
    const readiness = await briefReadiness(db, req.params.id);
    if (!readiness) return sendError(res, 404, { key: "errors.notFound", message: "There is no such brief." });
    res.json(readiness);
  });

  handle(router, "GET /api/briefs/:id/changes", async (req, res) => {
    const changes = await draftChanges(db, req.params.id, localeOf(req.user!.locale));
    if (changes === undefined) return sendError(res, 404, { key: "errors.notFound", message: "There is no such brief." });
    res.json({ changes });
  });

  handle(router, "GET /api/briefs/:id/reviews", async (req, res) => {
    res.json(await reviewHistory(db, req.params.id));
  });

  handle(router, "POST /api/briefs/:id/versions", async (req, res) => {
    const body = req.body;
    const outcome = await publishVersion(db, req.params.id, { releaseAt: body.releaseAt ? new Date(body.releaseAt) : undefined, note: body.note }, req.user!.id, mail(req));
    if (outcome.ok) return res.status(201).json({ version: outcome.version, url: outcome.url });
    const detail = outcome.reason === "not-found" ? outcome.detail : `the brief cannot be published yet: ${outcome.detail}`;
    refuse(res, outcome.reason, detail, "note", outcome.items);
  });

  handle(router, "PUT /api/briefs/:id/versions/:number/release", async (req, res) => {
    const number = versionNumberOf(req.params.number);
    if (number === null) return sendError(res, 404, { key: "errors.notFound", message: "There is no such version." });
    const outcome = await rescheduleRelease(db, req.params.id, number, new Date(req.body.releaseAt), req.user!.id, mail(req));
    if (!outcome.ok) return refuse(res, outcome.reason, outcome.detail, "releaseAt");
    res.json({ releaseAt: outcome.releaseAt });
  });

  handle(router, "POST /api/briefs/:id/withdrawal", async (req, res) => {
    const outcome = await withdrawBrief(db, req.params.id, req.body.reason, req.user!.id);
    if (!outcome.ok) return refuse(res, outcome.reason, outcome.detail);
    res.json({ status: "withdrawn" });
  });

  // A reporter's question to the editors, by e-mail through the queue.
  handle(router, "POST /api/press-enquiries", async (req, res) => {
    await askEditors(mail(req), req.user!, req.body);
    res.status(201).json({ sent: true });
  });

  // The press room: embargoed versions and the latest releases, for reporters and editors.
  handle(router, "GET /api/press-room", async (_req, res) => {
    res.json({ versions: await listPressRoom(db) });
  });

  return router;
}
