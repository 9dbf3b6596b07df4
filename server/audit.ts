// The audit log: one row per state change, written in the same transaction as the change.
import type { Database } from "./db/client";
import { auditLog } from "./db/schema";

type Executor = Pick<Database, "insert">;

export interface AuditEntry {
  actorId: string | null;
  action: string;
  entity: string;
  entityId: string;
  before: unknown;
  after: unknown;
}

export async function recordAudit(executor: Executor, entry: AuditEntry): Promise<void> {
  await executor.insert(auditLog).values(entry);
}
