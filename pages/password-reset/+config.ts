import type { Config } from "vike/types";

export default { title: "Reset your password · Fairweigh" } satisfies Config;
