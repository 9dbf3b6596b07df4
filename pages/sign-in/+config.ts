import type { Config } from "vike/types";

export default { title: "Sign in · Fairweigh" } satisfies Config;
