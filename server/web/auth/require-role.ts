// Role checks on the server, from the access table (server/core/access.ts): 401 for anonymous
// callers, 403 for people without any of the roles the route names.
import type { NextFunction, Request, Response } from "express";
import { apiAccess, type ApiRoute, type Audience } from "#core/access";
import { sendError } from "../http/errors";

function check(who: Audience) {
  return (req: Request, res: Response, next: NextFunction): void => {
    if (who === "anyone") return next();
    if (!req.user) {
      sendError(res, 401, { key: "errors.signInRequired", message: "Sign in to use this part of the API." });
      return;
    }
    if (who !== "signed-in" && !who.some((role) => req.user!.roles.includes(role))) {
      sendError(res, 403, {
        key: "errors.roleRequired",
        message: `This needs the role ${who.join(" or ")}.`,
        details: { required: who },
      });
      return;
    }
    next();
  };
}

/** The role check of an API route, as the access table states it. */
export const guard = (route: ApiRoute) => check(apiAccess[route].who);
