// Whether the one-time link still works, checked without using it: a used or expired link says so at
// once, before anyone types a new password. Never kept by a cache (the page holds a form and a token).
import type { PageContextServer } from "vike/types";
import { wellFormedToken } from "#core/access/tokens";
import { tokenIsUsable } from "#db/tokens";

export async function data(pageContext: PageContextServer) {
  const token = String(pageContext.routeParams.token ?? "");
  return { usable: wellFormedToken(token) && (await tokenIsUsable(pageContext.db!, token)), caching: "private" as const };
}

export type Data = Awaited<ReturnType<typeof data>>;
