// Readers' topic alerts, without an account. These routes take no CSRF token: a reader's form sits on
// shared cached pages that cannot carry a per-session token, and a mail program's one-click
// unsubscribe (RFC 8058) posts without one. Nothing here acts for a signed-in person: a forged
// subscription only sends a confirmation link (double opt-in), and the tokens authorise the rest.
import { Router, type Request, type Response } from "express";
import { localeOf, localePath } from "#core/languages/locales";
import { topicsOf } from "#core/publication/search";
import { wellFormedToken } from "#core/access/tokens";
import { confirmSubscription, unsubscribe } from "#db/subscriptions";
import { listReleasedBriefs } from "#db/versions";
import { askToSubscribe } from "#workflows/subscriptions";
import type { MailContext } from "#workflows/mail";
import { handle } from "./handle";
import type { AddressedRequest } from "../http/site-url";
import { isFormPost } from "../http/forms";
import { fieldIssues, issueList, sendError } from "../http/errors";
import { linkLimits, mailRequestLimits, type LimitStore } from "../http/security";
import { subscribeBody } from "./contract";

const done = (what: string) => `/subscriptions/done?what=${what}`;

export function subscriptionRoutes(context: (req: AddressedRequest) => MailContext, limitStore: LimitStore): Router {
  const router = Router();
  const limited = (req: Request, res: Response) => (isFormPost(req) ? res.redirect(303, done("too-many")) : sendError(res, 429, { key: "errors.account.tooMany", message: "Too many requests from here: wait ten minutes, then try again." }));

  // The same answer whether or not the address is subscribed already.
  handle(router, "POST /api/subscriptions", ...mailRequestLimits(limitStore, "subscriptions", limited), async (req, res) => {
    const parsed = subscribeBody.safeParse(req.body ?? {});
    const topics = parsed.success ? topicsOf(await listReleasedBriefs(context(req).db)) : [];
    const topic = parsed.success ? topics.find((t) => t.name === parsed.data.topic || t.slug === parsed.data.topic) : undefined;
    if (!parsed.success || !topic) {
      if (isFormPost(req)) return res.redirect(303, done("invalid"));
      const details = parsed.success ? [{ field: "topic", message: "no released brief has this topic" }] : fieldIssues(parsed.error);
      return sendError(res, 400, { key: "errors.invalidRequest", message: `Send an e-mail address and the topic of a released brief: ${issueList(details, "body")}`, details });
    }
    await askToSubscribe(context(req), { email: parsed.data.email, topic: topic.name, locale: localeOf(parsed.data.locale) });
    if (isFormPost(req)) return res.redirect(303, localePath(localeOf(parsed.data.locale), done("sent")));
    res.status(202).json({ sent: true });
  });

  // Like the account links: only links that did not work count, per client address.
  handle(router, "POST /api/subscriptions/confirm", ...linkLimits(limitStore, "subscription-confirm", limited), async (req, res) => {
    const token = req.body?.token;
    const topic = wellFormedToken(token) ? await confirmSubscription(context(req).db, token) : null;
    if (!topic) res.locals.linkRefused = true;
    if (isFormPost(req)) return res.redirect(303, done(topic ? "confirmed" : "invalid"));
    if (!topic) return sendError(res, 400, { key: "errors.subscription.invalidLink", message: "This confirmation link has been used or has expired: subscribe again.", details: [{ field: "token", message: "used or expired" }] });
    res.json({ confirmed: true });
  });

  // RFC 8058: the mail program posts "List-Unsubscribe=One-Click" to the address in the header, whose
  // query holds the token; the unsubscribe page's form sends the token in the body.
  handle(router, "POST /api/subscriptions/unsubscribe", async (req, res) => {
    const token = typeof req.query.token === "string" ? req.query.token : req.body?.token;
    if (wellFormedToken(token)) await unsubscribe(context(req).db, token);
    if (isFormPost(req) && req.body?.["List-Unsubscribe"] !== "One-Click") return res.redirect(303, done("unsubscribed"));
    res.json({ unsubscribed: true });
  });

  return router;
}
