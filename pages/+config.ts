import type { Config } from "vike/types";
import vikeReact from "vike-react/config";

export default {
  extends: [vikeReact],
  title: "Fairweigh",
  description: "Network meta-analyses published so that readers can see what the evidence supports.",
  lang: "en",
  favicon: "/favicon.svg",
  passToClient: ["csrfToken"],
} satisfies Config;
