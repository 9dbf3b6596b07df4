// GET /api/dev/mail: the messages the fake SMTP server kept (`npm run dev` keeps them in .data/mail/),
// newest first, for the desk's /desk/dev/mail page. Development only: in production, and wherever no
// mail folder is set, it answers 404, so no message body is ever served by a real site.
import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { Router } from "express";
import { handle } from "./handle";
import { sendError } from "../http/errors";

export function devRoutes(mailFolder: string | null): Router {
  const router = Router();
  handle(router, "GET /api/dev/mail", (_req, res) => {
    if (!mailFolder) return sendError(res, 404, { key: "errors.notFound", message: "The development mailbox exists only in development (npm run dev)." });
    let files: string[] = [];
    try {
      files = readdirSync(mailFolder).filter((name) => name.endsWith(".json"));
    } catch {
      // No message yet: no folder.
    }
    const newest = files.sort((a, b) => Number.parseInt(b, 10) - Number.parseInt(a, 10)).slice(0, 50);
    res.json({ messages: newest.map((name) => JSON.parse(readFileSync(path.join(mailFolder, name), "utf8")) as object) });
  });
  return router;
}
