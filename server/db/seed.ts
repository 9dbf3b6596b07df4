// Demo content for a local cluster. Only scripts/start.ts and the test set-up call this, and
// only against the cluster they manage: a server given an outside DATABASE_URL never seeds.
import type { Database } from "./client";
import { ensurePerson } from "../people";
import type { Role } from "../auth/roles";

export const demoPassword = "fairweigh-demo";

export const demoAccounts: { email: string; displayName: string; roles: Role[] }[] = [
  { email: "admin@fairweigh.example", displayName: "Demo administrator", roles: ["admin"] },
  { email: "analyst@fairweigh.example", displayName: "Demo analyst", roles: ["analyst"] },
  { email: "editor@fairweigh.example", displayName: "Demo editor", roles: ["editor"] },
  { email: "translator@fairweigh.example", displayName: "Demo translator", roles: ["translator"] },
  { email: "press@fairweigh.example", displayName: "Demo reporter", roles: ["press"] },
];

/** Idempotent: accounts that exist already are left as they are. */
export async function seedDemo(db: Database): Promise<void> {
  for (const account of demoAccounts) {
    await ensurePerson(db, { ...account, password: demoPassword }, null);
  }
}
