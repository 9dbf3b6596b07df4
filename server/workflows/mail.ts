// Sending e-mail: a message and the job that delivers it are stored in the transaction of the change
// that asks for it (state "queued"; a transactional outbox, decision 0036), then the job delivers it
// over SMTP with nodemailer, retrying with back-off; every attempt is written to the message
// (attempts, last error), and the last failed one marks it "failed".
import nodemailer from "nodemailer";
import type { Message } from "#core/languages/mail";
import type { Database, Executor } from "#db/client";
import { findMessage, insertMessage, markAttemptFailed, markSent, unqueuedMessageIds } from "#db/messages";
import type { Queue } from "./queue";

/** What a workflow that sends e-mail needs: the database, the queue (null where none runs) and the site's address for links. */
export interface MailContext {
  db: Database;
  queue: Queue | null;
  siteUrl: string;
}

const mailJob = "mail";
export const senderAddress = "Fairweigh <no-reply@fairweigh.example>";

/**
 * Stores messages with their delivery jobs in the caller's transaction: they go out if, and only if,
 * it commits. Without a queue (a test app without mail) they stay queued until a server with one starts.
 */
export async function queueMail(tx: Executor, queue: Queue | null, messages: Message[]): Promise<void> {
  for (const message of messages) {
    const id = await insertMessage(tx, message);
    await queue?.send(mailJob, { messageId: id }, { singletonKey: id, in: tx });
  }
}

/** Starts delivering: the worker, and the messages stored where no queue ran (they have no job yet). */
export async function startMailWorker(queue: Queue, db: Database, smtpUrl: string): Promise<void> {
  const transport = nodemailer.createTransport(smtpUrl);
  await queue.work<{ messageId: string }>(mailJob, async ({ data, retryCount, retryLimit }) => {
    const message = await findMessage(db, data.messageId);
    if (!message || message.state !== "queued") return;
    try {
      const { "Reply-To": replyTo, ...headers } = message.headers;
      await transport.sendMail({ from: senderAddress, to: message.recipient, replyTo, subject: message.subject, text: message.text, html: message.html, headers });
    } catch (error) {
      await markAttemptFailed(db, message.id, error instanceof Error ? error.message : String(error), retryCount >= retryLimit);
      throw error;
    }
    await markSent(db, message.id);
  });
  for (const id of await unqueuedMessageIds(db, mailJob)) await queue.send(mailJob, { messageId: id }, { singletonKey: id });
}
