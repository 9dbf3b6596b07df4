// Sending e-mail: a message is stored with the change that asks for it (state "queued"), then a job
// of the queue delivers it over SMTP with nodemailer, retrying with back-off; every attempt is
// written to the message (attempts, last error), and the last failed one marks it "failed".
import nodemailer from "nodemailer";
import type { Database } from "#db/client";
import { findMessage, markAttemptFailed, markSent, queuedMessageIds } from "#db/messages";
import type { Queue } from "./queue";

/** What a workflow that sends e-mail needs: the database, the queue (null where none runs) and the site's address for links. */
export interface MailContext {
  db: Database;
  queue: Queue | null;
  siteUrl: string;
}

const mailJob = "mail";
export const senderAddress = "Fairweigh <no-reply@fairweigh.example>";

/** Delivers stored messages: call after the transaction that stored them has committed. */
export async function deliver(queue: Queue | null, ids: string[]): Promise<void> {
  // Without a queue (a test app without mail) the messages stay queued, as they would with the server down.
  for (const id of ids) await queue?.send(mailJob, { messageId: id }, id);
}

/** Starts delivering: the worker, and a sweep of messages stored but not yet handed to the queue (a crash in between). */
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
  await deliver(queue, await queuedMessageIds(db));
}
