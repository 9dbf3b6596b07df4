// The HTML forms that post to the API without JavaScript (sign-in, password links, alerts): such a
// request is answered with a redirect to a page, a JSON request with JSON.
import type { Request } from "express";

export const isFormPost = (req: Request) => req.is("application/x-www-form-urlencoded") === "application/x-www-form-urlencoded";
