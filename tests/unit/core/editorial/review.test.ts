// The rules of review (server/core/editorial/review.ts): someone submits the draft; an editor other
// than the submitter returns it with a comment or approves it; whoever submitted may recall it.
import { describe, expect, it } from "vitest";
import { refuseReviewStep, statusAfterReview, type ReviewSituation } from "#core/editorial/review";

const draft: ReviewSituation = { status: "draft", withdrawn: false, latest: null, submitterId: null, checksum: "c1" };
const submitted: ReviewSituation = { status: "in_review", withdrawn: false, latest: { decision: "submitted", contentSha256: "c1" }, submitterId: "ana", checksum: "c1" };
const approved: ReviewSituation = { ...submitted, latest: { decision: "approved", contentSha256: "c1" } };

describe("a review step", () => {
  it("submits a draft, and not one already in review", () => {
    expect(refuseReviewStep(draft, { decision: "submitted", comment: null }, "ana")).toBeNull();
    expect(refuseReviewStep(submitted, { decision: "submitted", comment: null }, "ana")).toEqual({ reason: "wrong-status", detail: "the brief is already in review" });
  });

  it("lets another editor approve, never the submitter (four eyes)", () => {
    expect(refuseReviewStep(submitted, { decision: "approved", comment: null }, "eve")).toBeNull();
    expect(refuseReviewStep(submitted, { decision: "approved", comment: null }, "ana")).toEqual({ reason: "own-submission", detail: "another editor reviews what you submitted" });
  });

  it("returns a draft only with a comment saying what needs to change", () => {
    expect(refuseReviewStep(submitted, { decision: "returned", comment: null }, "eve")).toEqual({ reason: "comment-required", detail: "say what needs to change" });
    expect(refuseReviewStep(submitted, { decision: "returned", comment: "Name the reference treatment." }, "eve")).toBeNull();
  });

  it("lets only the submitter recall a submission still awaiting a decision", () => {
    expect(refuseReviewStep(submitted, { decision: "recalled", comment: null }, "ana")).toBeNull();
    expect(refuseReviewStep(submitted, { decision: "recalled", comment: null }, "eve")?.detail).toBe("only whoever submitted the draft can recall it");
    expect(refuseReviewStep(approved, { decision: "recalled", comment: null }, "ana")?.detail).toBe("only a submission awaiting a decision can be recalled");
  });

  it("asks for a new submission once the draft changed after its approval", () => {
    const changed = { ...approved, checksum: "c2" };
    expect(refuseReviewStep(changed, { decision: "approved", comment: null }, "eve")?.detail).toBe("the draft changed since its approval: it needs to be submitted again");
    expect(refuseReviewStep(changed, { decision: "submitted", comment: null }, "ana")).toBeNull();
    expect(refuseReviewStep(approved, { decision: "submitted", comment: null }, "ana")?.detail).toBe("the brief is approved as it stands");
  });

  it("is refused for a withdrawn brief", () => {
    expect(refuseReviewStep({ ...draft, withdrawn: true }, { decision: "submitted", comment: null }, "ana")).toEqual({ reason: "withdrawn", detail: "the brief has been withdrawn" });
  });

  it("leaves the brief in draft after a return or a recall, in review otherwise", () => {
    expect([statusAfterReview("returned"), statusAfterReview("recalled"), statusAfterReview("submitted"), statusAfterReview("approved")]).toEqual(["draft", "draft", "in_review", "in_review"]);
  });
});
