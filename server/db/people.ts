// People and their roles: the only place that reads or writes the people tables.
import { eq } from "drizzle-orm";
import type { Database } from "./client";
import { people, personRoles } from "./schema";
import { recordAudit } from "./audit";
import { hashPassword } from "#core/passwords";
import type { Role } from "#core/roles";

export interface Person {
  id: string;
  email: string;
  displayName: string;
  roles: Role[];
}

export function normaliseEmail(email: string): string {
  return email.trim().toLowerCase();
}

export async function findPersonById(db: Database, id: string): Promise<Person | null> {
  const row = await db.query.people.findFirst({ where: eq(people.id, id) });
  return row ? withRoles(db, row) : null;
}

/** The person and their password hash, for sign-in only. */
export async function findCredentials(db: Database, email: string) {
  const row = await db.query.people.findFirst({ where: eq(people.email, normaliseEmail(email)) });
  return row ? { person: await withRoles(db, row), passwordHash: row.passwordHash } : null;
}

export async function listPeople(db: Database): Promise<Person[]> {
  const rows = await db.select().from(people).orderBy(people.email);
  const roleRows = await db.select().from(personRoles);
  return rows.map((row) => ({
    id: row.id,
    email: row.email,
    displayName: row.displayName,
    roles: roleRows.filter((r) => r.personId === row.id).map((r) => r.role).sort(),
  }));
}

/** Creates a person with roles, or returns the existing one with that e-mail unchanged. */
export async function ensurePerson(
  db: Database,
  input: { email: string; displayName: string; password: string; roles: Role[] },
  actorId: string | null,
): Promise<Person> {
  const email = normaliseEmail(input.email);
  const existing = await db.query.people.findFirst({ where: eq(people.email, email) });
  if (existing) return withRoles(db, existing);
  const passwordHash = await hashPassword(input.password);
  return db.transaction(async (tx) => {
    const [row] = await tx.insert(people).values({ email, displayName: input.displayName, passwordHash }).returning();
    if (!row) throw new Error(`inserting ${email} returned no row`);
    if (input.roles.length > 0) {
      await tx.insert(personRoles).values(input.roles.map((role) => ({ personId: row.id, role })));
    }
    const person = { id: row.id, email, displayName: row.displayName, roles: [...input.roles].sort() };
    await recordAudit(tx, { actorId, action: "create", entity: "person", entityId: row.id, before: null, after: person });
    return person;
  });
}

async function withRoles(db: Database, row: typeof people.$inferSelect): Promise<Person> {
  const roles = await db.select({ role: personRoles.role }).from(personRoles).where(eq(personRoles.personId, row.id));
  return { id: row.id, email: row.email, displayName: row.displayName, roles: roles.map((r) => r.role).sort() };
}
