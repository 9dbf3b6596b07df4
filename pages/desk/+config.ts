import type { Config } from "vike/types";

// The desk is a client-rendered app: its screens come from the JSON API, not from the server's HTML.
export default { ssr: false } satisfies Config;
