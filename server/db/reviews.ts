// The review steps of briefs: reading and writing brief_reviews.
import { and, desc, eq, gt } from "drizzle-orm";
import type { ReviewDecision } from "#core/editorial/status";
import type { Executor } from "./client";
import { briefReviews, briefVersions, people } from "./schema";

export async function latestReview(db: Executor, briefId: string) {
  const [latest] = await db.select().from(briefReviews).where(eq(briefReviews.briefId, briefId)).orderBy(desc(briefReviews.createdAt)).limit(1);
  return latest ?? null;
}

/** Who made the latest submission of the brief. */
export async function latestSubmitter(db: Executor, briefId: string): Promise<string | null> {
  const [submission] = await db
    .select({ actorId: briefReviews.actorId })
    .from(briefReviews)
    .where(and(eq(briefReviews.briefId, briefId), eq(briefReviews.decision, "submitted")))
    .orderBy(desc(briefReviews.createdAt))
    .limit(1);
  return submission?.actorId ?? null;
}

/** The checksum an approval still vouches for: the latest review step, when it is an approval not yet published. */
export async function approvalOf(db: Executor, briefId: string): Promise<string | null> {
  const latest = await latestReview(db, briefId);
  if (latest?.decision !== "approved") return null;
  const [publishedSince] = await db
    .select({ id: briefVersions.id })
    .from(briefVersions)
    .where(and(eq(briefVersions.briefId, briefId), gt(briefVersions.createdAt, latest.createdAt)))
    .limit(1);
  return publishedSince ? null : latest.contentSha256;
}

export async function insertReviewStep(db: Executor, step: { briefId: string; decision: ReviewDecision; comment: string | null; contentSha256: string; actorId: string }) {
  await db.insert(briefReviews).values(step);
}

/** The review steps of a brief, newest first, with who took each. */
export async function reviewSteps(db: Executor, briefId: string) {
  return db
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
}
