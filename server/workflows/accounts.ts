// People's accounts: invitations, password resets through one-time links, changes by administrators
// and by the person. Each change, its e-mail and the job that delivers it are stored in one
// transaction (server/workflows/mail.ts).
import { hashPassword, verifyPassword } from "#core/access/passwords";
import { invitationMessage, passwordResetMessage } from "#core/languages/mail";
import type { Role } from "#core/access/roles";
import { invitationUrl, passwordResetUrl } from "#core/publication/urls";
import { activeAdminCount, lockAdministrators, endSessions, findActiveByEmail, findPersonRecord, insertPerson, passwordHashOf, setPasswordHash, updatePerson, type Person } from "#db/people";
import { consumeToken, issueToken } from "#db/tokens";
import type { Executor } from "#db/client";
import { queueMail, type MailContext } from "./mail";
import type { Queue } from "./queue";

export type AccountContext = MailContext;

const passwordResetJob = "password-reset";

/** A new invitation link for the person (the earlier one stops working) and its e-mail, stored in the caller's transaction. */
async function storeInvitation(ctx: AccountContext, tx: Executor, person: Person, inviter: Person): Promise<void> {
  const { token, expiresAt } = await issueToken(tx, person.id, "invitation");
  const message = invitationMessage({ recipient: person.email, name: person.displayName, inviter: inviter.displayName, roles: person.roles, link: ctx.siteUrl + invitationUrl(token), expires: expiresAt, locale: person.locale });
  await queueMail(tx, ctx.queue, [message]);
}

export async function invitePerson(
  ctx: AccountContext,
  input: { email: string; displayName: string; roles: Role[]; translationLocales: string[]; locale: string },
  inviter: Person,
) {
  const outcome = await ctx.db.transaction(async (tx) => {
    const person = await insertPerson(tx, { ...input, passwordHash: null }, inviter.id);
    if (!person) return null;
    await storeInvitation(ctx, tx, person, inviter);
    return person;
  });
  if (!outcome) return { ok: false as const, reason: "taken" as const };
  return { ok: true as const, person: outcome };
}

/** A new invitation link (the earlier one stops working), while the person has not yet set a password. */
export async function resendInvitation(ctx: AccountContext, personId: string, inviter: Person) {
  const record = await findPersonRecord(ctx.db, personId);
  if (!record) return { ok: false as const, reason: "not-found" as const };
  if (record.passwordSet) return { ok: false as const, reason: "accepted" as const };
  await ctx.db.transaction((tx) => storeInvitation(ctx, tx, record, inviter));
  return { ok: true as const };
}

/**
 * Asks for a reset link. The request only queues a job with the address, whether or not it has an
 * account: the answer, its status and its time are the same for both, so nobody learns who has one.
 */
export async function requestPasswordReset(ctx: AccountContext, email: string): Promise<void> {
  if (ctx.queue) await ctx.queue.send(passwordResetJob, { email });
  else await sendPasswordReset(ctx, email);
}

/** The queue's side of a reset request: a link for an active account, nothing for an unknown address. */
export async function sendPasswordReset(ctx: AccountContext, email: string): Promise<void> {
  const person = await findActiveByEmail(ctx.db, email);
  if (!person) return;
  await ctx.db.transaction(async (tx) => {
    const { token, expiresAt } = await issueToken(tx, person.id, "password-reset");
    await queueMail(tx, ctx.queue, [passwordResetMessage({ recipient: person.email, name: person.displayName, link: ctx.siteUrl + passwordResetUrl(token), expires: expiresAt, locale: person.locale })]);
  });
}

export async function startAccountWorker(ctx: AccountContext & { queue: Queue }): Promise<void> {
  await ctx.queue.work<{ email: string }>(passwordResetJob, ({ data }) => sendPasswordReset(ctx, data.email));
}

/** Sets the password from an invitation or reset link, once; every session of the person ends. */
export async function setPasswordWithToken(ctx: AccountContext, token: string, password: string) {
  const passwordHash = await hashPassword(password);
  return ctx.db.transaction(async (tx) => {
    const used = await consumeToken(tx, token);
    if (!used) return { ok: false as const, reason: "invalid-link" as const };
    await setPasswordHash(tx, used.personId, passwordHash, used.personId, used.purpose === "invitation" ? "accept-invitation" : "reset-password");
    await endSessions(tx, used.personId);
    return { ok: true as const, purpose: used.purpose };
  });
}

/** The person's own display name and password; a new password ends their other sessions. */
export async function changeOwnAccount(ctx: AccountContext, person: Person, sessionId: string, changes: { displayName?: string; timeZone?: string; locale?: string; alertTopics?: string[]; currentPassword?: string; newPassword?: string }) {
  if (changes.newPassword !== undefined) {
    const current = await passwordHashOf(ctx.db, person.id);
    if (!current || !(await verifyPassword(current, changes.currentPassword ?? ""))) return { ok: false as const, reason: "wrong-password" as const };
  }
  const passwordHash = changes.newPassword === undefined ? null : await hashPassword(changes.newPassword);
  const updated = await ctx.db.transaction(async (tx) => {
    const { displayName, timeZone, locale, alertTopics } = changes;
    const unchanged = displayName === undefined && timeZone === undefined && locale === undefined && alertTopics === undefined;
    const after = unchanged ? person : await updatePerson(tx, person.id, { displayName, timeZone, locale, alertTopics }, person.id);
    if (passwordHash) {
      await setPasswordHash(tx, person.id, passwordHash, person.id, "change-password");
      await endSessions(tx, person.id, sessionId);
    }
    return after;
  });
  return { ok: true as const, person: updated! };
}

/** An administrator's change: never leaves the site without an active administrator, never deactivates oneself. */
export async function changePerson(ctx: AccountContext, id: string, changes: { roles?: Role[]; translationLocales?: string[]; locale?: string; active?: boolean }, actor: Person) {
  if (id === actor.id && changes.active === false) return { ok: false as const, reason: "self" as const };
  return ctx.db.transaction(async (tx) => {
    // One change to people at a time: the count below then sees every change committed before it.
    await lockAdministrators(tx);
    const before = await findPersonRecord(tx, id);
    if (!before) return { ok: false as const, reason: "not-found" as const };
    const person = await updatePerson(tx, id, changes, actor.id);
    if (before.roles.includes("admin") && (await activeAdminCount(tx)) === 0) throw new LastAdministrator();
    return { ok: true as const, person: person! };
  }).catch((error: unknown) => {
    if (error instanceof LastAdministrator) return { ok: false as const, reason: "last-admin" as const };
    throw error;
  });
}

class LastAdministrator extends Error {}
