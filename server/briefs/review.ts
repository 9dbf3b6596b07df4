// Review of a brief before it is published (PRODUCT.md: draft → in review → published). Someone
// submits the draft; an editor other than the submitter returns it with comments or approves it.
// An approval holds the checksum of the content it approved: publishing freezes exactly that
// content, or refuses (docs/decisions/0009-review-and-withdrawal.md).
import { and, desc, eq, gt } from "drizzle-orm";
import { recordAudit } from "../audit";
import type { Database } from "../db/client";
import { briefReviews, briefs, briefVersions, people } from "../db/schema";
import { contentChecksum, draftSnapshot } from "./snapshot";
import type { ReviewDecision } from "./status";

type Reader = Pick<Database, "select">;

export type ReviewOutcome =
  | { ok: true; decision: ReviewDecision; status: string }
  | { ok: false; reason: "not-found" | "not-ready" | "wrong-status" | "own-submission" | "comment-required" | "withdrawn"; detail: string };

/** The checksum an approval still vouches for: the latest review step, when it is an approval not yet published. */
export async function approvalOf(db: Reader, briefId: string): Promise<string | null> {
  const [latest] = await db.select().from(briefReviews).where(eq(briefReviews.briefId, briefId)).orderBy(desc(briefReviews.createdAt)).limit(1);
  if (latest?.decision !== "approved") return null;
  const [publishedSince] = await db
    .select({ id: briefVersions.id })
    .from(briefVersions)
    .where(and(eq(briefVersions.briefId, briefId), gt(briefVersions.createdAt, latest.createdAt)))
    .limit(1);
  return publishedSince ? null : latest.contentSha256;
}

export async function reviewBrief(db: Database, briefId: string, step: { decision: ReviewDecision; comment?: string }, actorId: string): Promise<ReviewOutcome> {
  const draft = await draftSnapshot(db, briefId);
  if (!draft.ok) return draft;
  const comment = step.comment?.trim() || null;
  return db.transaction(async (tx) => {
    const [brief] = await tx.select().from(briefs).where(eq(briefs.id, briefId)).for("update");
    if (brief!.withdrawnAt) return { ok: false, reason: "withdrawn", detail: "the brief has been withdrawn" };
    const [latest] = await tx.select().from(briefReviews).where(eq(briefReviews.briefId, briefId)).orderBy(desc(briefReviews.createdAt)).limit(1);
    const inReview = brief!.status === "in_review";
    const checksum = contentChecksum(draft.snapshot);
    const approvedAsIs = inReview && latest?.decision === "approved" && latest.contentSha256 === checksum;
    // A draft changed after its approval goes back through review: it may be submitted again.
    if (step.decision === "submitted" && inReview && latest?.decision !== "approved") return { ok: false, reason: "wrong-status", detail: "the brief is already in review" };
    if (step.decision === "submitted" && approvedAsIs) return { ok: false, reason: "wrong-status", detail: "the brief is approved as it stands" };
    if (step.decision !== "submitted") {
      if (!inReview) return { ok: false, reason: "wrong-status", detail: "the brief is not in review" };
      // Four eyes (common editorial practice): whoever submitted the draft does not approve or return it.
      const [submission] = await tx
        .select({ actorId: briefReviews.actorId })
        .from(briefReviews)
        .where(and(eq(briefReviews.briefId, briefId), eq(briefReviews.decision, "submitted")))
        .orderBy(desc(briefReviews.createdAt))
        .limit(1);
      if (submission?.actorId === actorId) return { ok: false, reason: "own-submission", detail: "another editor reviews what you submitted" };
      if (step.decision === "returned" && !comment) return { ok: false, reason: "comment-required", detail: "say what needs to change" };
      if (step.decision === "approved" && approvedAsIs) return { ok: false, reason: "wrong-status", detail: "the brief is already approved as it stands" };
    }
    const status = step.decision === "returned" ? "draft" : "in_review";
    await tx.insert(briefReviews).values({ briefId, decision: step.decision, comment, contentSha256: checksum, actorId });
    await tx.update(briefs).set({ status, rowVersion: brief!.rowVersion + 1, updatedAt: new Date() }).where(eq(briefs.id, briefId));
    await recordAudit(tx, { actorId, action: `review-${step.decision}`, entity: "brief", entityId: briefId, before: { status: brief!.status }, after: { status, comment } });
    return { ok: true, decision: step.decision, status };
  });
}

/** The review steps of a brief, newest first, and whether the latest approval still matches the draft. */
export async function reviewHistory(db: Database, briefId: string) {
  const steps = await db
    .select({
      decision: briefReviews.decision,
      comment: briefReviews.comment,
      createdAt: briefReviews.createdAt,
      actorId: briefReviews.actorId,
      actorName: people.displayName,
    })
    .from(briefReviews)
    .innerJoin(people, eq(people.id, briefReviews.actorId))
    .where(eq(briefReviews.briefId, briefId))
    .orderBy(desc(briefReviews.createdAt));
  const approval = await approvalOf(db, briefId);
  let approvalState: "none" | "current" | "stale" = "none";
  if (approval) {
    const draft = await draftSnapshot(db, briefId);
    approvalState = draft.ok && contentChecksum(draft.snapshot) === approval ? "current" : "stale";
  }
  return { steps, approval: approvalState };
}

export type WithdrawOutcome = { ok: true } | { ok: false; reason: "not-found" | "not-published" | "withdrawn"; detail: string };

/** A withdrawal keeps every version and the public page, which then gives the reason. */
export async function withdrawBrief(db: Database, briefId: string, reason: string, actorId: string): Promise<WithdrawOutcome> {
  return db.transaction(async (tx) => {
    const [brief] = await tx.select().from(briefs).where(eq(briefs.id, briefId)).for("update");
    if (!brief) return { ok: false, reason: "not-found", detail: "there is no such brief" };
    if (brief.withdrawnAt) return { ok: false, reason: "withdrawn", detail: "the brief is already withdrawn" };
    const [version] = await tx.select({ id: briefVersions.id }).from(briefVersions).where(eq(briefVersions.briefId, briefId)).limit(1);
    if (!version) return { ok: false, reason: "not-published", detail: "only a published brief can be withdrawn; a draft simply stays unpublished" };
    const withdrawnAt = new Date();
    await tx.update(briefs).set({ status: "withdrawn", withdrawnAt, withdrawalReason: reason, rowVersion: brief.rowVersion + 1, updatedAt: withdrawnAt }).where(eq(briefs.id, briefId));
    await recordAudit(tx, { actorId, action: "withdraw", entity: "brief", entityId: briefId, before: { status: brief.status }, after: { status: "withdrawn", reason } });
    return { ok: true };
  });
}
