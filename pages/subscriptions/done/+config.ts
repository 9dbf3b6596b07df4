import type { Config } from "vike/types";

export default { title: "E-mail alerts · Fairweigh" } satisfies Config;
