// Review and withdrawal of a brief: the rules of server/core/editorial/review.ts applied to the stored draft,
// each step in one transaction with its audit row (docs/decisions/0009-review-and-withdrawal.md).
import { lockBrief, setBriefState } from "#db/briefs";
import type { Database } from "#db/client";
import { approvalOf, insertReviewStep, latestReview, latestSubmitter, reviewSteps } from "#db/reviews";
import { hasVersion } from "#db/versions";
import { refuseReviewStep, statusAfterReview, type ReviewRefusal } from "#core/editorial/review";
import type { ReviewDecision } from "#core/editorial/status";
import type { ReadinessItem } from "#core/editorial/readiness";
import { briefReadiness } from "./readiness";
import { contentChecksum, draftSnapshot } from "./snapshot";

export type ReviewOutcome =
  | { ok: true; decision: ReviewDecision; status: string }
  | ({ ok: false } & (ReviewRefusal | { reason: "not-found" | "not-ready" | "warnings"; detail: string; items?: ReadinessItem[] }));

/**
 * An approval vouches for a draft that is ready (server/core/editorial/readiness.ts): every blocking item is
 * refused with the list, and the approving editor acknowledges the warnings — those about the texts'
 * claims (server/core/editorial/claims.ts) with a reason, given as the review's comment.
 */
export async function reviewBrief(db: Database, briefId: string, step: { decision: ReviewDecision; comment?: string; acknowledgeWarnings?: boolean }, actorId: string): Promise<ReviewOutcome> {
  const readiness = step.decision === "approved" ? await briefReadiness(db, briefId) : null;
  const draft = await draftSnapshot(db, briefId);
  if (!draft.ok) return draft;
  const comment = step.comment?.trim() || null;
  return db.transaction(async (tx) => {
    const brief = (await lockBrief(tx, briefId))!;
    const latest = await latestReview(tx, briefId);
    const checksum = contentChecksum(draft.snapshot);
    const situation = { status: brief.status, withdrawn: brief.withdrawnAt !== null, latest, submitterId: await latestSubmitter(tx, briefId), checksum };
    const refusal = refuseReviewStep(situation, { decision: step.decision, comment }, actorId);
    if (refusal) return { ok: false, ...refusal };
    if (readiness && readiness.blocking.length > 0) return { ok: false, reason: "not-ready", detail: "the draft is not ready to approve", items: readiness.blocking };
    if (readiness && readiness.warnings.length > 0 && !step.acknowledgeWarnings) {
      return { ok: false, reason: "warnings", detail: "acknowledge the warnings before approving", items: readiness.warnings };
    }
    // A text that says more than the findings is approved only with the editor's reason, kept with the review.
    const claims = readiness?.warnings.filter((w) => w.key.startsWith("readiness.claim.")) ?? [];
    if (claims.length > 0 && !comment) {
      return { ok: false, reason: "warnings", detail: "the texts' claims that differ from the findings need a reason in the comment", items: claims };
    }
    const status = statusAfterReview(step.decision);
    await insertReviewStep(tx, { briefId, decision: step.decision, comment, contentSha256: checksum, actorId });
    await setBriefState(tx, brief, { status }, { actorId, action: `review-${step.decision}`, after: { status, comment } });
    return { ok: true, decision: step.decision, status };
  });
}

/** The review steps of a brief, newest first, and whether the latest approval still matches the draft. */
export async function reviewHistory(db: Database, briefId: string) {
  const steps = await reviewSteps(db, briefId);
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
    const brief = await lockBrief(tx, briefId);
    if (!brief) return { ok: false, reason: "not-found", detail: "there is no such brief" };
    if (brief.withdrawnAt) return { ok: false, reason: "withdrawn", detail: "the brief is already withdrawn" };
    if (!(await hasVersion(tx, briefId))) return { ok: false, reason: "not-published", detail: "only a published brief can be withdrawn; a draft simply stays unpublished" };
    await setBriefState(tx, brief, { status: "withdrawn", withdrawnAt: new Date(), withdrawalReason: reason }, { actorId, action: "withdraw", after: { status: "withdrawn", reason } });
    return { ok: true };
  });
}
