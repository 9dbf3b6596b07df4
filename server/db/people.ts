// People and their roles: the only place that reads or writes the people tables.
import { and, eq, inArray, isNotNull, isNull, sql } from "drizzle-orm";
import { transactionLock, type Database, type Executor as Transaction } from "./client";
import { people, personRoles, sessions } from "./schema";
import { recordAudit } from "./audit";
import { hashPassword } from "#core/access/passwords";
import type { Role } from "#core/access/roles";

type Executor = Pick<Database, "select" | "insert" | "update" | "delete" | "query">;

/** A person as the session and the desk know them. */
export interface Person {
  id: string;
  email: string;
  displayName: string;
  roles: Role[];
  /** The language of their e-mails. */
  locale: string;
  /** For translators: the locales they may translate into. */
  translationLocales: string[];
  /** The IANA time zone of times in their e-mails. */
  timeZone: string;
  /** For the press: the topic slugs that alert them; empty for all. */
  alertTopics: string[];
}

/** A person as administrators see them: also whether they are active and have accepted the invitation. */
export interface PersonRecord extends Person {
  active: boolean;
  passwordSet: boolean;
  createdAt: string;
}

export function normaliseEmail(email: string): string {
  return email.trim().toLowerCase();
}

/** The person behind a session: null once deactivated, so that their sessions end at once. */
export async function findPersonById(db: Executor, id: string): Promise<Person | null> {
  const row = await db.query.people.findFirst({ where: and(eq(people.id, id), isNull(people.deactivatedAt)) });
  return row ? withRoles(db, row) : null;
}

/** The person and their password hash, for sign-in only; nobody for a deactivated account or one without a password yet. */
export async function findCredentials(db: Database, email: string) {
  const row = await db.query.people.findFirst({ where: and(eq(people.email, normaliseEmail(email)), isNull(people.deactivatedAt)) });
  return row?.passwordHash ? { person: await withRoles(db, row), passwordHash: row.passwordHash } : null;
}

/** An active person by e-mail, for a password reset. */
export async function findActiveByEmail(db: Executor, email: string): Promise<Person | null> {
  const row = await db.query.people.findFirst({ where: and(eq(people.email, normaliseEmail(email)), isNull(people.deactivatedAt)) });
  return row ? withRoles(db, row) : null;
}

export async function listPeople(db: Executor): Promise<PersonRecord[]> {
  return peopleRecords(db);
}

/** One person as administrators see them: reads that person's row and roles only. */
export async function findPersonRecord(db: Executor, id: string): Promise<PersonRecord | null> {
  return (await peopleRecords(db, id))[0] ?? null;
}

async function peopleRecords(db: Executor, id?: string): Promise<PersonRecord[]> {
  const rows = await db.select().from(people).where(id ? eq(people.id, id) : undefined).orderBy(people.email);
  const roleRows = await db.select().from(personRoles).where(id ? eq(personRoles.personId, id) : undefined);
  return rows.map((row) => ({
    ...personOf(row, roleRows.filter((r) => r.personId === row.id).map((r) => r.role)),
    active: row.deactivatedAt === null,
    passwordSet: row.passwordHash !== null,
    createdAt: row.createdAt.toISOString(),
  }));
}

/** Creates a person with roles, or returns the existing one with that e-mail unchanged (the demo seed). */
export async function ensurePerson(
  db: Database,
  input: { email: string; displayName: string; password: string; roles: Role[]; translationLocales?: string[] },
  actorId: string | null,
): Promise<Person> {
  const email = normaliseEmail(input.email);
  const existing = await db.query.people.findFirst({ where: eq(people.email, email) });
  if (existing) return withRoles(db, existing);
  const passwordHash = await hashPassword(input.password);
  const person = await db.transaction((tx) => insertPerson(tx, { email, displayName: input.displayName, passwordHash, roles: input.roles, translationLocales: input.translationLocales ?? [], locale: "en" }, actorId));
  if (!person) throw new Error(`${email} was created by someone else at the same moment`);
  return person;
}

/** A new person; `passwordHash` null for an invitation. Null when the e-mail is taken. */
export async function insertPerson(
  tx: Executor,
  input: { email: string; displayName: string; passwordHash: string | null; roles: Role[]; translationLocales: string[]; locale: string },
  actorId: string | null,
): Promise<Person | null> {
  const email = normaliseEmail(input.email);
  const [row] = await tx
    .insert(people)
    .values({ email, displayName: input.displayName, passwordHash: input.passwordHash, translationLocales: input.translationLocales, locale: input.locale })
    .onConflictDoNothing({ target: people.email })
    .returning();
  if (!row) return null;
  if (input.roles.length > 0) await tx.insert(personRoles).values(input.roles.map((role) => ({ personId: row.id, role })));
  const person = personOf(row, input.roles);
  await recordAudit(tx, { actorId, action: "create", entity: "person", entityId: row.id, before: null, after: person });
  return person;
}

