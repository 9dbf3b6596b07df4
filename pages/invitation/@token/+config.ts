import type { Config } from "vike/types";

// The address holds a one-time secret: the site sends no Referer anywhere (helmet's no-referrer policy).
export default { title: "Your password · Fairweigh" } satisfies Config;
