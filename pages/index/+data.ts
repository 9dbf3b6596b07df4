// Runs on the server only: the latest released version of each brief.
import type { PageContextServer } from "vike/types";
import { listReleasedBriefs } from "../../server/briefs/versions";

export async function data(pageContext: PageContextServer) {
  return { briefs: await listReleasedBriefs(pageContext.db!) };
}

export type Data = Awaited<ReturnType<typeof data>>;
