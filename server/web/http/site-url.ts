import type { Request } from "express";

/** The address readers use: the configured one, or the one this request came to. */
export function siteUrl(req: Request, configured: string | undefined): string {
  return (configured ?? `${req.protocol}://${req.get("host")}`).replace(/\/$/, "");
}