/** Changes roles, locales or whether the person is active; deactivation ends their sessions in the same transaction. */
export async function updatePerson(
  tx: Executor,
  id: string,
  changes: { roles?: Role[]; translationLocales?: string[]; locale?: string; displayName?: string; timeZone?: string; alertTopics?: string[]; active?: boolean },
  actorId: string,
): Promise<Person | null> {
  const before = await tx.query.people.findFirst({ where: eq(people.id, id) });
  if (!before) return null;
  const beforePerson = await withRoles(tx, before);
  const { roles, active, ...columns } = changes;
  const deactivatedAt = active === undefined ? undefined : active ? null : (before.deactivatedAt ?? new Date());
  if (Object.keys(columns).length > 0 || deactivatedAt !== undefined) {
    await tx.update(people).set({ ...columns, ...(deactivatedAt !== undefined ? { deactivatedAt } : {}) }).where(eq(people.id, id));
  }
  if (roles) {
    await tx.delete(personRoles).where(eq(personRoles.personId, id));
    if (roles.length > 0) await tx.insert(personRoles).values(roles.map((role) => ({ personId: id, role })));
  }
  if (active === false) await endSessions(tx, id);
  const row = (await tx.query.people.findFirst({ where: eq(people.id, id) }))!;
  const after = { ...(await withRoles(tx, row)), active: row.deactivatedAt === null };
  await recordAudit(tx, { actorId, action: "update", entity: "person", entityId: id, before: { ...beforePerson, active: before.deactivatedAt === null }, after });
  return withRoles(tx, row);
}

/** Sets a password (an accepted invitation, a reset, or the person's own change). */
export async function setPasswordHash(tx: Executor, id: string, passwordHash: string, actorId: string, action: string): Promise<void> {
  await tx.update(people).set({ passwordHash }).where(eq(people.id, id));
  await recordAudit(tx, { actorId, action, entity: "person", entityId: id, before: null, after: null });
}

export async function passwordHashOf(db: Executor, id: string): Promise<string | null> {
  const row = await db.query.people.findFirst({ where: eq(people.id, id) });
  return row?.passwordHash ?? null;
}

/** Ends every session of the person, except `keep` (their current one, after a change of their own password). */
export async function endSessions(tx: Executor, personId: string, keep?: string): Promise<void> {
  const mine = sql`${sessions.sess}::jsonb -> 'passport' ->> 'user' = ${personId}`;
  await tx.delete(sessions).where(keep ? and(mine, sql`${sessions.sid} <> ${keep}`) : mine);
}

/** The active people holding a role: the recipients of alerts. */
export async function activePeopleWithRole(db: Executor, role: Role): Promise<Person[]> {
  const rows = await db
    .select({ person: people })
    .from(people)
    .innerJoin(personRoles, eq(personRoles.personId, people.id))
    .where(and(eq(personRoles.role, role), isNull(people.deactivatedAt), isNotNull(people.passwordHash)));
  // Everyone's roles in one query, not one query a person.
  const ids = rows.map(({ person }) => person.id);
  const roleRows = ids.length > 0 ? await db.select().from(personRoles).where(inArray(personRoles.personId, ids)) : [];
  return rows.map(({ person }) => personOf(person, roleRows.filter((r) => r.personId === person.id).map((r) => r.role)));
}

/**
 * Administrators who can act: not deactivated, and able to sign in (an invitation never accepted has
 * no password yet, so it cannot stand in for the last administrator).
 */
export async function activeAdminCount(db: Executor): Promise<number> {
  const [row] = await db
    .select({ count: sql<number>`count(*)::int` })
    .from(personRoles)
    .innerJoin(people, eq(people.id, personRoles.personId))
    .where(and(eq(personRoles.role, "admin"), isNull(people.deactivatedAt), isNotNull(people.passwordHash)));
  return row?.count ?? 0;
}

/**
 * Changes to people take turns for the rest of the transaction: two administrators demoting each other
 * at once would each count the other and leave none. The lock ends with the transaction.
 */
export async function lockAdministrators(tx: Transaction): Promise<void> {
  await transactionLock(tx, "administrators");
}

function personOf(row: typeof people.$inferSelect, roles: Role[]): Person {
  return { id: row.id, email: row.email, displayName: row.displayName, roles: [...roles].sort(), locale: row.locale, translationLocales: row.translationLocales, timeZone: row.timeZone, alertTopics: row.alertTopics };
}

async function withRoles(db: Executor, row: typeof people.$inferSelect): Promise<Person> {
  const roles = await db.select({ role: personRoles.role }).from(personRoles).where(eq(personRoles.personId, row.id));
  return personOf(row, roles.map((r) => r.role));
}
