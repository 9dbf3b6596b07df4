import type { Request } from "express";

/** What the site's address is read from: any request, whatever its route parses. */
export type AddressedRequest = Pick<Request, "protocol" | "get">;

/** The address readers use: the configured one, or the one this request came to. */
export function siteUrl(req: AddressedRequest, configured: string | undefined): string {
  return (configured ?? `${req.protocol}://${req.get("host")}`).replace(/\/$/, "");
}
