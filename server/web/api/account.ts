// A person's own account, and the one-time links: asking for a password reset, and setting a password
// from an invitation or a reset link. The last two also serve the HTML forms of /password-reset and
// /invitation/:token, answering a form post with a redirect so that they work without JavaScript.
import { Router, type Request, type Response } from "express";

import { passwordResetUrl } from "#core/publication/urls";
import { wellFormedToken } from "#core/access/tokens";
import { changeOwnAccount, requestPasswordReset, setPasswordWithToken, type AccountContext } from "#workflows/accounts";
import { handle } from "./handle";
import type { AddressedRequest } from "../http/site-url";
import { isFormPost } from "../http/forms";
import { fieldIssues, sendError, validateBody } from "../http/errors";
import { linkLimits, mailRequestLimits, type LimitStore } from "../http/security";
import { newPasswordBody, passwordResetBody } from "./contract";

export function accountRoutes(context: (req: AddressedRequest) => AccountContext, limitStore: LimitStore): Router {
  const router = Router();
  // A form comes back to the page it was sent from (the reset form, or the link's own page).
  const formPage = (req: Request) => (/^\/(invitation|password-reset)\/[A-Za-z0-9_-]+$/.test(String(req.body?.from ?? "")) ? String(req.body.from) : passwordResetUrl());
  const limited = (req: Request, res: Response) => (isFormPost(req) ? res.redirect(303, `${formPage(req)}?error=too-many`) : sendError(res, 429, { key: "errors.account.tooMany", message: "Too many requests from here: wait ten minutes, then try again." }));

  handle(router, "PATCH /api/account", async (req, res) => {
    const outcome = await changeOwnAccount(context(req), req.user!, req.sessionID, req.body);
    if (!outcome.ok) return sendError(res, 400, { key: "errors.account.wrongPassword", message: "Your current password does not match.", details: [{ field: "currentPassword", message: "does not match" }] });
    res.json({ person: outcome.person });
  });

  // The same answer whether or not the address has an account (server/workflows/accounts.ts).
  handle(router, "POST /api/password-reset", ...mailRequestLimits(limitStore, "password-reset", limited), async (req, res) => {
    const parsed = passwordResetBody.safeParse(req.body ?? {});
    if (!parsed.success) {
      if (isFormPost(req)) return res.redirect(303, `${passwordResetUrl()}?error=missing`);
      return sendError(res, 400, { key: "errors.invalidRequest", message: "Send the e-mail address of the account.", details: fieldIssues(parsed.error) });
    }
    await requestPasswordReset(context(req), parsed.data.email);
    if (isFormPost(req)) return res.redirect(303, `${passwordResetUrl()}?sent=1`);
    res.status(202).json({ sent: true });
  });

  handle(router, "POST /api/account/password", ...linkLimits(limitStore, "account-password", limited), async (req, res) => {
    const form = isFormPost(req);
    const back = (error: string) => res.redirect(303, `${formPage(req)}?error=${error}`);
    const parsed = newPasswordBody.safeParse(req.body ?? {});
    if (!parsed.success) {
      if (form) return back("password");
      return validateBody(newPasswordBody)(req, res, () => {});
    }
    const outcome = wellFormedToken(parsed.data.token) ? await setPasswordWithToken(context(req), parsed.data.token, parsed.data.password) : { ok: false as const };
    if (!outcome.ok) {
      res.locals.linkRefused = true;
      if (form) return back("link");
      return sendError(res, 400, { key: "errors.account.invalidLink", message: "This link has been used already or has expired: ask for a new one.", details: [{ field: "token", message: "used or expired" }] });
    }
    if (form) return res.redirect(303, "/sign-in?done=password");
    res.json({ done: true });
  });

  return router;
}
