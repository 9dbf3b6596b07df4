import type { Config } from "vike/types";
import vikeReact from "vike-react/config";

// Title, description, <html lang> and dir follow the page's locale: see +title.ts, +description.ts,
// +lang.ts and +htmlAttributes.ts beside this file.
export default {
  extends: [vikeReact],
  favicon: "/favicon.svg",
  passToClient: ["csrfToken"],
} satisfies Config;
