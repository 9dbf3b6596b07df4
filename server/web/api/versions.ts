// Review, publishing, withdrawal and reading frozen versions (docs/decisions/0007-frozen-versions.md,
// 0009-review-and-withdrawal.md).
import { Router, type Request } from "express";
import type { MailContext } from "#workflows/mail";
import type { z } from "zod";
import { versionNumberOf } from "#core/urls";
import { guard } from "../auth/require-role";
import { reviewBrief, reviewHistory, withdrawBrief } from "#workflows/review";
import { listPressRoom, listReleasedBriefs, readVersion } from "#db/versions";
import { topicsOf } from "#core/search";
import type { ReadinessItem } from "#core/readiness";
import { publishVersion, rescheduleRelease } from "#workflows/publish";
import { briefReadiness } from "#workflows/readiness";
import type { Database } from "#db/client";
import { rejectMalformedId, sendError, validateBody } from "../http/errors";
import { pressEnquiryBody, publishBody, rescheduleBody, reviewBody, withdrawalBody, type RescheduleBody } from "./contract";
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

/** The readiness items travel as details, so the desk can list each one in words. */
function refuse(res: Parameters<typeof sendError>[0], reason: Refusal, detail: string, field?: string, items?: ReadinessItem[]) {
  const [status, key] = refusals[reason];
  const sentence = detail.charAt(0).toUpperCase() + detail.slice(1);
  const listed = items?.length ? `: ${items.map((item) => `${item.key} ${JSON.stringify(item.values)}`).join("; ")}` : "";
  sendError(res, status, { key, message: `${sentence}${listed}.`, details: items ?? (field && status === 400 ? [{ field, message: detail }] : undefined) });
}

export function versionRoutes(db: Database, mail: (req: Request) => MailContext): Router {
  const router = Router();
  router.param("id", rejectMalformedId);

  router.post("/briefs/:id/reviews", guard("POST /api/briefs/:id/reviews"), validateBody(reviewBody), async (req, res) => {
    const step = req.body as z.infer<typeof reviewBody>;
    if ((step.decision === "approved" || step.decision === "returned") && !req.user!.roles.includes("editor")) {
      return sendError(res, 403, { key: "errors.roleRequired", message: "Returning or approving a brief needs the role editor.", details: { required: ["editor"] } });
    }
    const outcome = await reviewBrief(db, String(req.params.id), step, req.user!.id);
    if (!outcome.ok) return refuse(res, outcome.reason, outcome.detail, "comment", "items" in outcome ? outcome.items : undefined);
    res.status(201).json({ decision: outcome.decision, status: outcome.status });
  });

  router.get("/briefs/:id/readiness", guard("GET /api/briefs/:id/readiness"), async (req, res) => {
    const readiness = await briefReadiness(db, String(req.params.id));
    if (!readiness) return sendError(res, 404, { key: "errors.notFound", message: "There is no such brief." });
    res.json(readiness);
  });

  router.get("/briefs/:id/reviews", guard("GET /api/briefs/:id/reviews"), async (req, res) => {
    res.json(await reviewHistory(db, String(req.params.id)));
  });

  router.post("/briefs/:id/versions", guard("POST /api/briefs/:id/versions"), validateBody(publishBody), async (req, res) => {
    const body = req.body as z.infer<typeof publishBody>;
    const outcome = await publishVersion(db, String(req.params.id), { releaseAt: body.releaseAt ? new Date(body.releaseAt) : undefined, note: body.note }, req.user!.id, mail(req));
    if (outcome.ok) return res.status(201).json({ version: outcome.version, url: outcome.url });
    const detail = outcome.reason === "not-found" ? outcome.detail : `the brief cannot be published yet: ${outcome.detail}`;
    refuse(res, outcome.reason, detail, "note", outcome.items);
  });

  router.put("/briefs/:id/versions/:number/release", guard("PUT /api/briefs/:id/versions/:number/release"), validateBody(rescheduleBody), async (req, res) => {
    const number = versionNumberOf(String(req.params.number));
    if (number === null) return sendError(res, 404, { key: "errors.notFound", message: "There is no such version." });
    const outcome = await rescheduleRelease(db, String(req.params.id), number, new Date((req.body as RescheduleBody).releaseAt), req.user!.id, mail(req));
    if (!outcome.ok) return refuse(res, outcome.reason, outcome.detail, "releaseAt");
    res.json({ releaseAt: outcome.releaseAt });
  });

  router.post("/briefs/:id/withdrawal", guard("POST /api/briefs/:id/withdrawal"), validateBody(withdrawalBody), async (req, res) => {
    const outcome = await withdrawBrief(db, String(req.params.id), (req.body as z.infer<typeof withdrawalBody>).reason, req.user!.id);
    if (!outcome.ok) return refuse(res, outcome.reason, outcome.detail);
    res.json({ status: "withdrawn" });
  });

  // The topics of the released briefs (the press choose which alert them).
  router.get("/topics", guard("GET /api/topics"), async (_req, res) => {
    res.json({ topics: topicsOf(await listReleasedBriefs(db)) });
  });

  // A reporter's question to the editors, by e-mail through the queue.
  router.post("/press-enquiries", guard("POST /api/press-enquiries"), validateBody(pressEnquiryBody), async (req, res) => {
    await askEditors(mail(req), req.user!, req.body as z.infer<typeof pressEnquiryBody>);
    res.status(201).json({ sent: true });
  });

  // The press room: embargoed versions and the latest releases, for reporters and editors.
  router.get("/press-room", guard("GET /api/press-room"), async (_req, res) => {
    res.json({ versions: await listPressRoom(db) });
  });

  // Public once released; before that only for the press and editors. An embargoed version answers
  // 404 like one that does not exist, so its existence does not leak.
  router.get("/briefs/:slug/versions/:number", async (req, res) => {
    const number = versionNumberOf(String(req.params.number));
    const found = number === null ? null : await readVersion(db, String(req.params.slug), number, req.user?.roles ?? []);
    if (found === null) return sendError(res, 404, { key: "errors.notFound", message: "There is no such published version." });
    res.json(found.snapshot);
  });

  return router;
}
