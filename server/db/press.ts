// Reporters' questions to the editors.
import type { Database } from "./client";
import { pressEnquiries } from "./schema";
import { recordAudit } from "./audit";

type Executor = Pick<Database, "insert">;

export async function insertEnquiry(tx: Executor, enquiry: { personId: string; briefSlug: string | null; subject: string; body: string }): Promise<string> {
  const [row] = await tx.insert(pressEnquiries).values(enquiry).returning({ id: pressEnquiries.id });
  await recordAudit(tx, { actorId: enquiry.personId, action: "ask", entity: "press-enquiry", entityId: row!.id, before: null, after: enquiry });
  return row!.id;
}
