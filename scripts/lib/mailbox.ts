// A fake SMTP server on loopback for development and tests (smtp-server + mailparser): it accepts
// every message, parses it, and keeps it, in memory and, when given a folder, as one JSON file each
// (`npm start` keeps them under .data/mail/). Nothing leaves the machine.
import { mkdirSync, writeFileSync } from "node:fs";
import type { AddressInfo } from "node:net";
import path from "node:path";
import { simpleParser } from "mailparser";
import { SMTPServer } from "smtp-server";

export interface ReceivedMail {
  to: string;
  from: string;
  subject: string;
  text: string;
  html: string;
  headers: Record<string, string>;
  receivedAt: string;
}

export interface Mailbox {
  /** smtp://127.0.0.1:<port>, for SMTP_URL. */
  url: string;
  port: number;
  messages(): ReceivedMail[];
  /** The first message to this address that `match` accepts, waiting for it up to `timeoutMs`. */
  waitFor(to: string, match?: (mail: ReceivedMail) => boolean, timeoutMs?: number): Promise<ReceivedMail>;
  stop(): Promise<void>;
}

export async function startMailbox(options: { port?: number; folder?: string } = {}): Promise<Mailbox> {
  const received: ReceivedMail[] = [];
  if (options.folder) mkdirSync(options.folder, { recursive: true });
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ["STARTTLS"],
    logger: false,
    onData(stream, _session, callback) {
      simpleParser(stream)
        .then((parsed) => {
          const to = Array.isArray(parsed.to) ? parsed.to.map((a) => a.text).join(", ") : (parsed.to?.text ?? "");
          // The header lines as sent (lower-cased names): mailparser's own map folds List-* headers together.
          const headers: Record<string, string> = {};
          for (const { key, line } of parsed.headerLines) headers[key] = line.slice(line.indexOf(":") + 1).trim();
          const mail = { to, from: parsed.from?.text ?? "", subject: parsed.subject ?? "", text: parsed.text ?? "", html: typeof parsed.html === "string" ? parsed.html : "", headers, receivedAt: new Date().toISOString() };
          received.push(mail);
          if (options.folder) writeFileSync(path.join(options.folder, `${Date.now()}-${received.length}.json`), JSON.stringify(mail, null, 2));
          callback();
        })
        .catch((error: Error) => callback(error));
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once("error", reject);
    server.listen(options.port ?? 0, "127.0.0.1", () => resolve());
  });
  const port = (server.server.address() as AddressInfo).port;
  return {
    url: `smtp://127.0.0.1:${port}`,
    port,
    messages: () => [...received],
    async waitFor(to, match = () => true, timeoutMs = 15_000) {
      const deadline = Date.now() + timeoutMs;
      for (;;) {
        const found = received.find((mail) => mail.to.includes(to) && match(mail));
        if (found) return found;
        if (Date.now() > deadline) throw new Error(`no message to ${to} within ${timeoutMs} ms (received: ${received.map((m) => `${m.to}: ${m.subject}`).join("; ") || "none"})`);
        await new Promise((resolve) => setTimeout(resolve, 100));
      }
    },
    stop: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
