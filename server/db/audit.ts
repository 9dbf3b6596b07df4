// The audit log: one row per state change, written in the same transaction as the change.
import type { Database } from "./client";
import { auditLog } from "./schema";

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
