// Role checks on the server: 401 for anonymous callers, 403 for people without any of the roles.
import type { NextFunction, Request, Response } from "express";
import { sendError } from "../http/errors";
import type { Role } from "#core/roles";

export function requireSignedIn(req: Request, res: Response, next: NextFunction): void {
  if (!req.user) {
    sendError(res, 401, { key: "errors.signInRequired", message: "Sign in to use this part of the API." });
    return;
  }
  next();
}

/** Passes when the signed-in person holds at least one of the roles. */
export function requireRole(...roles: Role[]) {
  return (req: Request, res: Response, next: NextFunction): void => {
    if (!req.user) return requireSignedIn(req, res, next);
    if (!roles.some((role) => req.user!.roles.includes(role))) {
      sendError(res, 403, {
        key: "errors.roleRequired",
        message: `This needs the role ${roles.join(" or ")}.`,
        details: { required: roles },
      });
      return;
    }
    next();
  };
}
