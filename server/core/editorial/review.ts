// The rules of review before publishing (PRODUCT.md: draft → in review → published), pure: someone
// submits the draft; an editor other than the submitter returns it with comments or approves it.
// An approval holds the checksum of the content it approved (docs/decisions/0009-review-and-withdrawal.md).
import type { BriefStatus, ReviewDecision } from "./status";

export type ReviewRefusal = { reason: "wrong-status" | "own-submission" | "comment-required" | "withdrawn"; detail: string };

export interface ReviewSituation {
  status: BriefStatus;
  withdrawn: boolean;
  /** The latest review step of the brief, if any. */
  latest: { decision: ReviewDecision; contentSha256: string } | null;
  /** Who made the latest submission, if any. */
  submitterId: string | null;
  /** The checksum of the draft as it stands. */
  checksum: string;
}

/** Why this step may not be taken now, or null when it may. */
export function refuseReviewStep(situation: ReviewSituation, step: { decision: ReviewDecision; comment: string | null }, actorId: string): ReviewRefusal | null {
  const { status, latest, checksum } = situation;
  if (situation.withdrawn) return { reason: "withdrawn", detail: "the brief has been withdrawn" };
  const inReview = status === "in_review";
  const approvedAsIs = inReview && latest?.decision === "approved" && latest.contentSha256 === checksum;
  if (step.decision === "submitted") {
    // A draft changed after its approval goes back through review: it may be submitted again.
    if (inReview && latest?.decision !== "approved") return { reason: "wrong-status", detail: "the brief is already in review" };
    if (approvedAsIs) return { reason: "wrong-status", detail: "the brief is approved as it stands" };
    return null;
  }
  if (!inReview) return { reason: "wrong-status", detail: "the brief is not in review" };
  if (step.decision === "recalled") {
    // One person is never stuck with their own submission: they take it back while it awaits a decision.
    if (latest?.decision !== "submitted") return { reason: "wrong-status", detail: "only a submission awaiting a decision can be recalled" };
    return situation.submitterId === actorId ? null : { reason: "wrong-status", detail: "only whoever submitted the draft can recall it" };
  }
  // An approval vouches for what was submitted: a draft changed after its approval is submitted again first.
  if (latest?.decision !== "submitted") return { reason: "wrong-status", detail: approvedAsIs ? "the brief is already approved as it stands" : "the draft changed since its approval: it needs to be submitted again" };
  // Four eyes (common editorial practice): whoever submitted the draft does not approve or return it.
  if (situation.submitterId === actorId) return { reason: "own-submission", detail: "another editor reviews what you submitted" };
  if (step.decision === "returned" && !step.comment) return { reason: "comment-required", detail: "say what needs to change" };
  return null;
}

/** The status a brief takes after a review step. */
export const statusAfterReview = (decision: ReviewDecision): BriefStatus => (decision === "returned" || decision === "recalled" ? "draft" : "in_review");
